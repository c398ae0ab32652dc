/** Sign out everywhere: every session of this person ends, this one included. */
export default defineEventHandler(async (event) => {
  const { user } = await requireSession(event)
  await endSessionsOf(await useDB(), user.id)
  await endSession(event)
  return { ok: true }
})
