import { asc, eq } from 'drizzle-orm'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** The household's price list: what it pays for each package it buys. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  return db.select().from(tables.priceItems)
    .where(eq(tables.priceItems.householdId, id))
    .orderBy(asc(tables.priceItems.kind), asc(tables.priceItems.label))
})
