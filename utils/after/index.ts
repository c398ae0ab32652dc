/**
 * After the canning day: the rules of the Logbook, the seal check and the Shelf, as plain
 * functions (no Vue, Nuxt or database) shared by the routes, the pages and the unit tests.
 *
 * Published basis (see shared/reference/canning-reference.md §2): cool jars 12–24 h, then test
 * the seals (USDA CG "Testing jar seals", MSU-PFS 01600951); reprocess an unsealed jar within
 * 24 h with a new lid and the same process time, or refrigerate it and eat it within several
 * days (CG "Reprocessing unsealed jars", MSU-PFS 01600593); use within about a year (OSU EM 9435).
 */
import { bandAltitude, pressureFor, processMinutesFor } from '../planning/process'
import { dateIn } from '../time'
import type { BestByStatus, SealCheckStatus } from '../vocabulary'
import type { GaugeType, JarSize, Recipe } from '../planning/types'

export const SEAL_CHECK_AFTER_HOURS = 12
export const SEAL_CHECK_BY_HOURS = 24
export const REPROCESS_WITHIN_HOURS = 24
/** Warn this many days before a lot's best-by date. */
export const NEAR_BEST_BY_DAYS = 30
export const DEFAULT_BEST_BY_MONTHS = 12

const HOUR_MS = 3_600_000
const DAY_MS = 86_400_000

export const UNSEALED_ADVICE = 'Reprocess within 24 hours of unloading with a new lid and the same process time, or refrigerate and eat within several days (USDA Complete Guide, "Reprocessing unsealed jars").'

/** "L-007": the load code written on labels. */
export function loadCode(number: number): string {
  return `L-${String(number).padStart(3, '0')}`
}

// ---------------------------------------------------------------------------
// What a load needed, and whether it got it

export interface RequiredProcess {
  psi: number
  minutes: number
  /** Where the figures come from, in words. */
  source: string
}

/**
 * The pressure and minutes a load needed: for each line the recipe's published time for the jar
 * size and pressure for the gauge type and altitude band, the load taking the highest of each
 * (as the planner times a mixed load by its longest process). Throws the planner's refusal
 * (PlanningRefusal) when no published table covers a line.
 */
export function requiredProcess(
  lines: ReadonlyArray<{ recipe: Recipe, jarSize: JarSize }>,
  jarSizes: readonly JarSize[],
  gaugeType: GaugeType,
  altitudeFt: number,
): RequiredProcess {
  const { feet } = bandAltitude(altitudeFt, 'altitudeFt')
  let psi = 0
  let minutes = 0
  const sources = new Set<string>()
  lines.forEach(({ recipe, jarSize }, i) => {
    minutes = Math.max(minutes, processMinutesFor(recipe, jarSize, jarSizes, `lines.${i}`).minutes)
    psi = Math.max(psi, pressureFor(recipe, gaugeType, feet, `lines.${i}.recipeId`))
    sources.add(recipe.source)
  })
  return { psi, minutes, source: `${gaugeType} gauge at ${feet.toLocaleString('en-US')} ft: ${[...sources].join('; ')}` }
}

export interface Shortfall {
  kind: 'under-processed' | 'no-published-process'
  message: string
}

/** Null when the load got at least the pressure and minutes it needed; else what went short and what to do. */
export function loadShortfall(
  used: { psi: number, minutes: number },
  required: { psi: number, minutes: number } | null,
  refusal?: string,
): Shortfall | null {
  if (!required) {
    return {
      kind: 'no-published-process',
      message: `No published process covers this load${refusal ? ` (${refusal})` : ''}. Do not shelve these jars: refrigerate and eat within several days, and ask your local extension office.`,
    }
  }
  const short: string[] = []
  if (used.psi < required.psi) short.push(`${fmt(used.psi)} psi instead of ${fmt(required.psi)} psi`)
  if (used.minutes < required.minutes) short.push(`${used.minutes} min instead of ${required.minutes} min`)
  if (!short.length) return null
  return {
    kind: 'under-processed',
    message: `Under-processed: ${short.join(' and ')}. These jars are not safe to shelve, sealed or not. `
      + `Reprocess within 24 hours of unloading with a new lid and the full time (${required.minutes} min at ${fmt(required.psi)} psi), or refrigerate and eat within several days.`,
  }
}

const fmt = (n: number) => (Number.isInteger(n) ? String(n) : n.toFixed(1))

// ---------------------------------------------------------------------------
// The seal-check window

export type { SealCheckStatus } from '../vocabulary'

export interface SealWindow {
  dueAt: Date
  byAt: Date
  reprocessBy: Date
  status: SealCheckStatus
}

