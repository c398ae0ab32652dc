import { and, eq } from 'drizzle-orm'
import { CannerParamsSchema } from '~~/utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { params: { id, cannerId }, db } = await requireHouseholdRole(event, CannerParamsSchema, 'owner')
  const [deleted] = await db.delete(tables.canners)
    .where(and(eq(tables.canners.id, cannerId), eq(tables.canners.householdId, id)))
    .returning({ id: tables.canners.id })
  if (!deleted) notFound('No such canner in this household.')
  return { id: deleted.id, deleted: true }
})
