/** 200 once migrations and seeding are done; 503 while the database is still starting. */
export default defineEventHandler((event) => {
  if (!isDatabaseReady()) {
    setResponseStatus(event, 503)
    return { status: 'starting' }
  }
  return { status: 'ok' }
})
