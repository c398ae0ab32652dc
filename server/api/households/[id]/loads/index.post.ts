import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { LoadCreateSchema } from '~~/utils/schemas/logbook'

/** Log a load as it was run, free-standing or from a saved plan's load (canner and up); its activity row is written with it. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'canner')
  const body = await validBody(event, LoadCreateSchema)
  const load = await createLoad(db, id, user.id, body)
  setResponseStatus(event, 201)
  return load
})
