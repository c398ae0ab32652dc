import { HouseholdParamsSchema } from '../../../../utils/schemas/household'

/** The Pantry board, including jarsUsedPerMonth by product for the Batch planner (any member). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'helper')
  return pantryBoard(db, id)
})
