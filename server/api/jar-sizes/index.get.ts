import { asc } from 'drizzle-orm'

/** The jar catalogue, smallest first. Outside dimensions are typical values (see dimensionsNote). */
export default defineEventHandler(async (event) => {
  await requireSession(event)
  const db = await useDB()
  return db.select({
    id: tables.jarSizes.id,
    name: tables.jarSizes.name,
    sizeKey: tables.jarSizes.sizeKey,
    capacityMl: tables.jarSizes.capacityMl,
    capacitySource: tables.jarSizes.capacitySource,
    outsideDiameterMm: tables.jarSizes.outsideDiameterMm,
    heightMm: tables.jarSizes.heightMm,
    mouth: tables.jarSizes.mouth,
    dimensionsNote: tables.jarSizes.dimensionsNote,
  }).from(tables.jarSizes).orderBy(asc(tables.jarSizes.sortOrder))
})
