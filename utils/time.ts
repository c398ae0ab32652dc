import { addDays } from 'date-fns'
import { formatInTimeZone, fromZonedTime } from 'date-fns-tz'

/**
 * Dates and times as a household reads them: always in the household's own time zone (an
 * IANA name such as "America/Denver"), never in the server's or the browser's. Pure: the
 * current instant is passed in (the server clock, which the test clock moves).
 */

const LOCAL_INPUT = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/
const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/

/** Whether `zone` is a time zone this runtime knows. */
export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone })
    return true
  }
  catch {
    return false
  }
}

/** Every time zone this runtime knows, for a picker; `current` is kept even if the list lacks it. */
export function timeZoneOptions(current?: string): Array<{ value: string, label: string }> {
  const zones = new Set(['UTC', ...Intl.supportedValuesOf('timeZone')])
  if (current) zones.add(current)
  return [...zones].sort().map(zone => ({ value: zone, label: zone.replaceAll('_', ' ') }))
}

/** The browser's (or server's) own time zone, when it is one we know; otherwise UTC. */
export function localTimeZone(): string {
  const zone = Intl.DateTimeFormat().resolvedOptions().timeZone
  return zone && isTimeZone(zone) ? zone : 'UTC'
}

/** The value of an `<input type="datetime-local">` showing `at` in `zone`. */
export function toLocalInput(at: Date | string, zone: string): string {
  return formatInTimeZone(at, zone, 'yyyy-MM-dd\'T\'HH:mm')
}

/** An `<input type="datetime-local">` value, read as a wall-clock time in `zone`, as an ISO instant. */
export function fromLocalInput(local: string, zone: string): string {
  return fromZonedTime(local, zone).toISOString()
}

export const isLocalInput = (value: unknown): value is string => typeof value === 'string' && LOCAL_INPUT.test(value)

/** The calendar date ("2026-12-02") of `at` in `zone`: the household's today when `at` is now. */
export function dateIn(at: Date | string, zone: string): string {
  return formatInTimeZone(at, zone, 'yyyy-MM-dd')
}

/** The calendar date after `date` ("2026-12-31" → "2027-01-01"). */
export function nextDay(date: string): string {
  return formatInTimeZone(addDays(new Date(`${date}T12:00:00Z`), 1), 'UTC', 'yyyy-MM-dd')
}

/** The instant a calendar day begins in `zone`. */
export function startOfDayIn(date: string, zone: string): Date {
  return fromZonedTime(`${date}T00:00`, zone)
}

/** "Dec 2, 2026" for a date ("2026-12-02") or an instant (shown on its date in `zone`). */
export function formatDate(value: string | null | undefined, zone: string): string {
  if (!value) return '—'
  const at = DATE_ONLY.test(value) ? new Date(`${value}T12:00:00Z`) : new Date(value)
  const timeZone = DATE_ONLY.test(value) ? 'UTC' : zone
  return at.toLocaleDateString('en-US', { month: 'short', day: 'numeric', year: 'numeric', timeZone })
}

/** "Wed, Dec 2, 7:30 PM" in `zone`. */
export function formatDateTime(value: string | Date | null | undefined, zone: string): string {
  if (!value) return '—'
  return new Date(value).toLocaleString('en-US', { weekday: 'short', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit', timeZone: zone })
}

/** "Wednesday, December 2, 7:30 PM MST": a time in an e-mail, with the zone's abbreviation. */
export function formatDateTimeLong(value: string | Date, zone: string): string {
  return new Date(value).toLocaleString('en-US', { weekday: 'long', month: 'long', day: 'numeric', hour: 'numeric', minute: '2-digit', timeZoneName: 'short', timeZone: zone })
}

/** "in 3 h", "5 h ago", measured from `now` (the server's clock). */
export function relativeHours(iso: string, now: string): string {
  const hours = Math.round((Date.parse(iso) - Date.parse(now)) / 3_600_000)
  if (hours === 0) return 'now'
  return hours > 0 ? `in ${hours} h` : `${-hours} h ago`
}

/**
 * A plan's step time ("2026-12-05T19:15:00", its own wall clock, maybe with an offset) as the
 * kitchen reads it: "7:15 PM". The wall clock is shown as
 * written, whatever the offset. "7:15 PM on Friday" with the weekday.
 */
export function formatWallClock(iso: string, withDay = false): string {
  const wall = new Date(`${iso.slice(0, 19)}Z`)
  const time = wall.toLocaleString('en-US', { hour: 'numeric', minute: '2-digit', timeZone: 'UTC' })
  return withDay ? `${time} on ${wall.toLocaleString('en-US', { weekday: 'long', timeZone: 'UTC' })}` : time
}

/** A plan's step time as an instant: its own offset when it has one, else wall-clock time in `zone`. */
export function wallToInstant(iso: string, zone: string): Date {
  return /(?:Z|[+-]\d{2}:\d{2})$/.test(iso) ? new Date(iso) : fromZonedTime(iso.slice(0, 19), zone)
}

/** "5 h", "5 h 20 min", "45 min": a length of time in whole minutes, read the same on every screen. */
export function formatDuration(minutes: number): string {
  const whole = Math.max(0, Math.round(minutes))
  const h = Math.floor(whole / 60)
  const m = whole % 60
  if (h === 0) return `${m} min`
  return m === 0 ? `${h} h` : `${h} h ${m} min`
}
