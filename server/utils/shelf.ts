import { randomUUID } from 'node:crypto'
import { and, desc, eq, gt, gte, inArray, isNull, sql } from 'drizzle-orm'
import { bestByStatus, fifo } from '~~/utils/after'
import { plural, pluralWord, shelfCorrectionCauseLabels } from '~~/utils/display'
import type { LabelQuery, ShelfCorrectionInput, TakeOffInput } from '~~/utils/schemas/shelf'
import type { Database, Tx } from './database'
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

/** The household's latest take-off not undone (corrections are not take-offs: Undo never reverses one). */
async function lastBatch(db: Database | Tx, householdId: string) {
  const m = tables.shelfMovements
  const [last] = await db.select({ batchId: m.batchId, movedAt: m.movedAt })
    .from(m)
    .where(and(eq(m.householdId, householdId), eq(m.kind, 'taken'), isNull(m.undoneAt)))
    .orderBy(desc(m.movedAt), desc(m.id))
    .limit(1)
  if (!last) return null
  const rows = await db.select({ lotId: m.lotId, jars: m.jars, product: tables.shelfLots.product, loadCode: tables.shelfLots.loadCode })
    .from(m).innerJoin(tables.shelfLots, eq(tables.shelfLots.id, m.lotId))
    .where(and(eq(m.batchId, last.batchId), eq(m.householdId, householdId)))
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
      badInput(`items.${i}.jars`, `Only ${plural(lot.jarsLeft, 'jar', 'jars')} of ${lot.product} (${lot.loadCode || 'imported'}) ${pluralWord(lot.jarsLeft, 'is', 'are')} left on the Shelf.`)
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
    await recordActivity(tx, { householdId, userId, kind: 'shelf', summary: `Took ${plural(jars, 'jar', 'jars')} off the Shelf (${products})`, detail: { batchId } })
  })
  return { batchId, ...(await listShelf(db, householdId)) }
}

/**
 * Undo the household's latest take-off: jars back on their lots, returned empty jars out of jar
 * stock. With `batchId` (the lot page's own take-off) only that take-off, and only while it is
 * the latest. A lot whose count was corrected after the take-off is not put back: the correction
 * already says how many jars are there.
 */
