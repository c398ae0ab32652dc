import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/** The Canning day of a saved plan as every device shows it, with the server's clock (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  return readDay(db, id, planId)
})
