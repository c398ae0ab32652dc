import { RecipeParamsSchema } from '~~/utils/schemas/catalogue'
import { RestoreRecipeSchema } from '~~/utils/schemas/curation'

/** A site admin puts a retired shared recipe back in the library, saying why. */
export default defineEventHandler(async (event) => {
  const user = await requireAdmin(event)
  const { id } = validParams(event, RecipeParamsSchema)
  const { reason } = await validBody(event, RestoreRecipeSchema)
  return setRecipeRetired(await useDB(), user, id, false, reason)
})
