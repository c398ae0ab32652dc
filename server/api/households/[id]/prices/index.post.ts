import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { PriceItemSchema, priceColumns, unknownReference } from '../../../../../utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(PriceItemSchema))
  const { db } = await requireHouseholdRole(event, id, 'owner')
  const columns = priceColumns(body)
  const unknown = unknownReference(columns, await loadCatalogue(db, id))
  if (unknown) throw createError({ statusCode: 400, message: `${unknown.field}: ${unknown.message}`, data: { issues: [unknown] } })
  const [item] = await db.insert(tables.priceItems).values({ ...columns, householdId: id }).returning()
  setResponseStatus(event, 201)
  return item
})
