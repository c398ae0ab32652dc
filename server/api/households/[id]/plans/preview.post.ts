import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { PlanPreviewQuerySchema, PlanRequestSchema } from '~~/utils/schemas/plan'

/**
 * Compute a plan without saving it. Any member may preview; a refusal answers 422. With
 * ?planId= (a saved plan of the household being changed) the Market list is for its loads not
 * yet logged and keeps its at-home marks.
 */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const query = validQuery(event, PlanPreviewQuerySchema)
  const body = await validBody(event, PlanRequestSchema)
  if (query.planId) await requirePlan(db, id, query.planId)
  return computePlan(db, id, body, query.planId ? { planId: query.planId } : undefined)
})
