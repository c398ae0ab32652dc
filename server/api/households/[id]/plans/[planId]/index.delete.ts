import { eq } from 'drizzle-orm'
import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db, user } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'canner')
  const plan = await requirePlan(db, id, planId)
  await db.delete(tables.plans).where(eq(tables.plans.id, plan.id))
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'plan', summary: `Deleted the plan ${plan.name}` })
  setResponseStatus(event, 204)
  return null
})
