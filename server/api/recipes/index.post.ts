import { SharedRecipeSchema } from '~~/utils/schemas/curation'

/** A site admin adds a tested recipe to the shared library, with its published tables and citation. */
export default defineEventHandler(async (event) => {
  const user = await requireAdmin(event)
  const body = await validBody(event, SharedRecipeSchema)
  setResponseStatus(event, 201)
  return createSharedRecipe(await useDB(), user, body)
})
