/**
 * Every request body is read here, within its route's limit (`server/utils/bodyLimit.ts`), so no
 * route reads a body whole that it should have refused: readBody, readRawBody and
 * readMultipartFormData then take the bytes counted here.
 */
export default defineEventHandler(async (event) => {
  // Pages never read a body; and the error page's internal request copies the headers (a
  // Content-Length) without the body, which must not wait here.
  if (!event.path.startsWith('/api/')) return
  const body = readBodyWithin(event)
  // h3 takes a Buffer here (readRawBody returns it as is); its type names only web bodies.
  if (body) event._requestBody = (await body) as unknown as BodyInit
})
