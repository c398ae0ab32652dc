import { HouseholdLoadParamsSchema, LoadUpdateSchema } from '~~/utils/schemas/logbook'

/** Record how a pending reprocessing load was run, or change a load's notes (canner and up). */
export default defineEventHandler(async (event) => {
  const { params: { id, loadId }, db, user } = await requireHouseholdRole(event, HouseholdLoadParamsSchema, 'canner')
  const body = await validBody(event, LoadUpdateSchema)
  const load = await updateLoad(db, id, loadId, body)
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'load', summary: `Recorded the run of load ${load.code}`, detail: { loadId } })
  return load
})
