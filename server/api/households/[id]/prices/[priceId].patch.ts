import { and, eq } from 'drizzle-orm'
import { PriceItemSchema, PriceParamsSchema, priceColumns, unknownReference } from '../../../../../utils/schemas/catalogue'

/** Replace a price-list item; the body is the whole item, as its kind decides which fields apply. */
export default defineEventHandler(async (event) => {
  const { id, priceId } = await getValidatedRouterParams(event, validateWith(PriceParamsSchema))
  const body = await readValidatedBody(event, validateWith(PriceItemSchema))
  const { db } = await requireHouseholdRole(event, id, 'owner')
  const columns = priceColumns(body)
  const unknown = unknownReference(columns, await loadCatalogue(db, id))
  if (unknown) throw createError({ statusCode: 400, message: `${unknown.field}: ${unknown.message}`, data: { issues: [unknown] } })
  const [item] = await db.update(tables.priceItems)
    .set({ ...columns, updatedAt: new Date() })
    .where(and(eq(tables.priceItems.id, priceId), eq(tables.priceItems.householdId, id)))
    .returning()
  if (!item) throw createError({ statusCode: 404, message: 'No such item in this household\'s price list.' })
  return item
})
