import { and, count, eq, getTableColumns, inArray, isNotNull, sql } from 'drizzle-orm'
import type { PgTable } from 'drizzle-orm/pg-core'
import type { Database, Tx } from '~~/server/utils/database'
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

interface Change { recipeId: string | null, what: string }

/** The values a canner relies on, as this database holds them, keyed for comparison. */
async function referenceValues(tx: Tx) {
  const [jars, goods, specs, bands, recipes] = await Promise.all([
    tx.select().from(t.jarSizes),
    tx.select().from(t.ingredients),
    tx.select().from(t.recipeJarSpecs),
    tx.select().from(t.recipePressureBands),
    tx.select({ id: t.recipes.id, name: t.recipes.name }).from(t.recipes),
  ])
  const values = new Map<string, { recipeId: string | null, label: string, value: string }>()
  const name = (id: string) => recipes.find(r => r.id === id)?.name ?? id
  for (const j of jars) {
    values.set(`jar:${j.id}:capacity`, { recipeId: null, label: `${j.name}: capacity`, value: `${j.capacityMl} mL` })
    values.set(`jar:${j.id}:size`, { recipeId: null, label: `${j.name}: outside size`, value: `${j.outsideDiameterMm} × ${j.heightMm} mm` })
  }
  for (const g of goods) {
    values.set(`ingredient:${g.id}:cup`, { recipeId: null, label: `${g.name}: weight of a cup`, value: `${g.gramsPerCup} g` })
    values.set(`ingredient:${g.id}:swell`, { recipeId: null, label: `${g.name}: swell`, value: `×${g.expansionRatio}` })
  }
  for (const s of specs) {
    values.set(`spec:${s.recipeId}:${s.sizeKey}`, { recipeId: s.recipeId, label: `${name(s.recipeId)}, ${s.sizeKey}: process time, dry amount, salt`, value: `${s.processMinutes ?? '—'} min, ${s.dryGrams ?? '—'} g, ${s.saltTsp ?? '—'} tsp` })
  }
  for (const b of bands) {
    values.set(`band:${b.recipeId}:${b.gaugeType}:${b.minFt}`, { recipeId: b.recipeId, label: `${name(b.recipeId)}, ${b.gaugeType} gauge from ${b.minFt.toLocaleString('en-US')} ft`, value: `${b.psi} psi up to ${b.maxFt.toLocaleString('en-US')} ft` })
  }
  return values
}

function changesBetween(before: Awaited<ReturnType<typeof referenceValues>>, after: Awaited<ReturnType<typeof referenceValues>>): Change[] {
  const changes: Change[] = []
  for (const [key, old] of before) {
    const now = after.get(key)
    if (!now) changes.push({ recipeId: old.recipeId, what: `${old.label}: ${old.value} removed` })
    else if (now.value !== old.value) changes.push({ recipeId: old.recipeId, what: `${old.label}: ${old.value} → ${now.value}` })
  }
  // A row new to a database that already held the reference data is a change too.
  if (before.size) {
    for (const [key, now] of after) if (!before.has(key)) changes.push({ recipeId: now.recipeId, what: `${now.label}: ${now.value} added` })
  }
  return changes
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
 * House recipes borrow a tested recipe's process table: they take its corrected minutes and
 * pressure bands too (their own dry amounts and salt stay theirs).
 */
async function followBasis(tx: Tx, publishedIds: string[]): Promise<void> {
  const house = await tx.select({ id: t.recipes.id, basis: t.recipes.basedOnRecipeId }).from(t.recipes)
    .where(and(isNotNull(t.recipes.householdId), inArray(t.recipes.basedOnRecipeId, publishedIds)))
  if (!house.length) return
  const specs = await tx.select().from(t.recipeJarSpecs).where(inArray(t.recipeJarSpecs.recipeId, publishedIds))
  const bands = await tx.select().from(t.recipePressureBands).where(inArray(t.recipePressureBands.recipeId, publishedIds))
  for (const recipe of house) {
    for (const spec of specs.filter(s => s.recipeId === recipe.basis)) {
      await tx.update(t.recipeJarSpecs).set({ processMinutes: spec.processMinutes })
        .where(and(eq(t.recipeJarSpecs.recipeId, recipe.id), eq(t.recipeJarSpecs.sizeKey, spec.sizeKey)))
    }
    await tx.delete(t.recipePressureBands).where(eq(t.recipePressureBands.recipeId, recipe.id))
    const own = bands.filter(b => b.recipeId === recipe.basis).map(b => ({ ...b, recipeId: recipe.id }))
    if (own.length) await tx.insert(t.recipePressureBands).values(own)
  }
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
