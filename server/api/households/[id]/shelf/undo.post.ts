import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** Undo the household's latest take-off (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  return undoLastTakeOff(db, id, user.id)
})
