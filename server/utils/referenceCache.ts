import { asc, inArray, isNull, sql } from 'drizzle-orm'
import type { Db } from './database'

/**
 * The published reference data — jar sizes, ingredients and the shared library's recipes with
 * their tables — kept in memory, keyed by its versions in `reference_data`: 'published' (moved
 * by a shipped correction at start-up) and 'library' (moved by every site-admin edit, in the
 * edit's own transaction). Each read compares the versions with one small query, so a change
 * made through any server on the database is seen by the very next request on every server.
 * Household-owned rows (house recipes) are never cached.
 */
type SharedReference = Awaited<ReturnType<typeof readShared>>

let cached: { stamp: string, data: SharedReference } | undefined

async function stampOf(db: Db): Promise<string> {
  const rows = await db.select({ name: tables.referenceData.name, version: tables.referenceData.version, appliedAt: tables.referenceData.appliedAt })
    .from(tables.referenceData).orderBy(asc(tables.referenceData.name))
  return rows.map(r => `${r.name}:${r.version}:${r.appliedAt.getTime()}`).join('|')
}

async function readShared(db: Db) {
  const [recipes, jarSizes, ingredients] = await Promise.all([
    db.select().from(tables.recipes).where(isNull(tables.recipes.householdId)),
    db.select().from(tables.jarSizes).orderBy(asc(tables.jarSizes.sortOrder)),
    db.select().from(tables.ingredients).orderBy(asc(tables.ingredients.name)),
  ])
  const ids = recipes.map(r => r.id)
  const [specs, bands] = ids.length
    ? await Promise.all([
        db.select().from(tables.recipeJarSpecs).where(inArray(tables.recipeJarSpecs.recipeId, ids)),
        db.select().from(tables.recipePressureBands).where(inArray(tables.recipePressureBands.recipeId, ids)),
      ])
    : [[], []]
  return { recipes, jarSizes, ingredients, specs, bands }
}

/** The shared reference rows, from memory unless their version moved since they were read. */
export async function sharedReference(db: Db): Promise<SharedReference> {
  // The stamp is read before the rows: a change between the two is caught by the next read.
  const stamp = await stampOf(db)
  if (cached?.stamp === stamp) return cached.data
  const data = await readShared(db)
  cached = { stamp, data }
  return data
}

/** Move the library's version in the transaction of a site-admin edit to the shared library. */
export async function libraryChanged(tx: Db): Promise<void> {
  await tx.insert(tables.referenceData).values({ name: 'library', version: 1, appliedAt: new Date() })
    .onConflictDoUpdate({ target: tables.referenceData.name, set: { version: sql`${tables.referenceData.version} + 1`, appliedAt: new Date() } })
}
