import { eq } from 'drizzle-orm'
import { HouseholdPlanParamsSchema } from '../../../../../../utils/schemas/params'

export default defineEventHandler(async (event) => {
  const { id, planId } = await getValidatedRouterParams(event, validateWith(HouseholdPlanParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'canner')
  const plan = await requirePlan(db, id, planId)
  await db.delete(tables.plans).where(eq(tables.plans.id, plan.id))
  setResponseStatus(event, 204)
  return null
})
