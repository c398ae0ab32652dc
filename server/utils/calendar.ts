/**
 * The canning day as an iCalendar file (RFC 5545, written by the `ics` package): every step of
 * every load and every kitchen task at its planned time, and each load's seal-check window
 * 12–24 hours after it comes out (USDA Complete Guide, "Cooling jars"). A day already under way
 * uses the times its loads really came out.
 */
import { createEvents, type EventAttributes } from 'ics'
import { SEAL_CHECK_AFTER_HOURS, SEAL_CHECK_BY_HOURS } from '~~/utils/after'
import { KITCHEN_LANE } from '~~/utils/planning'
import { wallToInstant } from '~~/utils/time'
import type { Database } from './database'
import { readDay } from './day'
import { computePlan, requirePlan } from './plans'

const H = 3_600_000

export async function planCalendar(db: Database, householdId: string, planId: string, zone: string): Promise<string> {
  const day = await readDay(db, householdId, planId)
  const planName = day.planName
  // Before the day starts, its times come from the plan as computed now.
  const result = day.started ? null : await computePlan(db, householdId, (await requirePlan(db, householdId, planId)).request)
  const at = (wall: string) => wallToInstant(wall, zone).getTime()
  const uid = (what: string) => `${planId}-${what}@shelfstead`
  const events: EventAttributes[] = []
  const steps = day.started
    ? [...day.snapshot.tasks.map(t => ({ key: t.key, label: t.label, start: t.plannedStart, end: t.plannedEnd, load: t.load, kitchen: true })),
        ...day.snapshot.planned.map(p => ({ key: `${p.load}-${p.step}`, label: p.label, start: p.start, end: p.end, load: p.load, kitchen: false }))]
    : result!.schedule.steps.map(s => ({ key: s.lane === KITCHEN_LANE ? `${s.recipeId ?? 'fill'}-${s.step}-${s.load}` : `${s.load}-${s.step}`, label: s.label, start: s.start, end: s.end, load: s.load, kitchen: s.lane === KITCHEN_LANE }))
  for (const s of steps) {
    events.push({
      uid: uid(s.key),
      start: at(s.start), startInputType: 'utc', startOutputType: 'utc',
      end: at(s.end), endInputType: 'utc', endOutputType: 'utc',
      title: s.load && !s.kitchen ? `Load ${s.load}: ${s.label}` : s.label,
      description: `${planName}. Follow the published process and your canner's manual.`,
      categories: ['Canning'],
    })
  }
  const loads = day.started ? day.snapshot.loads.map(l => l.index) : result!.loads.map(l => l.index)
  for (const index of loads) {
    const out = day.started ? day.state.loads.find(l => l.index === index)?.outAt : null
    const plannedOut = steps.filter(s => s.load === index && !s.kitchen).at(-1)?.end
    const outMs = out ? Date.parse(out) : plannedOut ? at(plannedOut) : null
    if (outMs === null) continue
    events.push({
      uid: uid(`seal-${index}`),
      start: outMs + SEAL_CHECK_AFTER_HOURS * H, startInputType: 'utc', startOutputType: 'utc',
      end: outMs + SEAL_CHECK_BY_HOURS * H, endInputType: 'utc', endOutputType: 'utc',
      title: `Check the seals of load ${index}`,
      description: `${planName}: test each lid 12–24 hours after the load came out (USDA Complete Guide, "Cooling jars"). Jars that did not seal: refrigerate, or reprocess within 24 hours.`,
      categories: ['Canning'],
    })
  }
  const { error, value } = createEvents(events, { productId: 'Shelfstead', calName: planName })
  if (error || !value) throw error ?? new Error('The calendar could not be written.')
  return value
}
