import { HouseholdLoadParamsSchema, LoadUpdateSchema } from '~~/utils/schemas/logbook'

/** Record how a pending reprocessing load was run, or change a load's notes (canner and up). */
export default defineEventHandler(async (event) => {
  const { params: { id, loadId }, db } = await requireHouseholdRole(event, HouseholdLoadParamsSchema, 'canner')
  const body = await validBody(event, LoadUpdateSchema)
  return updateLoad(db, id, loadId, body)
})
