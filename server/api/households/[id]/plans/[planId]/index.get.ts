import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/**
 * A saved plan, recomputed from current data (prices, canners, altitude may have changed).
 * If the current data make the model refuse it, the plan still loads with the refusal.
 */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  const plan = await requirePlan(db, id, planId)
  const referenceChanges = await referenceChangesSince(db, plan)
  try {
    return { plan, referenceChanges, result: await computePlan(db, id, plan.request, { planId: plan.id }), refusal: null }
  }
  catch (error) {
    const status = (error as { statusCode?: number }).statusCode
    if (status !== 422) throw error
    return { plan, referenceChanges, result: null, refusal: { message: (error as Error).message, field: (error as { data?: { field?: string } }).data?.field ?? null } }
  }
})
