import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { CannerSchema, withGaugeStatus } from '../../../../../utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(CannerSchema))
  const { db } = await requireHouseholdRole(event, id, 'owner')
  const [canner] = await db.insert(tables.canners).values({ ...body, householdId: id }).returning()
  setResponseStatus(event, 201)
  return withGaugeStatus(canner!)
})
