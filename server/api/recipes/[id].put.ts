import { RecipeParamsSchema } from '~~/utils/schemas/catalogue'
import { SharedRecipeSchema } from '~~/utils/schemas/curation'

/**
 * A site admin corrects a shared tested recipe: its words, citation and published tables, sent
 * whole with the reason for the change. Answers the lines that changed.
 */
export default defineEventHandler(async (event) => {
  const user = await requireAdmin(event)
  const { id } = validParams(event, RecipeParamsSchema)
  const body = await validBody(event, SharedRecipeSchema)
  return updateSharedRecipe(await useDB(), user, id, body)
})
