import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { LoadListQuerySchema } from '~~/utils/schemas/logbook'

/** One page of the Logbook: ?page=&pageSize=&sort=-startedAt&recipeId=&cannerId=&from=&to= (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const query = validQuery(event, LoadListQuerySchema)
  return listLoads(db, id, query)
})
