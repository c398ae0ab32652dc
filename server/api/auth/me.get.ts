export default defineEventHandler(async (event) => {
  const { user } = await requireUserSession(event, { message: 'Please sign in.' })
  return { user, households: await householdsOf(user.id) }
})
