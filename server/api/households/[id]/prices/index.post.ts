import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { PriceItemSchema, priceColumns, unknownReference } from '~~/utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const body = await validBody(event, PriceItemSchema)
  const columns = priceColumns(body)
  const unknown = unknownReference(columns, await loadCatalogue(db, id))
  if (unknown) badInput(unknown.field, unknown.message)
  const [item] = await db.insert(tables.priceItems).values({ ...columns, householdId: id }).returning()
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'price', summary: `Added a ${item!.kind} price` })
  setResponseStatus(event, 201)
  return item
})
