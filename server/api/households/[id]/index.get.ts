import { eq } from 'drizzle-orm'
import { HouseholdParamsSchema } from '../../../../utils/schemas/household'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const { db, role } = await requireHouseholdRole(event, id, 'helper')
  const [household] = await db.select().from(tables.households).where(eq(tables.households.id, id))
  if (!household) throw createError({ statusCode: 404, message: 'No such household.' })
  return { ...household, role }
})
