import { HouseholdQuerySchema, RecipeParamsSchema } from '~~/utils/schemas/catalogue'

/**
 * One recipe the household may see, with its ingredient's cup weight and expansion ratio and
 * their sources, and the history of its published values. Another household's house recipe is a 404, like one that does not exist.
 */
export default defineEventHandler(async (event) => {
  const { user } = await requireSession(event)
  const { id } = validParams(event, RecipeParamsSchema)
  const { householdId } = validQuery(event, HouseholdQuerySchema)
  const { db } = await requireMembership(event, householdId, 'helper')
  const { recipes, ingredients } = await loadCatalogue(db, householdId)
  const recipe = recipes.find(r => r.id === id)
  if (!recipe) notFound('That recipe is not in your Recipe book.')
  const basedOn = recipes.find(r => r.id === recipe.basedOnRecipeId)
  return {
    ...recipe,
    ingredient: ingredients.find(i => i.id === recipe.ingredientId) ?? null,
    basedOn: basedOn ? { id: basedOn.id, name: basedOn.name, source: basedOn.source } : null,
    history: await recipeHistory(db, recipe.id, user.isAdmin),
  }
})
