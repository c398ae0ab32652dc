/**
 * State-changing API requests must come from this site: a browser's Sec-Fetch-Site or Origin
 * naming another site is refused, and so are the body types a page elsewhere can send without
 * asking (form posts, text/plain). Requests without those headers (curl, scripts) are let through:
 * the session cookie, SameSite=Lax, is what they would lack.
 */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])
const BODY_TYPES = ['application/json', 'multipart/form-data', 'text/csv']

export default defineEventHandler((event) => {
  if (SAFE_METHODS.has(event.method) || !event.path.startsWith('/api/')) return
  const site = getRequestHeader(event, 'sec-fetch-site')
  if (site && site !== 'same-origin' && site !== 'none') forbidden('Requests from other sites are refused.')
  const origin = getRequestHeader(event, 'origin')
  if (origin) {
    const { trustProxy, publicUrl } = serverSettings()
    const here = getRequestURL(event, { xForwardedHost: trustProxy, xForwardedProto: trustProxy }).origin
    // An opaque origin ("null") matches neither.
    if (origin !== here && origin !== new URL(publicUrl).origin) forbidden('Requests from other sites are refused.')
  }
  const type = (getRequestHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  if (type && !BODY_TYPES.includes(type)) unsupportedBody('Send the form as JSON.')
})
