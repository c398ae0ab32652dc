import { MemberParamsSchema, MemberRoleSchema } from '~~/utils/schemas/members'

/** An owner changes a member's role; the last owner cannot be demoted. */
export default defineEventHandler(async (event) => {
  const { params, db, user } = await requireHouseholdRole(event, MemberParamsSchema, 'owner')
  const { role } = await validBody(event, MemberRoleSchema)
  return changeRole(db, params.id, user.id, params.userId, role)
})
