import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** Undo the household's latest take-off (canner and up). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'canner')
  return undoLastTakeOff(db, id)
})
