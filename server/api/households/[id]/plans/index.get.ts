import { desc, eq } from 'drizzle-orm'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'

export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  return db.select({
    id: tables.plans.id,
    name: tables.plans.name,
    status: tables.plans.status,
    summary: tables.plans.summary,
    createdAt: tables.plans.createdAt,
    updatedAt: tables.plans.updatedAt,
    createdBy: tables.users.name,
  })
    .from(tables.plans)
    .leftJoin(tables.users, eq(tables.users.id, tables.plans.createdBy))
    .where(eq(tables.plans.householdId, id))
    .orderBy(desc(tables.plans.updatedAt))
})
