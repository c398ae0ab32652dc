import { TokenParamsSchema } from '~~/utils/schemas/auth'

/** The invitation behind a link, for its page; anyone with the link may read it. */
export default defineEventHandler(async (event) => {
  const { token } = validParams(event, TokenParamsSchema)
  return describeInvitation(event, await useDB(), token)
})
