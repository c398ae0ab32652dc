import { and, desc, eq, inArray, isNull } from 'drizzle-orm'
import { jarsPerMonthByProduct, monthsOfSupply, stockSeries, usedPerMonth } from '~~/utils/after'
import { openPlanStatuses } from '~~/utils/vocabulary'
import type { Database } from './database'
import { loadsAwaitingCheck } from './logbook'
import { sealRates } from './sealCheck'
import { listShelf } from './shelf'

/**
 * Everything the Pantry board shows, in one answer: the first steps of a new household, the Shelf by product, seal checks due,
 * plans in progress, jars near or past best-by, seal rates, stock over the last 12 months,
 * jars used per month, and the jars-per-month figure the Batch planner can use.
 */
export async function pantryBoard(db: Database, householdId: string) {
  const now = serverNow()
  const [household] = await db.select({ timeZone: tables.households.timeZone, altitudeFt: tables.households.altitudeFt }).from(tables.households).where(eq(tables.households.id, householdId))
  const zone = household!.timeZone
  const [shelf, checks, rates, plans, lots, moves, [canner]] = await Promise.all([
    listShelf(db, householdId, zone),
    loadsAwaitingCheck(db, householdId),
    sealRates(db, householdId),
    db.select({
      id: tables.plans.id, name: tables.plans.name, status: tables.plans.status, summary: tables.plans.summary, updatedAt: tables.plans.updatedAt,
      request: tables.plans.request, dayStartedAt: tables.canningDays.startedAt,
    })
      .from(tables.plans)
      .leftJoin(tables.canningDays, eq(tables.canningDays.planId, tables.plans.id))
      .where(and(eq(tables.plans.householdId, householdId), inArray(tables.plans.status, openPlanStatuses)))
      .orderBy(desc(tables.plans.updatedAt)),
    db.select({ shelvedAt: tables.shelfLots.shelvedAt, jarsIn: tables.shelfLots.jarsIn })
      .from(tables.shelfLots).where(eq(tables.shelfLots.householdId, householdId)),
    db.select({
      movedAt: tables.shelfMovements.movedAt, jars: tables.shelfMovements.jars, kind: tables.shelfMovements.kind,
      product: tables.shelfLots.product, recipeId: tables.shelfLots.recipeId, jarSizeId: tables.shelfLots.jarSizeId,
    })
      .from(tables.shelfMovements).innerJoin(tables.shelfLots, eq(tables.shelfLots.id, tables.shelfMovements.lotId))
      .where(and(eq(tables.shelfMovements.householdId, householdId), isNull(tables.shelfMovements.undoneAt))),
    db.select({ id: tables.canners.id }).from(tables.canners).where(eq(tables.canners.householdId, householdId)).limit(1),
  ])
  // Only jars taken off are use; a correction (miscounted, broken, removed) changes the stock, not what the household eats.
  const moved = moves.map(m => ({ at: m.movedAt, jars: m.jars, kind: m.kind, key: `${m.product}|${m.jarSizeId}`, product: m.product, recipeId: m.recipeId, jarSizeId: m.jarSizeId }))
  const taken = moved.filter(m => m.kind === 'taken')
  const eaten = jarsPerMonthByProduct(taken, now, zone)
  return {
    now,
    /** What a new household must do before the planner can give a process: enter the altitude, add a canner. */
    firstSteps: { altitudeSet: household!.altitudeFt !== null, hasCanner: Boolean(canner) },
    today: shelf.today,
    shelf: { totalJars: shelf.totalJars, byProduct: shelf.byProduct },
    sealChecksDue: checks.due,
    reprocessing: checks.reprocessing,
    // The Canning day is one tap away on the day itself: once started, or when the plan starts today.
    plansInProgress: plans.map(({ request, dayStartedAt, ...p }) => ({ ...p, canningDay: dayStartedAt !== null || request.startAt?.slice(0, 10) === shelf.today })),
    pastBestBy: shelf.lots.filter(l => l.bestByStatus === 'past'),
    nearBestBy: shelf.lots.filter(l => l.bestByStatus === 'near'),
    fridge: shelf.fridge,
    sealRates: rates,
    stockOverTime: stockSeries(lots.map(l => ({ at: l.shelvedAt, jars: l.jarsIn })), moved, now, zone),
    usedPerMonth: usedPerMonth(taken, now, zone),
    jarsUsedPerMonth: eaten,
    /** Months the Shelf lasts per product at that rate, for the board and the planner's jars-a-month mode. */
    supply: monthsOfSupply(eaten, shelf.byProduct),
  }
}
