import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { JarStockSchema, unknownReference } from '../../../../../utils/schemas/catalogue'

/** Set how many empty jars of one size the household owns. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(JarStockSchema))
  const { db } = await requireHouseholdRole(event, id, 'owner')
  const unknown = unknownReference(body, await loadCatalogue(db, id))
  if (unknown) throw createError({ statusCode: 400, message: `${unknown.field}: ${unknown.message}`, data: { issues: [unknown] } })
  const [row] = await db.insert(tables.jarStock)
    .values({ householdId: id, jarSizeId: body.jarSizeId, count: body.count })
    .onConflictDoUpdate({ target: [tables.jarStock.householdId, tables.jarStock.jarSizeId], set: { count: body.count, updatedAt: new Date() } })
    .returning()
  return { jarSizeId: row!.jarSizeId, count: row!.count }
})
