import { and, eq } from 'drizzle-orm'
import { PriceParamsSchema } from '~~/utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { params: { id, priceId }, db, user } = await requireHouseholdRole(event, PriceParamsSchema, 'owner')
  const [deleted] = await db.delete(tables.priceItems)
    .where(and(eq(tables.priceItems.id, priceId), eq(tables.priceItems.householdId, id)))
    .returning({ id: tables.priceItems.id })
  if (!deleted) notFound('No such item in this household\'s price list.')
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'price', summary: 'Removed a price' })
  return { id: deleted.id, deleted: true }
})