/** Seal check due 12 h after a load comes out and expected by 24 h; reprocessing must start within 24 h. */
export function sealWindow(endedAt: Date, now: Date): SealWindow {
  const dueAt = new Date(endedAt.getTime() + SEAL_CHECK_AFTER_HOURS * HOUR_MS)
  const byAt = new Date(endedAt.getTime() + SEAL_CHECK_BY_HOURS * HOUR_MS)
  const reprocessBy = new Date(endedAt.getTime() + REPROCESS_WITHIN_HOURS * HOUR_MS)
  const status: SealCheckStatus = now < dueAt ? 'cooling' : now <= byAt ? 'due' : 'overdue'
  return { dueAt, byAt, reprocessBy, status }
}

// ---------------------------------------------------------------------------
// Dates

function parseDate(iso: string): { y: number, m: number, d: number } {
  const [y, m, d] = iso.slice(0, 10).split('-').map(Number) as [number, number, number]
  return { y, m, d }
}

/** A date `months` later; a day the target month lacks becomes its last day (31 Jan + 1 → 28/29 Feb). */
export function addMonths(iso: string, months: number): string {
  const { y, m, d } = parseDate(iso)
  const total = y * 12 + (m - 1) + months
  const ty = Math.floor(total / 12)
  const tm = total - ty * 12
  const last = new Date(Date.UTC(ty, tm + 1, 0)).getUTCDate()
  return `${String(ty).padStart(4, '0')}-${String(tm + 1).padStart(2, '0')}-${String(Math.min(d, last)).padStart(2, '0')}`
}

/** Best-by: the canned date plus the household's months (12 by default, "use within about a year"). */
export function bestByDate(cannedOn: string, months = DEFAULT_BEST_BY_MONTHS): string {
  return addMonths(cannedOn, months)
}

export function daysBetween(from: string, to: string): number {
  const a = parseDate(from)
  const b = parseDate(to)
  return Math.round((Date.UTC(b.y, b.m - 1, b.d) - Date.UTC(a.y, a.m - 1, a.d)) / DAY_MS)
}

export type { BestByStatus } from '../vocabulary'

/** 'past' after the best-by date, 'near' within 30 days of it (inclusive), else 'ok'. */
export function bestByStatus(bestBy: string, today: string): BestByStatus {
  const left = daysBetween(today, bestBy)
  if (left < 0) return 'past'
  return left <= NEAR_BEST_BY_DAYS ? 'near' : 'ok'
}

/** Oldest first: canned date, then best-by, then load code (product and jar size keep the order stable). */
export function fifo<T extends { cannedOn: string, bestBy: string, loadCode: string, product: string, jarSizeId: string }>(lots: readonly T[]): T[] {
  return [...lots].sort((a, b) => a.cannedOn.localeCompare(b.cannedOn) || a.bestBy.localeCompare(b.bestBy)
    || a.loadCode.localeCompare(b.loadCode) || a.product.localeCompare(b.product) || a.jarSizeId.localeCompare(b.jarSizeId))
}

// ---------------------------------------------------------------------------
// Seal rates

export interface SealRate {
  sealed: number
  unsealed: number
  /** sealed / (sealed + unsealed), or null before any check. */
  rate: number | null
}

export function sealRate(lines: ReadonlyArray<{ sealed: number | null, unsealed: number | null }>): SealRate {
  const sealed = lines.reduce((s, l) => s + (l.sealed ?? 0), 0)
  const unsealed = lines.reduce((s, l) => s + (l.unsealed ?? 0), 0)
  return { sealed, unsealed, rate: sealed + unsealed > 0 ? sealed / (sealed + unsealed) : null }
}

/** Seal rates grouped by a key (recipe, canner …), largest groups first. */
export function sealRatesBy<T extends { sealed: number | null, unsealed: number | null }>(
  lines: readonly T[],
  key: (line: T) => { id: string, name: string },
): Array<SealRate & { id: string, name: string }> {
  const groups = new Map<string, { name: string, lines: T[] }>()
  for (const line of lines) {
    if (line.sealed === null && line.unsealed === null) continue
    const k = key(line)
    const group = groups.get(k.id) ?? { name: k.name, lines: [] }
    group.lines.push(line)
    groups.set(k.id, group)
  }
  return [...groups.entries()]
    .map(([id, g]) => ({ id, name: g.name, ...sealRate(g.lines) }))
    .sort((a, b) => (b.sealed + b.unsealed) - (a.sealed + a.unsealed) || a.name.localeCompare(b.name))
}

// ---------------------------------------------------------------------------
// Stock over time and jars used per month

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
