import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { TakeOffSchema } from '../../../../../utils/schemas/shelf'

/** Take jars off the Shelf, one lot or many; the empty jars go back to jar stock (canner and up). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(TakeOffSchema))
  const { db, user } = await requireHouseholdRole(event, id, 'canner')
  return takeOff(db, id, user.id, body)
})
