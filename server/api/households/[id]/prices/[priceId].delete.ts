import { and, eq } from 'drizzle-orm'
import { PriceParamsSchema } from '../../../../../utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { id, priceId } = await getValidatedRouterParams(event, validateWith(PriceParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'owner')
  const [deleted] = await db.delete(tables.priceItems)
    .where(and(eq(tables.priceItems.id, priceId), eq(tables.priceItems.householdId, id)))
    .returning({ id: tables.priceItems.id })
  if (!deleted) throw createError({ statusCode: 404, message: 'No such item in this household\'s price list.' })
  return { id: deleted.id, deleted: true }
})
