import { and, eq, isNull } from 'drizzle-orm'
import { RecipeParamsSchema, SharedRecipePatchSchema } from '~~/utils/schemas/catalogue'

/**
 * A site admin corrects a shared recipe's words and source. Process times and pressures are
 * not editable here: they come from the published tables in the reference seed.
 */
export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  const { id } = validParams(event, RecipeParamsSchema)
  const body = await validBody(event, SharedRecipePatchSchema)
  const db = await useDB()
  const [recipe] = await db.update(tables.recipes)
    .set({ ...body, updatedAt: serverNow() })
    .where(and(eq(tables.recipes.id, id), isNull(tables.recipes.householdId)))
    .returning()
  if (!recipe) notFound('No such shared recipe.')
  return recipe
})
