import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** Undo the household's latest take-off (canner and up). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const shelf = await undoLastTakeOff(db, id)
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'shelf', summary: 'Undid the last take-off from the Shelf' })
  return shelf
})
