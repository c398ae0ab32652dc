import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { SealCheckSchema } from '../../../../../utils/schemas/logbook'

/** Record a load's seal check (helpers too): sealed jars to the Shelf, unsealed to the refrigerator or reprocessing. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(SealCheckSchema))
  const { db, user } = await requireHouseholdRole(event, id, 'helper')
  const load = await recordSealCheck(db, id, user.id, body)
  setResponseStatus(event, 201)
  return load
})
