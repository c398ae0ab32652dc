import { InvitationParamsSchema } from '~~/utils/schemas/members'

/** Withdraw an invitation; its link then says so. */
export default defineEventHandler(async (event) => {
  const { params, db, user } = await requireHouseholdRole(event, InvitationParamsSchema, 'owner')
  return revokeInvitation(db, params.id, user.id, params.invitationId)
})
