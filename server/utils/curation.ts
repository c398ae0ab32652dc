/**
 * A site admin's care of the shared library of tested recipes: add one, correct one, retire or
 * restore one. Each write runs in one transaction that compares the published values before and
 * after it and keeps every changed value as a reference change with who, when, why and the
 * recipe's citation, so the recipe's history shows it and a saved plan that names the recipe (or
 * a house recipe borrowing its table) says what changed when it is opened.
 */
import { randomUUID } from 'node:crypto'
import { and, desc, eq, isNull } from 'drizzle-orm'
import { OPEN_BAND_FT, type SharedRecipeBody } from '~~/utils/schemas/curation'
import { serverNow } from './clock'
import type { Database, Db, Tx } from './database'
import { changesBetween, followBasis, referenceValues, type Change } from './referenceValues'

interface Actor { id: string }

/** Refuses a bean or jar size the catalogue does not hold, naming the field. */
async function checkReferences(tx: Tx, body: SharedRecipeBody) {
  const [ingredient] = await tx.select({ id: tables.ingredients.id }).from(tables.ingredients).where(eq(tables.ingredients.id, body.ingredientId))
  if (!ingredient) badInput('ingredientId', 'That bean is not in the ingredient list.')
  const sizes = new Set((await tx.select({ key: tables.jarSizes.sizeKey }).from(tables.jarSizes)).map(j => j.key))
  const unknown = body.jars.findIndex(j => !sizes.has(j.sizeKey))
  if (unknown >= 0) badInput(`jars.${unknown}.sizeKey`, 'That jar size is not in the jar catalogue.')
}

function recipeColumns(body: SharedRecipeBody) {
  return {
    name: body.name,
    packStyle: body.packStyle,
    ingredientId: body.ingredientId,
    headspaceMm: body.headspaceMm,
    solidsFillFraction: body.solidsFillFraction,
    fillBasis: body.fillBasis,
    summary: body.summary,
    steps: body.steps,
    source: body.source,
    caution: body.caution || null,
    prep: body.prep,
  }
}

/** Replaces the recipe's jar table and pressure bands with the ones sent. */
async function writeTables(tx: Tx, recipeId: string, body: SharedRecipeBody) {
  await tx.delete(tables.recipeJarSpecs).where(eq(tables.recipeJarSpecs.recipeId, recipeId))
  await tx.delete(tables.recipePressureBands).where(eq(tables.recipePressureBands.recipeId, recipeId))
  await tx.insert(tables.recipeJarSpecs).values(body.jars.map(j => ({ recipeId, sizeKey: j.sizeKey, processMinutes: j.processMinutes, dryGrams: j.dryGrams, saltTsp: j.saltTsp })))
  await tx.insert(tables.recipePressureBands).values(body.pressureBands.map(b => ({ recipeId, gaugeType: b.gaugeType, minFt: b.minFt, maxFt: b.maxFt ?? OPEN_BAND_FT, psi: b.psi, source: b.source })))
}

async function record(tx: Tx, changes: Change[], by: Actor, reason: string, source: string) {
  if (!changes.length) return
  const appliedAt = serverNow()
  await tx.insert(tables.referenceChanges).values(changes.map(c => ({ ...c, version: null, changedBy: by.id, reason, source, appliedAt })))
}

/** The shared recipe `id`, locked for the transaction; 404 when there is none. */
async function sharedRecipe(tx: Tx, id: string) {
  const [row] = await tx.select().from(tables.recipes)
    .where(and(eq(tables.recipes.id, id), isNull(tables.recipes.householdId))).for('update')
  if (!row) notFound('No such recipe in the shared library.')
  return row
}

export async function createSharedRecipe(db: Database, by: Actor, body: SharedRecipeBody) {
  return db.transaction(async (tx) => {
    await checkReferences(tx, body)
    await libraryChanged(tx)
    const id = `library-${randomUUID()}`
    const now = serverNow()
    await tx.insert(tables.recipes).values({ id, householdId: null, status: 'tested', ...recipeColumns(body), createdBy: by.id, createdAt: now, updatedAt: now })
    await writeTables(tx, id, body)
    await record(tx, [{ recipeId: id, what: `${body.name}: added to the shared library` }], by, body.reason, body.source)
    return { id, changes: [`${body.name}: added to the shared library`] }
  })
}

/**
 * Replaces a shared tested recipe's words and tables with the ones sent. House recipes that
 * borrow its table take the new times and pressures in the same transaction. Answers the lines
 * that changed (none when the recipe already read so).
 */
export async function updateSharedRecipe(db: Database, by: Actor, id: string, body: SharedRecipeBody) {
  return db.transaction(async (tx) => {
    const row = await sharedRecipe(tx, id)
    if (row.status !== 'tested') refusal('Only tested recipes are edited here: a shared house recipe borrows its time and pressure from a tested one.')
    await checkReferences(tx, body)
    await libraryChanged(tx)
    const before = await referenceValues(tx)
    await tx.update(tables.recipes).set({ ...recipeColumns(body), updatedAt: serverNow() }).where(eq(tables.recipes.id, id))
    await writeTables(tx, id, body)
    await followBasis(tx, [id])
    const changes = changesBetween(before, await referenceValues(tx))
    await record(tx, changes, by, body.reason, body.source)
    return { id, changes: changes.filter(c => c.recipeId === id).map(c => c.what) }
  })
}

/**
 * Takes a shared recipe out of the library (`retire`) or puts it back. A retired recipe stays
 * readable, so the plans that name it still open, but neither it nor a house recipe borrowing
 * its table is planned again until it is restored.
 */
export async function setRecipeRetired(db: Database, by: Actor, id: string, retire: boolean, reason: string) {
  return db.transaction(async (tx) => {
    const row = await sharedRecipe(tx, id)
    if (retire && row.retiredAt) conflict('This recipe is already retired.')
    if (!retire && !row.retiredAt) conflict('This recipe is in the library already.')
    await libraryChanged(tx)
    const before = await referenceValues(tx)
    await tx.update(tables.recipes).set({ retiredAt: retire ? serverNow() : null, retiredReason: retire ? reason : null, updatedAt: serverNow() })
      .where(eq(tables.recipes.id, id))
    const changes = changesBetween(before, await referenceValues(tx))
    await record(tx, changes, by, reason, row.source)
    return { id, changes: changes.filter(c => c.recipeId === id).map(c => c.what) }
  })
}

/**
 * The recipe's history, newest first: who changed what, when, why, citing what. The person's
 * name is shown to site admins; everyone else reads "a site admin". Corrections shipped with a
 * reference version say so.
 */
export async function recipeHistory(db: Db, recipeId: string, forAdmin: boolean) {
  const rows = await db.select({
    at: tables.referenceChanges.appliedAt,
    what: tables.referenceChanges.what,
    reason: tables.referenceChanges.reason,
    source: tables.referenceChanges.source,
    version: tables.referenceChanges.version,
    by: tables.users.name,
  }).from(tables.referenceChanges)
    .leftJoin(tables.users, eq(tables.users.id, tables.referenceChanges.changedBy))
    .where(eq(tables.referenceChanges.recipeId, recipeId))
    .orderBy(desc(tables.referenceChanges.appliedAt))
    .limit(200)
  return rows.map(r => ({
    at: r.at.toISOString(),
    what: r.what,
    reason: r.reason,
    source: r.source,
    by: r.version !== null ? `Reference data version ${r.version}` : forAdmin && r.by ? r.by : 'A site admin',
  }))
}
