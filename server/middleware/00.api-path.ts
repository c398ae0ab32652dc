/**
 * An API address whose path holds an encoded "?" or "#" (no id has one) would be decoded into a
 * query or fragment and routed to the page renderer: answer it here, in the error envelope.
 */
export default defineEventHandler((event) => {
  if (!event.path.startsWith('/api/')) return
  // The address as sent: h3 has already decoded event.path.
  const path = (event.node.req.originalUrl ?? event.node.req.url ?? '').split('?')[0]!
  if (/%3F|%23/i.test(path)) notFound('There is no such record: the address holds a "?" or "#" that no id has.')
})
