import { asc, eq } from 'drizzle-orm'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** Dry goods the household has in the pantry, by bean, largest first (any member reads it). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const rows = await db.select({ ingredientId: tables.dryGoodsStock.ingredientId, name: tables.ingredients.name, grams: tables.dryGoodsStock.grams, updatedAt: tables.dryGoodsStock.updatedAt })
    .from(tables.dryGoodsStock).innerJoin(tables.ingredients, eq(tables.ingredients.id, tables.dryGoodsStock.ingredientId))
    .where(eq(tables.dryGoodsStock.householdId, id))
    .orderBy(asc(tables.ingredients.name))
  return rows.filter(r => r.grams > 0)
})
