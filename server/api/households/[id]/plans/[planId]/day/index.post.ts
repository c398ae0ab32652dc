import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/** Start the Canning day: the plan as computed now is frozen for the day (any member; starting twice changes nothing). */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db, user } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  return startDay(db, id, user.id, planId)
})
