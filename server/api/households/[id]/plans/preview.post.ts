import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { PlanRequestSchema } from '../../../../../utils/schemas/plan'

/** Compute a plan without saving it. Any member may preview; a refusal answers 422. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(PlanRequestSchema))
  const { db } = await requireHouseholdRole(event, id, 'helper')
  return computePlan(db, id, body)
})
