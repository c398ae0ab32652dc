import { HouseholdQuerySchema, RecipeParamsSchema } from '../../../utils/schemas/catalogue'

/**
 * One recipe the household may see, with its ingredient's cup weight and expansion ratio and
 * their sources. Another household's house recipe is a 404, like one that does not exist.
 */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(RecipeParamsSchema))
  const { householdId } = await getValidatedQuery(event, validateWith(HouseholdQuerySchema))
  const { db } = await requireHouseholdRole(event, householdId, 'helper')
  const { recipes, ingredients } = await loadCatalogue(db, householdId)
  const recipe = recipes.find(r => r.id === id)
  if (!recipe) throw createError({ statusCode: 404, message: 'That recipe is not in your Recipe book.' })
  const basedOn = recipes.find(r => r.id === recipe.basedOnRecipeId)
  return {
    ...recipe,
    ingredient: ingredients.find(i => i.id === recipe.ingredientId) ?? null,
    basedOn: basedOn ? { id: basedOn.id, name: basedOn.name, source: basedOn.source } : null,
  }
})
