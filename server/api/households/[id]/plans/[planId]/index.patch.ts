import { eq } from 'drizzle-orm'
import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'
import { PlanUpdateSchema } from '~~/utils/schemas/plan'

/** Rename a plan, change its status, or replace its request (recomputed; a refusal saves nothing). */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db, user } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'canner')
  const body = await validBody(event, PlanUpdateSchema)
  const current = await requirePlan(db, id, planId)
  // Only a new request is recomputed (and refused with 422); renaming never depends on today's data.
  const result = body.request ? await computePlan(db, id, body.request, { planId: current.id }) : null
  const [plan] = await db.update(tables.plans)
    .set({
      name: body.name ?? current.name,
      status: body.status ?? current.status,
      ...(body.request && result ? { request: body.request, summary: planSummary(result) } : {}),
      updatedAt: serverNow(),
    })
    .where(eq(tables.plans.id, current.id))
    .returning()
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'plan', summary: body.request ? `Changed the plan ${plan!.name}` : body.status && body.status !== current.status ? `Marked the plan ${plan!.name} ${body.status}` : `Renamed the plan ${current.name} to ${plan!.name}`, detail: { planId } })
  return { plan, result }
})
