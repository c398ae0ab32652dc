/** The server's clock (for tests and development only: a 404 unless the clock may be moved). */
export default defineEventHandler(() => {
  if (!clockAdjustable()) notFound('Not found.')
  return { now: serverNow(), offsetMs: clockOffsetMs() }
})
