import { TokenParamsSchema } from '~~/utils/schemas/auth'

/** Whether a reset link still works, so its page can say so before a new password is typed. */
export default defineEventHandler(async (event) => {
  const { token } = validParams(event, TokenParamsSchema)
  return { status: await resetLinkStatus(await useDB(), token) }
})
