import { and, asc, eq, isNull } from 'drizzle-orm'
import { loadCode } from '~~/utils/after'
import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/**
 * A saved plan, recomputed from current data (prices, canners, altitude may have changed), with
 * the loads of it already in the Logbook. If the current data make the model refuse it, the plan
 * still loads with the refusal.
 */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  const plan = await requirePlan(db, id, planId)
  const [referenceChanges, loads] = await Promise.all([
    referenceChangesSince(db, plan),
    db.select({ id: tables.canningLoads.id, number: tables.canningLoads.number, index: tables.canningLoads.planLoadIndex })
      .from(tables.canningLoads)
      .where(and(eq(tables.canningLoads.householdId, id), eq(tables.canningLoads.planId, planId), isNull(tables.canningLoads.reprocessOfId)))
      .orderBy(asc(tables.canningLoads.number)),
  ])
  const logged = loads.flatMap(l => (l.index === null ? [] : [{ index: l.index, id: l.id, code: loadCode(l.number) }]))
  try {
    return { plan, referenceChanges, logged, result: await computePlan(db, id, plan.request, { planId: plan.id }), refusal: null }
  }
  catch (error) {
    const status = (error as { statusCode?: number }).statusCode
    if (status !== 422) throw error
    return { plan, referenceChanges, logged, result: null, refusal: { message: (error as Error).message, field: (error as { data?: { field?: string } }).data?.field ?? null } }
  }
})
