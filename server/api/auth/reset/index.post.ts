import { ResetPasswordSchema } from '~~/utils/schemas/auth'

/** Choose a new password with the link's token; every other session ends and this one starts. */
export default defineEventHandler(async (event) => {
  const body = await validBody(event, ResetPasswordSchema)
  refuseCommonPassword('password', body.password)
  const user = await resetPassword(await useDB(), body.token, body.password)
  const households = await householdsOf(user.id)
  await startSession(event, user, households[0]?.id ?? null)
  return sessionAnswer(await requireSession(event))
})
