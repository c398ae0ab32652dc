/**
 * Shelf dates: best-by from the canned date (use within about a year, OSU EM 9435), how near a
 * lot is to it, and oldest-first order. Dates are calendar dates ("2027-01-31"), read and
 * moved with date-fns.
 */
import { addMonths as addCalendarMonths, differenceInCalendarDays, format, parseISO } from 'date-fns'
import { DEFAULT_BEST_BY_MONTHS } from '../defaults'
import type { BestByStatus } from '../vocabulary'

/** Warn this many days before a lot's best-by date. */
const NEAR_BEST_BY_DAYS = 30

/** A date `months` later; a day the target month lacks becomes its last day (31 Jan + 1 → 28/29 Feb). */
export function addMonths(iso: string, months: number): string {
  return format(addCalendarMonths(parseISO(iso.slice(0, 10)), months), 'yyyy-MM-dd')
}

/** Best-by: the canned date plus the household's months (12 by default, "use within about a year"). */
export function bestByDate(cannedOn: string, months = DEFAULT_BEST_BY_MONTHS): string {
  return addMonths(cannedOn, months)
}

/** Whole calendar days from one date to another (negative when `to` is earlier); NaN for a malformed date. */
function daysBetween(from: string, to: string): number {
  return differenceInCalendarDays(parseISO(to.slice(0, 10)), parseISO(from.slice(0, 10)))
}

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
