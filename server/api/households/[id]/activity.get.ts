import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { ActivityQuerySchema } from '~~/utils/schemas/members'

/** Who did what in the household, newest first, 25 to a page; for the owners. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const { page } = validQuery(event, ActivityQuerySchema)
  return activityPage(db, id, page ?? 1)
})
