import { and, eq } from 'drizzle-orm'
import { HouseRecipeParamsSchema } from '~~/utils/schemas/catalogue'

/** Remove a house recipe of this household (its jar specs and bands go with it). */
export default defineEventHandler(async (event) => {
  const { params: { id, recipeId }, db, user } = await requireHouseholdRole(event, HouseRecipeParamsSchema, 'canner')
  const [deleted] = await db.delete(tables.recipes)
    .where(and(eq(tables.recipes.id, recipeId), eq(tables.recipes.householdId, id)))
    .returning({ id: tables.recipes.id })
  if (!deleted) notFound('No such house recipe in this household.')
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'recipe', summary: 'Deleted a house recipe' })
  return { id: deleted.id, deleted: true }
})
