import { eq } from 'drizzle-orm'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'

export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  return db.select({
    userId: tables.users.id,
    name: tables.users.name,
    email: tables.users.email,
    role: tables.memberships.role,
  })
    .from(tables.memberships)
    .innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
    .where(eq(tables.memberships.householdId, id))
    .orderBy(tables.users.name)
})
