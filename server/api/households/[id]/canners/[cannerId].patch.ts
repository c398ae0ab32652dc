import { and, eq } from 'drizzle-orm'
import { CannerParamsSchema, CannerSchema, withGaugeStatus } from '../../../../../utils/schemas/catalogue'

/** Change some of a canner's measurements; another household's canner is a 404. */
export default defineEventHandler(async (event) => {
  const { id, cannerId } = await getValidatedRouterParams(event, validateWith(CannerParamsSchema))
  const body = await readValidatedBody(event, validateWith(CannerSchema.partial()))
  const { db } = await requireHouseholdRole(event, id, 'owner')
  const [canner] = await db.update(tables.canners)
    .set({ ...body, updatedAt: new Date() })
    .where(and(eq(tables.canners.id, cannerId), eq(tables.canners.householdId, id)))
    .returning()
  if (!canner) throw createError({ statusCode: 404, message: 'No such canner in this household.' })
  return withGaugeStatus(canner)
})
