import { InvitationParamsSchema } from '~~/utils/schemas/members'

/** Send an invitation again with a new link; the old link stops working. */
export default defineEventHandler(async (event) => {
  const { params, db, user } = await requireHouseholdRole(event, InvitationParamsSchema, 'owner')
  return resendInvitation(db, params.id, user, params.invitationId)
})
