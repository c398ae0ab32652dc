import { HouseholdLoadParamsSchema, LoadUpdateSchema } from '~~/utils/schemas/logbook'

/**
 * Record how a pending reprocessing load was run, correct a logged load (times, pressure,
 * minutes, jars), change its notes, or confirm a load the Canning day logged (canner and up).
 */
export default defineEventHandler(async (event) => {
  const { params: { id, loadId }, db, user } = await requireHouseholdRole(event, HouseholdLoadParamsSchema, 'canner')
  const body = await validBody(event, LoadUpdateSchema)
  return updateLoad(db, id, loadId, body, user.id)
})
