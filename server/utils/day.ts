/**
 * The Canning day of a saved plan on the server: start it (the plan as computed now is frozen
 * into a snapshot), read it, and record each action taken on it. Every action is checked
 * against the day's state (utils/day/state.ts) inside a transaction that locks the day, so two
 * devices pressing at once are put in order and a step cannot be skipped. Taking a load's jars
 * out writes its Logbook entry in the same transaction, with the times as they happened.
 */
import { and, asc, eq, inArray } from 'drizzle-orm'
import { applyEvent, checkUndo, dayState, DayRefusal, OFFLINE_LIMIT_MS, type DayEvent, type DaySnapshot, type LoadState } from '~~/utils/day/state'
import { daySnapshot } from '~~/utils/day/snapshot'
import { loadCode } from '~~/utils/after'
import type { DayEventInput } from '~~/utils/schemas/day'
import { recordActivity } from './activity'
import { loadCanners } from './catalogue'
import { serverNow } from './clock'
import type { Database, Db, Tx } from './database'
import { createLoad } from './logLoad'
import { computePlan, requirePlan } from './plans'

/** Clock skew allowed between a device and the server for a time a device sends. */
const SKEW_MS = 60_000

async function eventsOf(db: Db, planId: string): Promise<Array<DayEvent & { loadId: string | null }>> {
  const rows = await db.select({
    id: tables.dayEvents.id, target: tables.dayEvents.target, kind: tables.dayEvents.kind, at: tables.dayEvents.at,
    undoes: tables.dayEvents.undoes, loadId: tables.dayEvents.loadId, by: tables.users.name,
  }).from(tables.dayEvents).leftJoin(tables.users, eq(tables.users.id, tables.dayEvents.byUser))
    .where(eq(tables.dayEvents.planId, planId)).orderBy(asc(tables.dayEvents.seq))
  return rows.map(r => ({ ...r, at: r.at.toISOString() }))
}

/**
 * The day as every device shows it: the snapshot, the state of each load and task, what each
 * action was, the Logbook entries written so far, and the server's clock (timers count from it).
 */
export async function readDay(db: Db, householdId: string, planId: string) {
  const plan = await requirePlan(db, householdId, planId)
  const [day] = await db.select().from(tables.canningDays)
    .where(and(eq(tables.canningDays.planId, planId), eq(tables.canningDays.householdId, householdId)))
  const now = serverNow().toISOString()
  if (!day) return { planId, planName: plan.name, started: false as const, now }
  const events = await eventsOf(db, planId)
  const loadIds = events.filter(e => e.loadId).map(e => e.loadId!)
  const logged = loadIds.length
    ? await db.select({ id: tables.canningLoads.id, number: tables.canningLoads.number, shortfall: tables.canningLoads.shortfall, confirmedAt: tables.canningLoads.confirmedAt, planLoadIndex: tables.canningLoads.planLoadIndex })
        .from(tables.canningLoads).where(and(inArray(tables.canningLoads.id, loadIds), eq(tables.canningLoads.householdId, householdId)))
    : []
  const decided = logged.length
    ? await db.select({ loadId: tables.sealChecks.loadId }).from(tables.sealChecks).where(inArray(tables.sealChecks.loadId, logged.map(l => l.id)))
    : []
  return {
    planId,
    planName: plan.name,
    started: true as const,
    now,
    startedAt: day.startedAt.toISOString(),
    snapshot: day.snapshot,
    state: dayState(day.snapshot, events),
    events: events.map(({ loadId: _loadId, ...e }) => e),
    logged: logged.map(l => ({
      loadId: l.id,
      code: loadCode(l.number),
      index: l.planLoadIndex,
      shortfall: l.shortfall,
      confirmed: l.confirmedAt !== null,
      decided: decided.some(d => d.loadId === l.id),
    })),
  }
}

/** Freeze the plan as computed now into the day; starting a day already started changes nothing. */
export async function startDay(db: Database, householdId: string, userId: string, planId: string) {
  const plan = await requirePlan(db, householdId, planId)
  const [result, canners] = await Promise.all([computePlan(db, householdId, plan.request), loadCanners(db, householdId)])
  const snapshot: DaySnapshot = daySnapshot(plan.name, result, Object.fromEntries(canners.map(c => [c.id, c.name])))
  await db.transaction(async (tx) => {
    const [made] = await tx.insert(tables.canningDays).values({ planId, householdId, snapshot, startedAt: serverNow(), startedBy: userId })
      .onConflictDoNothing().returning({ planId: tables.canningDays.planId })
    if (made) await recordActivity(tx, { householdId, userId, kind: 'plan', summary: `Started the canning day of ${plan.name}`, detail: { planId } })
  })
  return readDay(db, householdId, planId)
}

