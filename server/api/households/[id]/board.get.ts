import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** The Pantry board, including jarsUsedPerMonth by product for the Batch planner (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  return pantryBoard(db, id)
})
