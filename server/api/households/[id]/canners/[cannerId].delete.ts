import { and, eq } from 'drizzle-orm'
import { CannerParamsSchema } from '~~/utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { params: { id, cannerId }, db, user } = await requireHouseholdRole(event, CannerParamsSchema, 'owner')
  const [deleted] = await db.delete(tables.canners)
    .where(and(eq(tables.canners.id, cannerId), eq(tables.canners.householdId, id)))
    .returning({ id: tables.canners.id, name: tables.canners.name })
  if (!deleted) notFound('No such canner in this household.')
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'canner', summary: `Removed the canner ${deleted.name}` })
  return { id: deleted.id, deleted: true }
})
