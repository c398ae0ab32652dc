import { and, eq } from 'drizzle-orm'
import { CannerParamsSchema, CannerSchema, withGaugeStatus } from '~~/utils/schemas/catalogue'

/** Change some of a canner's measurements; another household's canner is a 404. */
export default defineEventHandler(async (event) => {
  const { params: { id, cannerId }, db, user } = await requireHouseholdRole(event, CannerParamsSchema, 'owner')
  const body = await validBody(event, CannerSchema.partial())
  const today = await cannerToday(db, id, body.lastGaugeTestAt)
  const [canner] = await db.update(tables.canners)
    .set({ ...body, updatedAt: serverNow() })
    .where(and(eq(tables.canners.id, cannerId), eq(tables.canners.householdId, id)))
    .returning()
  if (!canner) notFound('No such canner in this household.')
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'canner', summary: `Changed the canner ${canner.name}` })
  return withGaugeStatus(canner, today)
})
