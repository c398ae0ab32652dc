/** The Shelf as CSV and back: an export imports into the same Shelf without changing it. */
import { and, eq, inArray } from 'drizzle-orm'
import { parse } from 'csv-parse/sync'
import { stringify } from 'csv-stringify/sync'
import { bestByDate } from '~~/utils/after'
import { forgivingCsv, formulaSafeCsv, restoreCell } from '~~/utils/csv'
import { plural } from '~~/utils/display'
import { ShelfCsvRowSchema, shelfCsvColumns } from '~~/utils/schemas/shelf'
import { CONTROL_CHARACTER_MESSAGE, hasControlCharacter } from '~~/utils/schemas/text'
import { parseErrorMap } from '~~/utils/schemas/z'
import type { ShelfImportSkip } from '~~/utils/vocabulary'
import type { Database } from './database'
import { visibleRecipes } from './catalogue'
import { recordActivity } from './activity'
import { listShelf } from './shelf'

/** The Shelf as CSV, oldest first: the columns the import reads, each lot with its id; no cell opens as a formula. */
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
    lot_id: l.id,
  })), { ...formulaSafeCsv, header: true, columns: [...shelfCsvColumns] })
}

export interface CsvIssue { line: number, field: string, message: string }

const skipWords: Record<ShelfImportSkip, (n: number) => string> = {
  'on-shelf': n => `${plural(n, 'row is a lot', 'rows are lots')} already on the Shelf (an import never changes a lot; correct it on the Shelf)`,
  'gone': n => `${plural(n, 'row is a lot', 'rows are lots')} eaten or removed since (not put back)`,
}
const isUuid = (s: string) => /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(s)

/**
 * Import a Shelf inventory. A row naming one of this household's lots (an export read back)
 * adds nothing and is counted as skipped: its lot is on the Shelf, or was eaten or removed since.
 * A row naming any other lot id is refused (it is another household's lot, or one deleted, and
 * which of them is never said): empty its lot_id to add it as a new lot. Every other row is a new
 * lot, checked (columns, jar size, recipe, dates, counts); if any row is bad nothing is imported
 * and the answer lists each problem with its line number (the header is line 1).
 */
export async function importShelfCsv(db: Database, householdId: string, userId: string, text: string) {
  const now = serverNow()
  const today = householdToday(await householdTimeZone(db, householdId))
  let records: string[][]
  try {
    records = parse(text, forgivingCsv)
  }
  catch (error) {
    const line = (error as { lines?: number }).lines ?? 1
    return { issues: [{ line, field: 'csv', message: `This is not readable CSV: ${(error as Error).message}` }] as CsvIssue[] }
  }
  // Every cell, header included, before any is read: PostgreSQL text cannot hold a NUL.
  const broken = records.flatMap((record, r) => record.flatMap((cell, c) => hasControlCharacter(cell)
    ? [{ line: r + 1, field: r === 0 ? 'header' : (records[0]![c] ?? 'csv').toLowerCase().replace(/[^\w]/g, '') || 'csv', message: CONTROL_CHARACTER_MESSAGE }]
    : []))
  if (broken.length) return { issues: broken.slice(0, 50) as CsvIssue[] }
  const header = records[0]?.map(h => h.toLowerCase()) ?? []
  const missing = shelfCsvColumns.filter(c => ['product', 'jar_size', 'jars', 'canned_on'].includes(c) && !header.includes(c))
  if (!records.length || missing.length) {
    return { issues: [{ line: 1, field: 'header', message: `The first line must name the columns ${shelfCsvColumns.join(', ')} (missing: ${missing.join(', ') || 'all'}).` }] as CsvIssue[] }
  }
  if (records.length === 1) return { issues: [{ line: 2, field: 'csv', message: 'The file has a header but no jars.' }] as CsvIssue[] }
  if (records.length > 2001) return { issues: [{ line: 2002, field: 'csv', message: 'Import at most 2,000 lots at a time.' }] as CsvIssue[] }

  const cells = records.slice(1).map(record => Object.fromEntries(header.map((h, c) => [h, restoreCell(record[c] ?? '')])))
  const named = [...new Set(cells.map(raw => (raw.lot_id ?? '').trim()).filter(isUuid))]
  const [jarSizes, recipes, [household], known] = await Promise.all([
    db.select({ id: tables.jarSizes.id }).from(tables.jarSizes),
    db.select({ id: tables.recipes.id }).from(tables.recipes).where(visibleRecipes(householdId)),
    db.select().from(tables.households).where(eq(tables.households.id, householdId)),
    named.length
      ? db.select({ id: tables.shelfLots.id, jarsLeft: tables.shelfLots.jarsLeft }).from(tables.shelfLots)
          .where(and(eq(tables.shelfLots.householdId, householdId), inArray(tables.shelfLots.id, named)))
      : Promise.resolve([]),
  ])
  const ours = new Map(known.map(l => [l.id, l.jarsLeft]))
  const skipped: Record<ShelfImportSkip, number> = { 'on-shelf': 0, 'gone': 0 }
  const issues: CsvIssue[] = []
  const rows: Array<typeof tables.shelfLots.$inferInsert> = []
  cells.forEach((raw, i) => {
    const line = i + 2
    const jarsLeft = ours.get((raw.lot_id ?? '').trim().toLowerCase())
    if (jarsLeft !== undefined) {
      skipped[jarsLeft > 0 ? 'on-shelf' : 'gone'] += 1
      return
    }
    const parsed = ShelfCsvRowSchema.safeParse(raw, { errorMap: parseErrorMap })
    if (!parsed.success) {
      for (const issue of parsed.error.issues) issues.push({ line, field: String(issue.path[0] ?? 'row'), message: issue.message })
      return
    }
    const row = parsed.data
    const rowIssues: CsvIssue[] = []
    if (row.lot_id) rowIssues.push({ line, field: 'lot_id', message: 'This lot_id is not a lot of this household\'s Shelf. To add the row as a new lot, empty its lot_id cell.' })
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

  const jars = rows.reduce((s, r) => s + r.jarsIn!, 0)
  const skippedBecause = (Object.entries(skipped) as Array<[ShelfImportSkip, number]>)
    .filter(([, n]) => n > 0)
    .map(([reason, n]) => ({ reason, rows: n, message: skipWords[reason](n) }))
  const added = rows.length ? `Added ${plural(rows.length, 'lot', 'lots')} (${plural(jars, 'jar', 'jars')}).` : 'Added nothing: every row is a lot this Shelf knows.'
  const message = [added, ...skippedBecause.map(s => `Skipped: ${s.message}.`)].join(' ')
  if (rows.length) {
    await db.transaction(async (tx) => {
      await tx.insert(tables.shelfLots).values(rows)
      await recordActivity(tx, { householdId, userId, kind: 'shelf', summary: `Imported an inventory onto the Shelf: ${message}` })
    })
  }
  return { issues: [] as CsvIssue[], imported: rows.length, jars, skipped: skipped['on-shelf'] + skipped.gone, skippedBecause, message }
}
