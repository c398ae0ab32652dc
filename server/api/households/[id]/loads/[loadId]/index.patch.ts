import { HouseholdLoadParamsSchema, LoadUpdateSchema } from '~~/utils/schemas/logbook'

/** Record how a pending reprocessing load was run, change a load's notes, or confirm a load the Canning day logged (canner and up). */
export default defineEventHandler(async (event) => {
  const { params: { id, loadId }, db, user } = await requireHouseholdRole(event, HouseholdLoadParamsSchema, 'canner')
  const body = await validBody(event, LoadUpdateSchema)
  const load = await updateLoad(db, id, loadId, body, user.id)
  const what = body.pressurePsi !== undefined ? `Recorded the run of load ${load.code}` : body.confirmed ? `Confirmed load ${load.code} as the Canning day logged it` : `Changed the notes of load ${load.code}`
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'load', summary: what, detail: { loadId } })
  return load
})
