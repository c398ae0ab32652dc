import { HouseholdPlanParamsSchema } from '../../../../../../utils/schemas/params'

export default defineEventHandler(async (event) => {
  const { id, planId } = await getValidatedRouterParams(event, validateWith(HouseholdPlanParamsSchema))
  const { db, user } = await requireHouseholdRole(event, id, 'canner')
  const source = await requirePlan(db, id, planId)
  const [plan] = await db.insert(tables.plans).values({
    householdId: id,
    name: `Copy of ${source.name}`.slice(0, 80),
    request: source.request,
    summary: source.summary,
    createdBy: user.id,
  }).returning()
  setResponseStatus(event, 201)
  return { plan }
})
