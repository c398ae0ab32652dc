import { HouseholdPlanParamsSchema } from '../../../../../../utils/schemas/params'
import { SendMarketListSchema } from '../../../../../../utils/schemas/logbook'

/** E-mail a plan's Market list to a member of the household (any member may send it). */
export default defineEventHandler(async (event) => {
  const { id, planId } = await getValidatedRouterParams(event, validateWith(HouseholdPlanParamsSchema))
  const body = await readValidatedBody(event, validateWith(SendMarketListSchema))
  const { db, user } = await requireHouseholdRole(event, id, 'helper')
  const result = await sendMarketList(db, id, planId, body.userId, user.name)
  setResponseStatus(event, 202)
  return result
})
