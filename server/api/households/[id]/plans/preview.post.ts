import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { PlanRequestSchema } from '~~/utils/schemas/plan'

/** Compute a plan without saving it. Any member may preview; a refusal answers 422. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const body = await validBody(event, PlanRequestSchema)
  return computePlan(db, id, body)
})
