import { HouseholdLoadParamsSchema } from '~~/utils/schemas/logbook'

/** Delete a load logged by mistake: stock, Shelf and plan are put back as before it (canner and up). */
export default defineEventHandler(async (event) => {
  const { params: { id, loadId }, db, user } = await requireHouseholdRole(event, HouseholdLoadParamsSchema, 'canner')
  return deleteLoad(db, id, loadId, user.id)
})
