import { RecipeParamsSchema } from '~~/utils/schemas/catalogue'
import { RetireRecipeSchema } from '~~/utils/schemas/curation'

/** A site admin takes a shared recipe out of the library, saying why; it is never planned again until restored. */
export default defineEventHandler(async (event) => {
  const user = await requireAdmin(event)
  const { id } = validParams(event, RecipeParamsSchema)
  const { reason } = await validBody(event, RetireRecipeSchema)
  return setRecipeRetired(await useDB(), user, id, true, reason)
})
