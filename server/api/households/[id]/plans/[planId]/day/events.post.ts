import { DayEventSchema } from '~~/utils/schemas/day'
import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/**
 * One action on the Canning day — a load's next step, a pressure drop, a kitchen task, an undo —
 * from any member's device. 409 when it does not fit the published sequence, with why.
 */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db, user } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  const body = await validBody(event, DayEventSchema)
  return recordDayEvent(db, id, user.id, planId, body)
})
