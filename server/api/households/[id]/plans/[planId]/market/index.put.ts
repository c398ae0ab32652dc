import { and, eq } from 'drizzle-orm'
import { MarketCheckSchema } from '~~/utils/schemas/market'
import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/** Check an item off as bought or as already at home (or back on) for every member. Any member may do it, helpers included. */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db, user } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  const body = await validBody(event, MarketCheckSchema)
  const plan = await requirePlan(db, id, planId)
  await db.transaction(async (tx) => {
    if (body.checked) {
      await tx.insert(tables.marketChecks)
        .values({ planId, householdId: id, itemKey: body.itemKey, state: body.state, checkedBy: user.id })
        .onConflictDoUpdate({ target: [tables.marketChecks.planId, tables.marketChecks.itemKey], set: { state: body.state, checkedBy: user.id, checkedAt: serverNow() } })
    }
    else {
      await tx.delete(tables.marketChecks)
        .where(and(eq(tables.marketChecks.planId, planId), eq(tables.marketChecks.householdId, id), eq(tables.marketChecks.itemKey, body.itemKey)))
    }
    const what = !body.checked ? 'Unchecked' : body.state === 'at-home' ? 'Marked as at home' : 'Checked off'
    await recordActivity(tx, { householdId: id, userId: user.id, kind: 'market', summary: `${what} ${body.itemKey} on the Market list of ${plan.name}`, detail: { planId } })
  })
  return { itemKey: body.itemKey, checked: body.checked, state: body.state }
})
