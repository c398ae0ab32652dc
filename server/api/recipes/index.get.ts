import { HouseholdQuerySchema } from '~~/utils/schemas/catalogue'

/** The Recipe book: shared recipes (tested ones first) and the household's house recipes. */
export default defineEventHandler(async (event) => {
  await requireSession(event)
  const { householdId } = validQuery(event, HouseholdQuerySchema)
  const { db } = await requireMembership(event, householdId, 'helper')
  const { recipes, ingredients } = await loadCatalogue(db, householdId)
  return recipes.map((recipe) => {
    const basedOn = recipes.find(r => r.id === recipe.basedOnRecipeId)
    return {
      ...recipe,
      ingredient: ingredients.find(i => i.id === recipe.ingredientId) ?? null,
      basedOn: basedOn ? { id: basedOn.id, name: basedOn.name, source: basedOn.source } : null,
    }
  })
})
