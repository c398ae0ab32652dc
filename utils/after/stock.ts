/** Jars on the Shelf over time and jars eaten per month, by month in the household's time zone. */
import { dateIn } from '../time'
import { addMonths } from './dates'

/** "2026-03" for an instant, in the household's time zone. */
export function monthKey(at: Date, zone: string): string {
  return dateIn(at, zone).slice(0, 7)
}

/** The last `count` month keys up to and including the month of `now`, oldest first. */
export function lastMonths(now: Date, zone: string, count: number): string[] {
  const current = `${monthKey(now, zone)}-01`
  return Array.from({ length: count }, (_, i) => addMonths(current, i - count + 1).slice(0, 7))
}

export interface StockEvent { at: Date, jars: number }

/**
 * Jars on the Shelf at the end of each of the last `count` months: every lot shelved adds its
 * jars, every take-off still standing (not undone) removes its jars.
 */
export function stockSeries(added: readonly StockEvent[], taken: readonly StockEvent[], now: Date, zone: string, count = 12): Array<{ month: string, jars: number }> {
  return lastMonths(now, zone, count).map((month) => {
    const upTo = (e: StockEvent) => monthKey(e.at, zone) <= month
    const jars = added.filter(upTo).reduce((s, e) => s + e.jars, 0) - taken.filter(upTo).reduce((s, e) => s + e.jars, 0)
    return { month, jars }
  })
}

/** Jars taken off the Shelf in each of the last `count` months. */
export function usedPerMonth(taken: readonly StockEvent[], now: Date, zone: string, count = 12): Array<{ month: string, jars: number }> {
  return lastMonths(now, zone, count).map(month => ({
    month,
    jars: taken.filter(e => monthKey(e.at, zone) === month).reduce((s, e) => s + e.jars, 0),
  }))
}

/**
 * What the household eats, for the planner: jars taken off per month, by product, over the
 * last 12 months or since the first take-off if that is more recent (at least one month).
 * Months are counted in whole calendar months including the current one.
 */
export function jarsPerMonthByProduct(
  taken: ReadonlyArray<StockEvent & { key: string, product: string, recipeId: string | null, jarSizeId: string }>,
  now: Date,
  zone: string,
  window = 12,
): Array<{ key: string, product: string, recipeId: string | null, jarSizeId: string, jars: number, months: number, jarsPerMonth: number }> {
  const months = lastMonths(now, zone, window)
  const inWindow = taken.filter(e => monthKey(e.at, zone) >= months[0]!)
  if (!inWindow.length) return []
  const first = inWindow.reduce((min, e) => (monthKey(e.at, zone) < min ? monthKey(e.at, zone) : min), months[months.length - 1]!)
  const span = Math.max(1, months.length - months.indexOf(first))
  const byKey = new Map<string, { product: string, recipeId: string | null, jarSizeId: string, jars: number }>()
  for (const e of inWindow) {
    const g = byKey.get(e.key) ?? { product: e.product, recipeId: e.recipeId, jarSizeId: e.jarSizeId, jars: 0 }
    g.jars += e.jars
    byKey.set(e.key, g)
  }
  return [...byKey.entries()]
    .map(([key, g]) => ({ key, ...g, months: span, jarsPerMonth: Math.round((g.jars / span) * 10) / 10 }))
    .sort((a, b) => b.jarsPerMonth - a.jarsPerMonth || a.product.localeCompare(b.product))
}

/**
 * Months the Shelf lasts at the household's rate, per product and jar size: jars on the shelf ÷
 * jars eaten a month (to one decimal). Products on the shelf that nobody has eaten yet have no
 * rate (null); products eaten but gone from the shelf have 0 months left.
 */
export function monthsOfSupply(
  eaten: ReadonlyArray<{ key: string, product: string, recipeId: string | null, jarSizeId: string, jarsPerMonth: number }>,
  onShelf: ReadonlyArray<{ product: string, jarSizeId: string, jars: number }>,
): Array<{ key: string, product: string, recipeId: string | null, jarSizeId: string, jarsPerMonth: number | null, onShelf: number, monthsLeft: number | null }> {
  const rows = eaten.map((e) => {
    const jars = onShelf.filter(s => `${s.product}|${s.jarSizeId}` === e.key).reduce((sum, s) => sum + s.jars, 0)
    return { ...e, onShelf: jars, monthsLeft: e.jarsPerMonth > 0 ? Math.round((jars / e.jarsPerMonth) * 10) / 10 : null }
  })
  const untouched = onShelf
    .filter(s => !eaten.some(e => e.key === `${s.product}|${s.jarSizeId}`))
    .map(s => ({ key: `${s.product}|${s.jarSizeId}`, product: s.product, recipeId: null, jarSizeId: s.jarSizeId, jarsPerMonth: null, onShelf: s.jars, monthsLeft: null }))
  return [...rows.map(r => ({ key: r.key, product: r.product, recipeId: r.recipeId, jarSizeId: r.jarSizeId, jarsPerMonth: r.jarsPerMonth as number | null, onShelf: r.onShelf, monthsLeft: r.monthsLeft })), ...untouched]
}
