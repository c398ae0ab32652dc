import { HouseholdLoadParamsSchema } from '~~/utils/schemas/logbook'

/** One load with its lines, seal check, photos and reprocessing links (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id, loadId }, db } = await requireHouseholdRole(event, HouseholdLoadParamsSchema, 'helper')
  return loadDetail(db, id, loadId)
})
