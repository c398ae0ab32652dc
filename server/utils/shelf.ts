import { randomUUID } from 'node:crypto'
import { and, desc, eq, gt, inArray, isNull, sql } from 'drizzle-orm'
import { parse } from 'csv-parse/sync'
import { stringify } from 'csv-stringify/sync'
import { bestByDate, bestByStatus, fifo } from '~~/utils/after'
import { ShelfCsvRowSchema, shelfCsvColumns, type TakeOffInput } from '~~/utils/schemas/shelf'
import type { Database, Tx } from './database'
import { visibleRecipes } from './catalogue'
import { fridgeList } from './sealCheck'
import { recordActivity } from './activity'

/** The Shelf: lots with jars left, oldest first, each with its best-by status; the refrigerator list; the last undoable take-off. */
export async function listShelf(db: Database, householdId: string, zone?: string) {
  const today = householdToday(zone ?? await householdTimeZone(db, householdId))
  const rows = await db.select({ lot: tables.shelfLots, jarSizeName: tables.jarSizes.name })
    .from(tables.shelfLots)
    .innerJoin(tables.jarSizes, eq(tables.jarSizes.id, tables.shelfLots.jarSizeId))
    .where(and(eq(tables.shelfLots.householdId, householdId), gt(tables.shelfLots.jarsLeft, 0)))
  const lots = fifo(rows.map(r => ({ ...r.lot, jarSizeName: r.jarSizeName, bestByStatus: bestByStatus(r.lot.bestBy, today) })))
  const byProduct = new Map<string, { product: string, jarSizeId: string, jarSizeName: string, jars: number, lots: number }>()
  for (const lot of lots) {
    const key = `${lot.product}|${lot.jarSizeId}`
    const g = byProduct.get(key) ?? { product: lot.product, jarSizeId: lot.jarSizeId, jarSizeName: lot.jarSizeName, jars: 0, lots: 0 }
    g.jars += lot.jarsLeft
    g.lots += 1
    byProduct.set(key, g)
  }
  return {
    today,
    lots,
    byProduct: [...byProduct.values()].sort((a, b) => b.jars - a.jars || a.product.localeCompare(b.product)),
    totalJars: lots.reduce((s, l) => s + l.jarsLeft, 0),
    fridge: await fridgeList(db, householdId),
    lastTakeOff: await lastBatch(db, householdId),
  }
}

async function lastBatch(db: Database | Tx, householdId: string) {
  const [last] = await db.select({ batchId: tables.shelfMovements.batchId, movedAt: tables.shelfMovements.movedAt })
    .from(tables.shelfMovements)
    .where(and(eq(tables.shelfMovements.householdId, householdId), isNull(tables.shelfMovements.undoneAt)))
    .orderBy(desc(tables.shelfMovements.movedAt), desc(tables.shelfMovements.id))
    .limit(1)
  if (!last) return null
  const rows = await db.select({ jars: tables.shelfMovements.jars, product: tables.shelfLots.product, loadCode: tables.shelfLots.loadCode })
    .from(tables.shelfMovements).innerJoin(tables.shelfLots, eq(tables.shelfLots.id, tables.shelfMovements.lotId))
    .where(eq(tables.shelfMovements.batchId, last.batchId))
  return { batchId: last.batchId, movedAt: last.movedAt, jars: rows.reduce((s, r) => s + r.jars, 0), items: rows }
}

async function addJarStock(tx: Tx, householdId: string, jarSizeId: string, jars: number) {
  await tx.insert(tables.jarStock).values({ householdId, jarSizeId, count: jars })
    .onConflictDoUpdate({ target: [tables.jarStock.householdId, tables.jarStock.jarSizeId], set: { count: sql`${tables.jarStock.count} + ${jars}`, updatedAt: serverNow() } })
}

/**
 * Take jars off the Shelf: one movement row per lot, all in one batch so undo restores them
 * together. The emptied jars go back to the household's jar stock unless `returnJars` is false.
 */
