import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'
import { SendMarketListSchema } from '~~/utils/schemas/logbook'

/** E-mail a plan's Market list to a member of the household (any member may send it). */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db, user } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  const body = await validBody(event, SendMarketListSchema)
  const result = await sendMarketList(db, id, planId, body.userId, user.name)
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'market', summary: `Sent a Market list to ${result.sentTo}`, detail: { planId } })
  setResponseStatus(event, 202)
  return result
})