export async function undoLastTakeOff(db: Database, householdId: string, userId: string, batchId?: string) {
  const now = serverNow()
  await db.transaction(async (tx) => {
    const last = await lastBatch(tx, householdId)
    if (!last) conflict('There is no take-off to undo.')
    if (batchId && last.batchId !== batchId) conflict('That take-off was undone already, or jars have been taken off since; see the Shelf.')
    const m = tables.shelfMovements
    const [corrected] = await tx.select({ product: tables.shelfLots.product })
      .from(m).innerJoin(tables.shelfLots, eq(tables.shelfLots.id, m.lotId))
      .where(and(eq(m.householdId, householdId), eq(m.kind, 'correction'), isNull(m.undoneAt), gte(m.movedAt, last.movedAt), inArray(m.lotId, last.items.map(i => i.lotId))))
      .limit(1)
    if (corrected) conflict(`The count of ${corrected.product} was corrected after that take-off; put the count right with Correct on the Shelf instead.`)
    const moves = await tx.update(tables.shelfMovements).set({ undoneAt: now })
      .where(and(eq(tables.shelfMovements.batchId, last.batchId), eq(tables.shelfMovements.householdId, householdId), eq(tables.shelfMovements.kind, 'taken'), isNull(tables.shelfMovements.undoneAt)))
      .returning()
    if (!moves.length) conflict('That take-off was already undone.')
    for (const move of moves) {
      const [lot] = await tx.update(tables.shelfLots).set({ jarsLeft: sql`${tables.shelfLots.jarsLeft} + ${move.jars}`, updatedAt: now })
        .where(and(eq(tables.shelfLots.id, move.lotId), eq(tables.shelfLots.householdId, householdId))).returning()
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

/**
 * The lots a label sheet prints, oldest first: the chosen ones (of this household), one load's,
 * or the whole Shelf; each with the number of labels (one per jar left, or `count`).
 */
export async function labelLots(db: Database, householdId: string, query: Pick<LabelQuery, 'lots' | 'load' | 'count'>) {
  const { lots } = await listShelf(db, householdId)
  const ids = query.lots ? query.lots.split(',').map(s => s.trim()).filter(Boolean) : null
  const chosen = lots.filter(l => (!ids || ids.includes(l.id)) && (!query.load || l.loadId === query.load))
  return chosen.map(l => ({
    id: l.id, product: l.product, jarSizeName: l.jarSizeName, cannedOn: l.cannedOn, bestBy: l.bestBy, loadCode: l.loadCode, loadId: l.loadId,
    jars: l.jarsLeft, labels: query.count ?? l.jarsLeft,
  }))
}

/** One lot, as its jar label's QR code opens it: what it is, the jars left, and the latest take-off if it touched this lot. */
export async function shelfLot(db: Database, householdId: string, lotId: string) {
  const today = householdToday(await householdTimeZone(db, householdId))
  const [row] = await db.select({ lot: tables.shelfLots, jarSizeName: tables.jarSizes.name })
    .from(tables.shelfLots)
    .innerJoin(tables.jarSizes, eq(tables.jarSizes.id, tables.shelfLots.jarSizeId))
    .where(and(eq(tables.shelfLots.id, lotId), eq(tables.shelfLots.householdId, householdId)))
  if (!row) notFound('No such lot on this household\'s Shelf.')
  const { lot } = row
  const last = await lastBatch(db, householdId)
  return {
    today,
    lot: {
      id: lot.id, product: lot.product, jarSizeId: lot.jarSizeId, jarSizeName: row.jarSizeName, cannedOn: lot.cannedOn, bestBy: lot.bestBy,
      bestByStatus: bestByStatus(lot.bestBy, today), loadCode: lot.loadCode, loadId: lot.loadId, jarsIn: lot.jarsIn, jarsLeft: lot.jarsLeft,
    },
    lastTakeOff: last?.items.some(i => i.lotId === lotId) ? { batchId: last.batchId, movedAt: last.movedAt, jars: last.jars } : null,
  }
}

/**
 * Put a lot's count right without calling it use: a 'correction' movement (the jars that left,
 * negative when more were found) with the reason, the lot's new count and the activity record,
 * in one transaction. Jars thrown out but kept go back to jar stock empty; miscounted, broken or
 * lost jars and a lot recorded by mistake (never filled) leave jar stock as it is.
 */
export async function correctLot(db: Database, householdId: string, userId: string, lotId: string, body: ShelfCorrectionInput) {
  const now = serverNow()
  await db.transaction(async (tx) => {
    const [lot] = await tx.select().from(tables.shelfLots)
      .where(and(eq(tables.shelfLots.id, lotId), eq(tables.shelfLots.householdId, householdId))).for('update')
    if (!lot) notFound('No such lot on this household\'s Shelf.')
    const was = plural(lot.jarsLeft, 'jar', 'jars')
    if (body.jarsLeft === lot.jarsLeft) badInput('jarsLeft', `The Shelf already shows ${was} of ${lot.product}; enter the count it should show.`)
    const off = lot.jarsLeft - body.jarsLeft
    if (off < 0 && body.cause !== 'miscounted') badInput('jarsLeft', `Broken, lost or thrown-out jars leave the Shelf: enter fewer than the ${was} there now, or choose Miscounted.`)
    await tx.update(tables.shelfLots).set({ jarsLeft: body.jarsLeft, updatedAt: now }).where(eq(tables.shelfLots.id, lot.id))
    const returned = body.cause === 'discarded' ? off : 0
    const reason = body.note ? `${shelfCorrectionCauseLabels[body.cause]} — ${body.note}` : shelfCorrectionCauseLabels[body.cause]
    const batchId = randomUUID()
    await tx.insert(tables.shelfMovements).values({
      householdId, batchId, lotId: lot.id, jars: off, kind: 'correction', reason, jarsReturned: returned, movedAt: now, movedBy: userId,
    })
    if (returned) await addJarStock(tx, householdId, lot.jarSizeId, returned)
    const what = body.jarsLeft === 0 ? `Removed ${lot.product} (${lot.loadCode || 'imported'}) from the Shelf` : `Corrected ${lot.product} (${lot.loadCode || 'imported'}) from ${was} to ${plural(body.jarsLeft, 'jar', 'jars')}`
    await recordActivity(tx, {
      householdId, userId, kind: 'shelf', summary: `${what}: ${reason}`,
      detail: { batchId, lotId: lot.id, cause: body.cause, from: lot.jarsLeft, to: body.jarsLeft, jarsReturned: returned },
    })
  })
  return listShelf(db, householdId)
}
