import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { UndoSchema } from '~~/utils/schemas/shelf'

/** Undo the household's latest take-off, or with { batchId } that take-off while it is the latest (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const { batchId } = await validBody(event, UndoSchema)
  return undoLastTakeOff(db, id, user.id, batchId)
})
