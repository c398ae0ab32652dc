import { HouseholdLoadParamsSchema } from '../../../../../../utils/schemas/logbook'

/** One load with its lines, seal check, photos and reprocessing links (any member). */
export default defineEventHandler(async (event) => {
  const { id, loadId } = await getValidatedRouterParams(event, validateWith(HouseholdLoadParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'helper')
  return loadDetail(db, id, loadId)
})