/** When the action happened: now, or the time an offline device kept (not in the future, not older than 12 h). */
function eventTime(sent: string | undefined, now: Date): Date {
  if (!sent) return now
  const at = new Date(sent)
  if (at.getTime() > now.getTime() + SKEW_MS) badInput('at', 'That time is later than now; check the device\'s clock.')
  if (at.getTime() < now.getTime() - OFFLINE_LIMIT_MS) refusal('That action was kept offline for more than 12 hours; do it again, or correct the Logbook.', 'at')
  return at.getTime() > now.getTime() ? now : at
}

/** The Logbook entry of a load whose jars just came out, from what the day recorded. */
async function logLoad(tx: Tx, householdId: string, userId: string, planId: string, snapshot: DaySnapshot, load: LoadState) {
  const planned = snapshot.loads.find(l => l.index === load.index)!
  const logged = await createLoad(tx, householdId, userId, {
    planId,
    planLoad: load.index,
    cannerId: planned.cannerId,
    lines: planned.contents.map(c => ({ recipeId: c.recipeId, jarSizeId: planned.jarSizeId, jars: c.jars, product: c.label.replace(/^\d+ × /, '') })),
    pressurePsi: planned.pressurePsi,
    processMinutes: load.processedMinutes ?? 0,
    startedAt: load.heatAt!,
    endedAt: load.outAt!,
    notes: load.drops.length ? `The pressure dropped ${load.drops.length} time${load.drops.length === 1 ? '' : 's'}; the process was timed again from the beginning each time.` : '',
  }, {
    ventStartedAt: load.ventAt ? new Date(load.ventAt) : null,
    pressureReachedAt: load.pressureReachedAt ? new Date(load.pressureReachedAt) : null,
    processStartedAt: load.processStartedAt ? new Date(load.processStartedAt) : null,
    processEndedAt: load.processEndedAt ? new Date(load.processEndedAt) : null,
    pressureDrops: load.drops,
  })
  return logged
}

/**
 * Record one action on the day. The same action sent twice (a device that was offline sends
 * its queue again) is stored once. Answers the day as it now stands.
 */
export async function recordDayEvent(db: Database, householdId: string, userId: string, planId: string, body: DayEventInput) {
  await db.transaction(async (tx) => {
    const [day] = await tx.select().from(tables.canningDays)
      .where(and(eq(tables.canningDays.planId, planId), eq(tables.canningDays.householdId, householdId))).for('update')
    if (!day) {
      await requirePlan(tx, householdId, planId)
      refusal('This canning day has not started yet: open the Canning day and start it.', 'planId')
    }
    const [seen] = await tx.select({ id: tables.dayEvents.id }).from(tables.dayEvents)
      .where(and(eq(tables.dayEvents.planId, planId), eq(tables.dayEvents.clientId, body.clientId)))
    if (seen) return
    const events = await eventsOf(tx, planId)
    const state = dayState(day.snapshot, events)
    const at = eventTime(body.at, serverNow()).toISOString()
    const event: DayEvent = { id: crypto.randomUUID(), target: body.target, kind: body.kind, at, by: null, undoes: null }
    let next = state
    try {
      if (body.kind === 'undo') event.undoes = checkUndo(state, events, body.target).id
      else next = applyEvent(day.snapshot, state, event)
    }
    catch (error) {
      if (error instanceof DayRefusal) conflict(error.message, 'kind')
      throw error
    }
    await tx.insert(tables.dayEvents).values({
      id: event.id, planId, householdId, target: event.target, kind: event.kind, at: new Date(at), undoes: event.undoes, clientId: body.clientId, byUser: userId,
    })
    if (body.kind === 'out') {
      const load = next.loads.find(l => `load:${l.index}` === body.target)!
      const logged = await logLoad(tx, householdId, userId, planId, day.snapshot, load)
      await tx.update(tables.dayEvents).set({ loadId: logged.id }).where(eq(tables.dayEvents.id, event.id))
      await recordActivity(tx, { householdId, userId, kind: 'load', summary: `Took load ${load.index} of ${day.snapshot.planName} out; the Canning day logged it as ${logged.code}`, detail: { loadId: logged.id, planId } })
    }
    if (body.kind === 'pressure-dropped') {
      await recordActivity(tx, { householdId, userId, kind: 'load', summary: `Pressure dropped in load ${body.target.slice(5)} of ${day.snapshot.planName}; its process is timed again from the beginning`, detail: { planId } })
    }
  })
  return readDay(db, householdId, planId)
}
