/**
 * Field builders shared by every schema. Numbers are never coerced: an empty, blank or
 * malformed value ("", " ", null, false, [], "0x1F40") is refused with the field's own message,
 * never read as 0 or as some other number, because the planner's pressure and times come from
 * these values.
 */
import { PLAUSIBLE_YEARS } from '../defaults'
import { z } from './z'

interface NumberLimits {
  min?: number
  max?: number
  /** The message when below `min` (or at `min` when `above`). */
  low?: string
  high?: string
  /** Strictly more than `min`. */
  above?: boolean
  whole?: boolean
  /** The message for a fraction when `whole`. */
  fraction?: string
}

/** A JSON number, required, with one message for "missing or not a number" and one per limit. */
export function numberField(message: string, limits: NumberLimits = {}) {
  let field = z.number({ required_error: message, invalid_type_error: message })
  if (limits.whole) field = field.int(limits.fraction ?? message)
  if (limits.min !== undefined) field = limits.above ? field.gt(limits.min, limits.low ?? message) : field.min(limits.min, limits.low ?? message)
  if (limits.max !== undefined) field = field.max(limits.max, limits.high ?? message)
  return field
}

/** A whole number in the query string ("?page=2"): digits only, then the same limits. */
export function queryWholeNumber(message: string, min: number, max: number) {
  return z.string({ invalid_type_error: message })
    .trim()
    .regex(/^\d+$/, message)
    .transform(Number)
    .pipe(z.number().int(message).min(min, message).max(max, message))
}

/** The year of an ISO date or instant, in UTC, within `PLAUSIBLE_YEARS` (false when unreadable). */
export function inPlausibleYears(iso: string): boolean {
  const ms = Date.parse(iso)
  if (Number.isNaN(ms)) return false
  const year = new Date(ms).getUTCFullYear()
  return year >= PLAUSIBLE_YEARS.first && year <= PLAUSIBLE_YEARS.last
}
export const PLAUSIBLE_YEARS_MESSAGE = `Give a date between the years ${PLAUSIBLE_YEARS.first} and ${PLAUSIBLE_YEARS.last}.`

/** A YYYY-MM-DD that is a day of the calendar (JavaScript reads "2026-02-30" as 2 March). */
export function isCalendarDate(iso: string): boolean {
  const ms = Date.parse(`${iso}T00:00:00Z`)
  return !Number.isNaN(ms) && new Date(ms).toISOString().slice(0, 10) === iso
}
