import { eq } from 'drizzle-orm'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { DryGoodsSchema, unknownReference } from '~~/utils/schemas/catalogue'
import { formatMass } from '~~/utils/planning'

/** Set how much of one bean is in the pantry (0 clears it). Canners and owners keep the pantry. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'canner')
  const body = await validBody(event, DryGoodsSchema)
  const catalogue = await loadCatalogue(db, id)
  const unknown = unknownReference(body, catalogue)
  if (unknown) badInput(unknown.field, unknown.message)
  const [household] = await db.select({ unitSystem: tables.households.unitSystem }).from(tables.households).where(eq(tables.households.id, id))
  const name = catalogue.ingredients.find(g => g.id === body.ingredientId)!.name
  const row = await db.transaction(async (tx) => {
    const [saved] = await tx.insert(tables.dryGoodsStock)
      .values({ householdId: id, ingredientId: body.ingredientId, grams: body.grams })
      .onConflictDoUpdate({ target: [tables.dryGoodsStock.householdId, tables.dryGoodsStock.ingredientId], set: { grams: body.grams, updatedAt: serverNow() } })
      .returning()
    await recordActivity(tx, { householdId: id, userId: user.id, kind: 'dry-goods', summary: body.grams > 0 ? `Set the ${name} in the pantry to ${formatMass(body.grams, household!.unitSystem)}` : `Cleared the ${name} from the pantry` })
    return saved!
  })
  return { ingredientId: row.ingredientId, grams: row.grams }
})
