import { and, eq } from 'drizzle-orm'
import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/** Who checked off what on this plan's market list. */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  await requirePlan(db, id, planId)
  return db.select({ itemKey: tables.marketChecks.itemKey, state: tables.marketChecks.state, checkedAt: tables.marketChecks.checkedAt, checkedBy: tables.users.name })
    .from(tables.marketChecks)
    .leftJoin(tables.users, eq(tables.users.id, tables.marketChecks.checkedBy))
    .where(and(eq(tables.marketChecks.planId, planId), eq(tables.marketChecks.householdId, id)))
})
