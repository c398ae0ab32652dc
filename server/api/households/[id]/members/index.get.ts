import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** The people in the household with their roles; every member may see who else is in it. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  return listMembers(db, id)
})
