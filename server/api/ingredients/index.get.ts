import { asc } from 'drizzle-orm'

/** Beans and peas with their cup weight and expansion ratio, each with its source. */
export default defineEventHandler(async (event) => {
  await requireSession(event)
  const db = await useDB()
  return db.select().from(tables.ingredients).orderBy(asc(tables.ingredients.name))
})