export async function takeOff(db: Database, householdId: string, userId: string, body: TakeOffInput) {
  const now = serverNow()
  const lots = await db.select().from(tables.shelfLots)
    .where(and(eq(tables.shelfLots.householdId, householdId), inArray(tables.shelfLots.id, body.items.map(i => i.lotId))))
  body.items.forEach((item, i) => {
    const lot = lots.find(l => l.id === item.lotId)
    if (!lot) return notFound('No such lot on this household\'s Shelf.')
    if (item.jars > lot.jarsLeft) {
      badInput(`items.${i}.jars`, `Only ${lot.jarsLeft} jars of ${lot.product} (${lot.loadCode || 'imported'}) are left on the Shelf.`)
    }
  })
  const batchId = randomUUID()
  await db.transaction(async (tx) => {
    for (const item of body.items) {
      const lot = lots.find(l => l.id === item.lotId)!
      const [updated] = await tx.update(tables.shelfLots)
        .set({ jarsLeft: sql`${tables.shelfLots.jarsLeft} - ${item.jars}`, updatedAt: now })
        .where(and(eq(tables.shelfLots.id, lot.id), sql`${tables.shelfLots.jarsLeft} >= ${item.jars}`))
        .returning({ id: tables.shelfLots.id })
      if (!updated) conflict(`Someone took jars of ${lot.product} off meanwhile; reload the Shelf and try again.`)
      await tx.insert(tables.shelfMovements).values({
        householdId, batchId, lotId: lot.id, jars: item.jars, jarsReturned: body.returnJars ? item.jars : 0, movedAt: now, movedBy: userId,
      })
      if (body.returnJars) await addJarStock(tx, householdId, lot.jarSizeId, item.jars)
    }
    const jars = body.items.reduce((sum, item) => sum + item.jars, 0)
    const products = [...new Set(body.items.map(item => lots.find(l => l.id === item.lotId)!.product))].join(', ')
    await recordActivity(tx, { householdId, userId, kind: 'shelf', summary: `Took ${jars} jar${jars === 1 ? '' : 's'} off the Shelf (${products})`, detail: { batchId } })
  })
  return { batchId, ...(await listShelf(db, householdId)) }
}

/** Undo the household's latest take-off: jars back on their lots, returned empty jars out of jar stock. */
export async function undoLastTakeOff(db: Database, householdId: string, userId: string) {
  const now = serverNow()
  await db.transaction(async (tx) => {
    const last = await lastBatch(tx, householdId)
    if (!last) conflict('There is no take-off to undo.')
    const moves = await tx.update(tables.shelfMovements).set({ undoneAt: now })
      .where(and(eq(tables.shelfMovements.batchId, last.batchId), eq(tables.shelfMovements.householdId, householdId), isNull(tables.shelfMovements.undoneAt)))
      .returning()
    if (!moves.length) conflict('That take-off was already undone.')
    for (const move of moves) {
      const [lot] = await tx.update(tables.shelfLots).set({ jarsLeft: sql`${tables.shelfLots.jarsLeft} + ${move.jars}`, updatedAt: now })
        .where(eq(tables.shelfLots.id, move.lotId)).returning()
      if (move.jarsReturned > 0) {
        const [stock] = await tx.update(tables.jarStock)
          .set({ count: sql`${tables.jarStock.count} - ${move.jarsReturned}`, updatedAt: now })
          .where(and(eq(tables.jarStock.householdId, householdId), eq(tables.jarStock.jarSizeId, lot!.jarSizeId), sql`${tables.jarStock.count} >= ${move.jarsReturned}`))
          .returning()
        if (!stock) {
          conflict('The empty jars from that take-off have been counted out of jar stock since; correct the jar stock on the Household page, then undo.')
        }
      }
    }
    await recordActivity(tx, { householdId, userId, kind: 'shelf', summary: 'Undid the last take-off from the Shelf', detail: { batchId: last.batchId } })
  })
  return listShelf(db, householdId)
}

/** The refrigerated jars were eaten: off the list, and the jars back to jar stock. */
export async function clearFridgeItem(db: Database, householdId: string, itemId: string) {
  const now = serverNow()
  await db.transaction(async (tx) => {
    const [item] = await tx.update(tables.fridgeItems).set({ clearedAt: now })
      .where(and(eq(tables.fridgeItems.id, itemId), eq(tables.fridgeItems.householdId, householdId), isNull(tables.fridgeItems.clearedAt)))
      .returning()
    if (!item) notFound('No such jar on this household\'s refrigerator list.')
    await addJarStock(tx, householdId, item.jarSizeId, item.jars)
  })
  return listShelf(db, householdId)
}

// ---------------------------------------------------------------------------
// CSV

/** The Shelf as CSV, oldest first: the same columns the import reads. */
export async function shelfCsv(db: Database, householdId: string): Promise<string> {
  const { lots } = await listShelf(db, householdId)
  return stringify(lots.map(l => ({
    product: l.product,
    recipe_id: l.recipeId ?? '',
    jar_size: l.jarSizeId,
    jars: l.jarsLeft,
    canned_on: l.cannedOn,
    best_by: l.bestBy,
    load_code: l.loadCode,
  })), { header: true, columns: [...shelfCsvColumns] })
}

