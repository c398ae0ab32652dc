import { count, eq, getTableColumns, inArray, sql } from 'drizzle-orm'
import type { PgTable } from 'drizzle-orm/pg-core'
import type { Database, Tx } from '~~/server/utils/database'
import { changesBetween, followBasis, referenceValues, type Change } from '~~/server/utils/referenceValues'
import * as t from '../schema'
import { ingredientSeed, jarSizeSeed, recipePressureBandSeed, recipeSeed, REFERENCE_VERSION } from './reference'
import { seedDemoHousehold } from './demo'
import { seedDemoSeason } from './demo-season'

/** `set` for an upsert: every column the seed rows give, except the key, takes the incoming value. */
function incoming(table: PgTable, rows: ReadonlyArray<Record<string, unknown>>, key: string) {
  const columns = getTableColumns(table) as Record<string, { name: string }>
  const given = new Set(rows.flatMap(row => Object.keys(row)))
  given.delete(key)
  return Object.fromEntries([...given].map(k => [k, sql.raw(`excluded."${columns[k]!.name}"`)]))
}

async function applyReference(tx: Tx): Promise<Change[]> {
  const before = await referenceValues(tx)
  const recipeRows = recipeSeed.map(({ jarSpecs: _specs, ...recipe }) => recipe)
  await tx.insert(t.jarSizes).values(jarSizeSeed).onConflictDoUpdate({ target: t.jarSizes.id, set: incoming(t.jarSizes, jarSizeSeed, 'id') })
  await tx.insert(t.ingredients).values(ingredientSeed).onConflictDoUpdate({ target: t.ingredients.id, set: incoming(t.ingredients, ingredientSeed, 'id') })
  await tx.insert(t.recipes).values(recipeRows).onConflictDoUpdate({ target: t.recipes.id, set: incoming(t.recipes, recipeRows, 'id') })
  // A published recipe's tables are replaced whole, so a row the correction removes goes too.
  const ids = recipeSeed.map(r => r.id)
  await tx.delete(t.recipeJarSpecs).where(inArray(t.recipeJarSpecs.recipeId, ids))
  await tx.delete(t.recipePressureBands).where(inArray(t.recipePressureBands.recipeId, ids))
  await tx.insert(t.recipeJarSpecs).values(recipeSeed.flatMap(r => r.jarSpecs.map(s => ({ recipeId: r.id, ...s }))))
  await tx.insert(t.recipePressureBands).values(recipePressureBandSeed)
  await followBasis(tx, ids)
  return changesBetween(before, await referenceValues(tx))
}

/**
 * Bring the published reference data up to `REFERENCE_VERSION`. A database holding an older
 * version (or none: a new database, or one from before versioning) gets every published row as
 * shipped, replacing what it held, so a correction reaches existing households. At the current
 * version nothing is overwritten (an admin's edit stands) and only missing rows are added. The
 * version row is locked for the transaction, so two servers starting at once apply it once.
 * Answers whether a new version was applied.
 */
export async function seedReference(db: Database): Promise<boolean> {
  return db.transaction(async (tx) => {
    await tx.insert(t.referenceData).values({ name: 'published', version: 0 }).onConflictDoNothing()
    const [held] = await tx.select().from(t.referenceData).where(eq(t.referenceData.name, 'published')).for('update')
    if ((held?.version ?? 0) < REFERENCE_VERSION) {
      const changes = await applyReference(tx)
      const appliedAt = new Date()
      if (changes.length) {
        await tx.insert(t.referenceChanges).values(changes.map(c => ({ ...c, version: REFERENCE_VERSION, appliedAt })))
        console.warn(`[shelfstead] Reference data version ${REFERENCE_VERSION} changed ${changes.length} published value(s):\n  ${changes.map(c => c.what).join('\n  ')}`)
      }
      await tx.update(t.referenceData).set({ version: REFERENCE_VERSION, appliedAt }).where(eq(t.referenceData.name, 'published'))
      return true
    }
    await tx.insert(t.jarSizes).values(jarSizeSeed).onConflictDoNothing()
    await tx.insert(t.ingredients).values(ingredientSeed).onConflictDoNothing()
    await tx.insert(t.recipes).values(recipeSeed.map(({ jarSpecs: _specs, ...recipe }) => recipe)).onConflictDoNothing()
    await tx.insert(t.recipeJarSpecs).values(recipeSeed.flatMap(r => r.jarSpecs.map(s => ({ recipeId: r.id, ...s })))).onConflictDoNothing()
    await tx.insert(t.recipePressureBands).values(recipePressureBandSeed).onConflictDoNothing()
    return false
  })
}

/** Create the demo household only when nobody has signed up yet. */
export async function seedDemoIfEmpty(
  db: Database,
  hashPassword: (password: string) => Promise<string>,
): Promise<boolean> {
  const [row] = await db.select({ users: count() }).from(t.users)
  if ((row?.users ?? 0) > 0) return false
  await seedDemoSeason(db, await seedDemoHousehold(db, hashPassword))
  return true
}
