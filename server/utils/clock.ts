/**
 * The server's "now". Tests and development may move it forward to see a seal check fall due:
 * SHELFSTEAD_NOW_OFFSET_MS at start, or POST /api/dev/clock while running. Both are honoured
 * only under `nuxt dev` or when SHELFSTEAD_TEST_CLOCK=1 is set explicitly; a production server
 * without that flag always uses the real time.
 */
import { dateIn } from '~~/utils/time'
import { serverSettings } from './settings'

let offsetMs = 0
let initialised = false

export function clockAdjustable(): boolean {
  return serverSettings().clockAdjustable
}

function init() {
  if (initialised) return
  initialised = true
  const value = serverSettings().nowOffsetMs
  if (value === undefined) return
  if (!clockAdjustable()) {
    console.warn('[shelfstead] SHELFSTEAD_NOW_OFFSET_MS is ignored: set SHELFSTEAD_TEST_CLOCK=1 to allow moving the clock.')
    return
  }
  offsetMs = value
  console.warn(`[shelfstead] The server clock runs ${Math.round(value / 60_000)} minutes ahead (SHELFSTEAD_NOW_OFFSET_MS).`)
}

export function serverNow(): Date {
  init()
  return new Date(Date.now() + offsetMs)
}

export function clockOffsetMs(): number {
  init()
  return offsetMs
}

export function setClockOffset(ms: number): void {
  init()
  if (!clockAdjustable()) throw new Error('The clock may not be moved on this server.')
  offsetMs = ms
}

/** The household's calendar date now ("2026-12-02"), by the server clock, in its own time zone. */
export function householdToday(zone: string): string {
  return dateIn(serverNow(), zone)
}
