import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { InviteSchema } from '~~/utils/schemas/members'

/** An owner invites a person by e-mail with a role; the link works once, for 7 days. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const body = await validBody(event, InviteSchema)
  const invitations = await invite(db, id, user, body)
  setResponseStatus(event, 201)
  return invitations
})
