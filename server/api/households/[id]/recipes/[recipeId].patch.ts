import { eq } from 'drizzle-orm'
import { HouseRecipeParamsSchema, HouseRecipeSchema, houseRecipeRow, houseRecipeTables } from '../../../../../utils/schemas/catalogue'

/**
 * Replace a house recipe of this household. Its process table is copied again from the tested
 * recipe it names, so a change of basis takes that recipe's times and pressures.
 */
export default defineEventHandler(async (event) => {
  const { id, recipeId } = await getValidatedRouterParams(event, validateWith(HouseRecipeParamsSchema))
  const body = await readValidatedBody(event, validateWith(HouseRecipeSchema))
  const { db } = await requireHouseholdRole(event, id, 'canner')
  const catalogue = await loadCatalogue(db, id)
  if (!catalogue.recipes.some(r => r.id === recipeId && r.householdId === id)) {
    throw createError({ statusCode: 404, message: 'No such house recipe in this household.' })
  }
  const built = houseRecipeTables(body, catalogue)
  if ('issues' in built) {
    const [first] = built.issues
    throw createError({ statusCode: built.status, message: built.status === 400 ? `${first!.field}: ${first!.message}` : first!.message, data: { issues: built.issues } })
  }
  await db.transaction(async (tx) => {
    await tx.update(tables.recipes).set({ ...houseRecipeRow(body, built.base), updatedAt: new Date() }).where(eq(tables.recipes.id, recipeId))
    await tx.delete(tables.recipeJarSpecs).where(eq(tables.recipeJarSpecs.recipeId, recipeId))
    await tx.delete(tables.recipePressureBands).where(eq(tables.recipePressureBands.recipeId, recipeId))
    await tx.insert(tables.recipeJarSpecs).values(built.specs.map(s => ({ recipeId, ...s })))
    await tx.insert(tables.recipePressureBands).values(built.bands.map(b => ({ recipeId, ...b })))
  })
  return (await loadCatalogue(db, id)).recipes.find(r => r.id === recipeId)
})
