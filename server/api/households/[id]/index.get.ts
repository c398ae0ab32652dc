import { eq } from 'drizzle-orm'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'

export default defineEventHandler(async (event) => {
  const { params: { id }, db, role } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const [household] = await db.select().from(tables.households).where(eq(tables.households.id, id))
  if (!household) notFound('No such household.')
  // `now` is the server clock (the test clock moves it): the page's "now" and "today" start from it.
  return { ...household, role, now: serverNow().toISOString() }
})
