export default defineEventHandler(async (event) => {
  const user = await requireSession(event)
  return { user, households: await householdsOf(user.id) }
})
