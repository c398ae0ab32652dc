import { randomUUID } from 'node:crypto'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { HouseRecipeSchema, houseRecipeRow, houseRecipeTables } from '~~/utils/schemas/catalogue'

/**
 * A canner adds a house recipe. Whatever the body says, it is stored as 'house', with the
 * untested caution and the process table of the tested recipe it names as its basis.
 */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'canner')
  const body = await validBody(event, HouseRecipeSchema)
  const built = houseRecipeTables(body, await loadCatalogue(db, id))
  if ('issues' in built) {
    const [first] = built.issues
    if (built.status === 400) badInput(first!.field, first!.message, built.issues)
    refusal(first!.message, first!.field)
  }
  const recipeId = `house-${randomUUID()}`
  await db.transaction(async (tx) => {
    await tx.insert(tables.recipes).values({ id: recipeId, householdId: id, createdBy: user.id, ...houseRecipeRow(body, built.base) })
    await tx.insert(tables.recipeJarSpecs).values(built.specs.map(s => ({ recipeId, ...s })))
    await tx.insert(tables.recipePressureBands).values(built.bands.map(b => ({ recipeId, ...b })))
  })
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'recipe', summary: `Added the house recipe ${body.name}` })
  setResponseStatus(event, 201)
  return (await loadCatalogue(db, id)).recipes.find(r => r.id === recipeId)
})
