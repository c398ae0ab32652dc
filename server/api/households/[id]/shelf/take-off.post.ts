import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { TakeOffSchema } from '~~/utils/schemas/shelf'

/** Take jars off the Shelf, one lot or many; the empty jars go back to jar stock; any member may. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const body = await validBody(event, TakeOffSchema)
  return takeOff(db, id, user.id, body)
})
