import { eq } from 'drizzle-orm'
import { HouseRecipeParamsSchema, HouseRecipeSchema, houseRecipeRow, houseRecipeTables } from '~~/utils/schemas/catalogue'

/**
 * Replace a house recipe of this household. Its process table is copied again from the tested
 * recipe it names, so a change of basis takes that recipe's times and pressures.
 */
export default defineEventHandler(async (event) => {
  const { params: { id, recipeId }, db, user } = await requireHouseholdRole(event, HouseRecipeParamsSchema, 'canner')
  const body = await validBody(event, HouseRecipeSchema)
  const catalogue = await loadCatalogue(db, id)
  if (!catalogue.recipes.some(r => r.id === recipeId && r.householdId === id)) {
    notFound('No such house recipe in this household.')
  }
  const built = houseRecipeTables(body, catalogue)
  if ('issues' in built) {
    const [first] = built.issues
    if (built.status === 400) badInput(first!.field, first!.message, built.issues)
    refusal(first!.message, first!.field)
  }
  await db.transaction(async (tx) => {
    await tx.update(tables.recipes).set({ ...houseRecipeRow(body, built.base), updatedAt: serverNow() }).where(eq(tables.recipes.id, recipeId))
    await tx.delete(tables.recipeJarSpecs).where(eq(tables.recipeJarSpecs.recipeId, recipeId))
    await tx.delete(tables.recipePressureBands).where(eq(tables.recipePressureBands.recipeId, recipeId))
    await tx.insert(tables.recipeJarSpecs).values(built.specs.map(s => ({ recipeId, ...s })))
    await tx.insert(tables.recipePressureBands).values(built.bands.map(b => ({ recipeId, ...b })))
  })
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'recipe', summary: `Changed the house recipe ${body.name}` })
  return (await loadCatalogue(db, id)).recipes.find(r => r.id === recipeId)
})
