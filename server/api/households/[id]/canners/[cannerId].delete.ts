import { and, eq } from 'drizzle-orm'
import { CannerParamsSchema } from '../../../../../utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { id, cannerId } = await getValidatedRouterParams(event, validateWith(CannerParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'owner')
  const [deleted] = await db.delete(tables.canners)
    .where(and(eq(tables.canners.id, cannerId), eq(tables.canners.householdId, id)))
    .returning({ id: tables.canners.id })
  if (!deleted) throw createError({ statusCode: 404, message: 'No such canner in this household.' })
  return { id: deleted.id, deleted: true }
})
