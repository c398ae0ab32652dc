export default defineEventHandler(async (event) => {
  return sessionAnswer(await requireSession(event))
})
