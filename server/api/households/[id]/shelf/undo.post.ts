import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'

/** Undo the household's latest take-off (canner and up). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'canner')
  return undoLastTakeOff(db, id)
})