export interface CsvIssue { line: number, field: string, message: string }

/**
 * Import a Shelf inventory. Every row is checked (columns, jar size, recipe, dates, counts);
 * if any row is bad nothing is imported and the answer lists each problem with its line number
 * (the header is line 1).
 */
export async function importShelfCsv(db: Database, householdId: string, text: string) {
  const now = serverNow()
  const today = householdToday(await householdTimeZone(db, householdId))
  let records: string[][]
  try {
    records = parse(text, { bom: true, skip_empty_lines: true, relax_column_count: true, trim: true })
  }
  catch (error) {
    const line = (error as { lines?: number }).lines ?? 1
    return { issues: [{ line, field: 'csv', message: `This is not readable CSV: ${(error as Error).message}` }] as CsvIssue[] }
  }
  const header = records[0]?.map(h => h.toLowerCase()) ?? []
  const missing = shelfCsvColumns.filter(c => ['product', 'jar_size', 'jars', 'canned_on'].includes(c) && !header.includes(c))
  if (!records.length || missing.length) {
    return { issues: [{ line: 1, field: 'header', message: `The first line must name the columns ${shelfCsvColumns.join(', ')} (missing: ${missing.join(', ') || 'all'}).` }] as CsvIssue[] }
  }
  if (records.length === 1) return { issues: [{ line: 2, field: 'csv', message: 'The file has a header but no jars.' }] as CsvIssue[] }
  if (records.length > 2001) return { issues: [{ line: 2002, field: 'csv', message: 'Import at most 2,000 lots at a time.' }] as CsvIssue[] }

  const [jarSizes, recipes, [household]] = await Promise.all([
    db.select({ id: tables.jarSizes.id }).from(tables.jarSizes),
    db.select({ id: tables.recipes.id }).from(tables.recipes).where(visibleRecipes(householdId)),
    db.select().from(tables.households).where(eq(tables.households.id, householdId)),
  ])
  const issues: CsvIssue[] = []
  const rows: Array<typeof tables.shelfLots.$inferInsert> = []
  records.slice(1).forEach((record, i) => {
    const line = i + 2
    const raw = Object.fromEntries(header.map((h, c) => [h, record[c] ?? '']))
    const parsed = ShelfCsvRowSchema.safeParse(raw)
    if (!parsed.success) {
      for (const issue of parsed.error.issues) issues.push({ line, field: String(issue.path[0] ?? 'row'), message: issue.message })
      return
    }
    const row = parsed.data
    const rowIssues: CsvIssue[] = []
    if (!jarSizes.some(j => j.id === row.jar_size)) rowIssues.push({ line, field: 'jar_size', message: `"${row.jar_size}" is not a jar size in the catalogue (for example pint-regular, quart-wide).` })
    if (row.recipe_id && !recipes.some(r => r.id === row.recipe_id)) rowIssues.push({ line, field: 'recipe_id', message: `"${row.recipe_id}" is not a recipe in your Recipe book; leave it empty if unsure.` })
    if (row.canned_on > today) rowIssues.push({ line, field: 'canned_on', message: 'The canned date is in the future.' })
    const bestBy = row.best_by ?? bestByDate(row.canned_on, household!.bestByMonths)
    if (bestBy <= row.canned_on) rowIssues.push({ line, field: 'best_by', message: 'The best-by date must come after the canned date.' })
    issues.push(...rowIssues)
    if (rowIssues.length) return
    rows.push({
      householdId, recipeId: row.recipe_id ?? null, product: row.product, jarSizeId: row.jar_size, loadCode: row.load_code,
      cannedOn: row.canned_on, bestBy, jarsIn: row.jars, jarsLeft: row.jars, source: 'import', shelvedAt: now,
    })
  })
  if (issues.length) return { issues }
  await db.transaction(async (tx) => {
    await tx.insert(tables.shelfLots).values(rows)
  })
  return { issues: [] as CsvIssue[], imported: rows.length, jars: rows.reduce((s, r) => s + r.jarsIn!, 0) }
}

/** The lots a label sheet prints: the chosen ones (of this household), or the whole Shelf, oldest first. */
export async function labelLots(db: Database, householdId: string, lotIds: string[] | null) {
  const { lots } = await listShelf(db, householdId)
  const chosen = lotIds ? lots.filter(l => lotIds.includes(l.id)) : lots
  return chosen.map(l => ({ id: l.id, product: l.product, jarSizeName: l.jarSizeName, cannedOn: l.cannedOn, bestBy: l.bestBy, loadCode: l.loadCode, jars: l.jarsLeft }))
}
