import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { JarStockSchema, unknownReference } from '~~/utils/schemas/catalogue'

/** Set how many empty jars of one size the household owns. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const body = await validBody(event, JarStockSchema)
  const unknown = unknownReference(body, await loadCatalogue(db, id))
  if (unknown) badInput(unknown.field, unknown.message)
  const [row] = await db.insert(tables.jarStock)
    .values({ householdId: id, jarSizeId: body.jarSizeId, count: body.count })
    .onConflictDoUpdate({ target: [tables.jarStock.householdId, tables.jarStock.jarSizeId], set: { count: body.count, updatedAt: serverNow() } })
    .returning()
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'jar-stock', summary: `Set the empty ${body.jarSizeId} jars to ${body.count}` })
  return { jarSizeId: row!.jarSizeId, count: row!.count }
})
