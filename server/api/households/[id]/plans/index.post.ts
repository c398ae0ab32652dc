import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { PlanSaveSchema } from '../../../../../utils/schemas/plan'

/** Save a plan (canner and up). A plan the model refuses is not saved: 422 with the reason. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(PlanSaveSchema))
  const { db, user } = await requireHouseholdRole(event, id, 'canner')
  const result = await computePlan(db, id, body.request)
  const [plan] = await db.insert(tables.plans).values({
    householdId: id,
    name: body.name,
    request: body.request,
    summary: planSummary(result),
    createdBy: user.id,
  }).returning()
  setResponseStatus(event, 201)
  return { plan, result }
})
