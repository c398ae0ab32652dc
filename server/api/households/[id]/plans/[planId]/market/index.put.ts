import { and, eq } from 'drizzle-orm'
import { MarketCheckSchema } from '~~/utils/schemas/market'
import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/** Check an item off (or back on) for every member. Any member may do it, helpers included. */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db, user } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  const body = await validBody(event, MarketCheckSchema)
  const plan = await requirePlan(db, id, planId)
  if (body.checked) {
    await db.insert(tables.marketChecks)
      .values({ planId, householdId: id, itemKey: body.itemKey, checkedBy: user.id })
      .onConflictDoNothing()
  }
  else {
    await db.delete(tables.marketChecks)
      .where(and(eq(tables.marketChecks.planId, planId), eq(tables.marketChecks.itemKey, body.itemKey)))
  }
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'market', summary: `${body.checked ? 'Checked off' : 'Unchecked'} ${body.itemKey} on the Market list of ${plan.name}`, detail: { planId } })
  return { itemKey: body.itemKey, checked: body.checked }
})
