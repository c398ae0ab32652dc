import { MemberParamsSchema } from '~~/utils/schemas/members'

/** An owner removes a member, or a member leaves; the last owner can do neither. */
export default defineEventHandler(async (event) => {
  const { params, db, user, role } = await requireHouseholdRole(event, MemberParamsSchema, 'helper')
  if (params.userId !== user.id && role !== 'owner') forbidden('Only a household owner may remove someone else.')
  await removeMember(db, params.id, user.id, params.userId)
  return { ok: true }
})
