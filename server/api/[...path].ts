/**
 * Any other API address, whatever the method: a 404 in the error envelope rather than the page
 * renderer's (a path param holding an encoded "?" or "#" ends up here once decoded).
 */
export default defineEventHandler(() => notFound('There is no such request in this API; check the address.'))
