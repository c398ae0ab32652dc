import { TokenParamsSchema } from '~~/utils/schemas/auth'
import { AcceptInvitationSchema } from '~~/utils/schemas/members'

/** Accept an invitation; the person is signed in and working in the household that invited them. */
export default defineEventHandler(async (event) => {
  const { token } = validParams(event, TokenParamsSchema)
  const body = await validBody(event, AcceptInvitationSchema)
  return acceptInvitation(event, await useDB(), token, body)
})
