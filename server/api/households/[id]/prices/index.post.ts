import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { PriceItemSchema, priceColumns, unknownReference } from '~~/utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const body = await validBody(event, PriceItemSchema)
  const columns = priceColumns(body)
  const unknown = unknownReference(columns, await loadCatalogue(db, id))
  if (unknown) badInput(unknown.field, unknown.message)
  // The price and its activity row together, so a crash between them leaves neither half.
  const item = await db.transaction(async (tx) => {
    const [row] = await tx.insert(tables.priceItems).values({ ...columns, householdId: id }).returning()
    await recordActivity(tx, { householdId: id, userId: user.id, kind: 'price', summary: `Added a ${row!.kind} price` })
    return row!
  })
  setResponseStatus(event, 201)
  return item
})
