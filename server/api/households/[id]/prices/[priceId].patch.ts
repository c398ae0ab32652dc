import { and, eq } from 'drizzle-orm'
import { PriceItemSchema, PriceParamsSchema, priceColumns, unknownReference } from '~~/utils/schemas/catalogue'

/** Replace a price-list item; the body is the whole item, as its kind decides which fields apply. */
export default defineEventHandler(async (event) => {
  const { params: { id, priceId }, db, user } = await requireHouseholdRole(event, PriceParamsSchema, 'owner')
  const body = await validBody(event, PriceItemSchema)
  const columns = priceColumns(body)
  const unknown = unknownReference(columns, await loadCatalogue(db, id))
  if (unknown) badInput(unknown.field, unknown.message)
  const [item] = await db.update(tables.priceItems)
    .set({ ...columns, updatedAt: serverNow() })
    .where(and(eq(tables.priceItems.id, priceId), eq(tables.priceItems.householdId, id)))
    .returning()
  if (!item) notFound('No such item in this household\'s price list.')
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'price', summary: `Changed a ${item.kind} price` })
  return item
})
