import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db, user } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'canner')
  const source = await requirePlan(db, id, planId)
  const plan = written(await db.insert(tables.plans).values({
    householdId: id,
    name: `Copy of ${source.name}`.slice(0, 80),
    request: source.request,
    summary: source.summary,
    createdBy: user.id,
  }).returning())
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'plan', summary: `Copied the plan ${source.name}`, detail: { planId: plan.id } })
  setResponseStatus(event, 201)
  return { plan }
})
