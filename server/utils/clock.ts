/**
 * The server's "now". Tests and development may move it forward to see a seal check fall due:
 * SHELFSTEAD_NOW_OFFSET_MS at start, or POST /api/dev/clock while running. Both are honoured
 * only under `nuxt dev` or when SHELFSTEAD_TEST_CLOCK=1 is set explicitly; a production server
 * without that flag always uses the real time. A moved clock is kept in the database (table
 * test_clock), so every app server on one database runs on the same moved clock: each reads it
 * before a request and before sending reminders (`syncClock`).
 */
import { and, eq, gt } from 'drizzle-orm'
import { dateIn } from '~~/utils/time'
import { tables, type Db } from './database'
import { serverSettings } from './settings'

const CLOCK_ROW = 'offset'
/** A clock moved before this process started is not taken up: SHELFSTEAD_NOW_OFFSET_MS at start wins. */
const processStartedAt = new Date()

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

/** Move the clock for every server on this database. */
export async function setClockOffset(db: Db, ms: number): Promise<void> {
  init()
  if (!clockAdjustable()) throw new Error('The clock may not be moved on this server.')
  await db.insert(tables.testClock).values({ name: CLOCK_ROW, offsetMs: ms })
    .onConflictDoUpdate({ target: tables.testClock.name, set: { offsetMs: ms, updatedAt: new Date() } })
  offsetMs = ms
}

/** Take up a clock moved by another server on this database (a no-op unless the clock may move). */
export async function syncClock(db: Db): Promise<void> {
  init()
  if (!clockAdjustable()) return
  const [row] = await db.select({ offsetMs: tables.testClock.offsetMs }).from(tables.testClock)
    .where(and(eq(tables.testClock.name, CLOCK_ROW), gt(tables.testClock.updatedAt, processStartedAt)))
  if (row) offsetMs = row.offsetMs
}

/** The household's calendar date now ("2026-12-02"), by the server clock, in its own time zone. */
export function householdToday(zone: string): string {
  return dateIn(serverNow(), zone)
}
