import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { LoadListQuerySchema } from '../../../../../utils/schemas/logbook'

/** One page of the Logbook: ?page=&pageSize=&sort=-startedAt&recipeId=&cannerId=&from=&to= (any member). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const query = await getValidatedQuery(event, validateWith(LoadListQuerySchema))
  const { db } = await requireHouseholdRole(event, id, 'helper')
  return listLoads(db, id, query)
})
