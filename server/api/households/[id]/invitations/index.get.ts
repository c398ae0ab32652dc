import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** Invitations still waiting (open or expired), for the owners. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  return listInvitations(db, id)
})
