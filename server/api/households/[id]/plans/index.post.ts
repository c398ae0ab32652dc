import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { PlanSaveSchema } from '~~/utils/schemas/plan'

/** Save a plan (canner and up). A plan the model refuses is not saved: 422 with the reason. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'canner')
  const body = await validBody(event, PlanSaveSchema)
  const result = await computePlan(db, id, body.request)
  const plan = written(await db.insert(tables.plans).values({
    householdId: id,
    name: body.name,
    request: body.request,
    summary: planSummary(result),
    createdBy: user.id,
  }).returning())
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'plan', summary: `Saved the plan ${plan.name}`, detail: { planId: plan.id } })
  setResponseStatus(event, 201)
  return { plan, result }
})
