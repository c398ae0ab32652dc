import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { SealCheckSchema } from '~~/utils/schemas/logbook'

/** Record a load's seal check (helpers too): sealed jars to the Shelf, unsealed to the refrigerator or reprocessing. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const body = await validBody(event, SealCheckSchema)
  const load = await recordSealCheck(db, id, user.id, body)
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'seal-check', summary: `Recorded the seal check of load ${load.code}`, detail: { loadId: load.id } })
  setResponseStatus(event, 201)
  return load
})
