import { asc, eq } from 'drizzle-orm'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** Empty jars the household owns, one row per jar size in the catalogue (0 when none). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const [sizes, stock] = await Promise.all([
    db.select().from(tables.jarSizes).orderBy(asc(tables.jarSizes.sortOrder)),
    db.select().from(tables.jarStock).where(eq(tables.jarStock.householdId, id)),
  ])
  return sizes.map(size => ({
    jarSizeId: size.id,
    name: size.name,
    sizeKey: size.sizeKey,
    mouth: size.mouth,
    count: stock.find(s => s.jarSizeId === size.id)?.count ?? 0,
  }))
})
