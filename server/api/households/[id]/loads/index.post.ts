import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { LoadCreateSchema } from '../../../../../utils/schemas/logbook'

/** Log a load as it was run, free-standing or from a saved plan's load (canner and up). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(LoadCreateSchema))
  const { db, user } = await requireHouseholdRole(event, id, 'canner')
  const load = await createLoad(db, id, user.id, body)
  setResponseStatus(event, 201)
  return load
})
