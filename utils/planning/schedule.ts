/**
 * The canning day: a start and end for every step of every load.
 *
 * Per load (CG "Using pressure canners"; MSU-PFS 01600948; EDIS HE8302): heat to venting 15 min,
 * vent 10, come up to pressure 5, process, cool naturally to zero (30 min for pints and smaller,
 * 45 for anything larger — a pint-and-a-half cools like a quart; household-adjustable), wait
 * 10 min with the weight off, then open and unload (5). Each canner runs its loads back to
 * back: the next load starts when the previous one is unloaded (its jars are filled
 * meanwhile). Several canners run side by side from the same start.
 *
 * Times: `startAt` keeps its own offset — "Z", "±hh:mm", or none for local wall-clock time —
 * and every step is written back with that same offset. Without `startAt` the day starts at
 * 08:00 wall-clock time on `today` (the household's date, given by the caller). A pure function has no
 * household time zone, so wall-clock times ignore daylight-saving changes within the day.
 */
import { PlanningRefusal } from './errors'
import type { StepMinutes } from './types'
import { ML_PER_QUART } from './units'

export const DEFAULT_STEP_MINUTES: Readonly<StepMinutes> = {
  heat: 15,
  vent: 10,
  pressurise: 5,
  waitAfterZero: 10,
  unload: 5,
}

export const DEFAULT_COOL_DOWN = { pint: 30, quart: 45 } as const

export type StepName = 'heat' | 'vent' | 'pressurise' | 'process' | 'cool' | 'wait' | 'unload'

const STEP_LABELS: Readonly<Record<StepName, string>> = {
  heat: 'Heat the canner to venting',
  vent: 'Vent steam',
  pressurise: 'Bring up to pressure',
  process: 'Process at pressure',
  cool: 'Cool naturally to zero',
  wait: 'Wait with the weight off',
  unload: 'Open and unload',
}

/** Natural cool-down for a jar size: the pint figure up to a pint, the quart figure above. */
export function coolDownMinutes(jarCapacityMl: number, cool: { pint: number, quart: number } = DEFAULT_COOL_DOWN): number {
  return jarCapacityMl <= (ML_PER_QUART / 2) * 1.001 ? cool.pint : cool.quart
}

/** The steps of one load with their minutes, in order. */
function loadSteps(
  processMinutes: number,
  coolMinutes: number,
  steps: StepMinutes,
): Array<{ step: StepName, minutes: number }> {
  return [
    { step: 'heat', minutes: steps.heat },
    { step: 'vent', minutes: steps.vent },
    { step: 'pressurise', minutes: steps.pressurise },
    { step: 'process', minutes: processMinutes },
    { step: 'cool', minutes: coolMinutes },
    { step: 'wait', minutes: steps.waitAfterZero },
    { step: 'unload', minutes: steps.unload },
  ]
}

/** Minutes from lighting the burner to the last jar out, for one load. */
export const loadMinutes = (processMinutes: number, coolMinutes: number, steps: StepMinutes): number =>
  loadSteps(processMinutes, coolMinutes, steps).reduce((s, x) => s + x.minutes, 0)

/** A start time as wall-clock milliseconds (read as if UTC) plus the offset text to write back. */
export interface DayStart {
  wallMs: number
  offset: string
}

const ISO = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?)?(Z|[+-]\d{2}:\d{2})?$/

/** Read an ISO date or date-time; a bare date means 08:00 that day. Refuses anything else. */
export function parseStart(startAt: string | undefined, today: string, field = 'startAt'): DayStart {
  const text = startAt ?? `${today}T08:00`
  const m = ISO.exec(text.trim())
  const parts = m ? [m[1], m[2], m[3], m[4] ?? '08', m[5] ?? '00', m[6] ?? '00'].map(Number) : []
  const [y = NaN, mo = NaN, d = NaN, h = NaN, mi = NaN, s = NaN] = parts
  const wall = Date.UTC(y, mo - 1, d, h, mi, s)
  const back = new Date(wall)
  const readBack = [back.getUTCFullYear(), back.getUTCMonth() + 1, back.getUTCDate(), back.getUTCHours(), back.getUTCMinutes()]
  const exact = Number.isFinite(wall) && readBack.every((v, i) => v === parts[i])
  if (!m || !exact) {
    throw new PlanningRefusal(`"${text}" is not a date and time; use a form like 2025-09-14T08:00.`, startAt ? field : 'today')
  }
  return { wallMs: wall, offset: m[7] ?? '' }
}

/** ISO text for `minutes` after the start, with the start's offset. */
function timeAfter(start: DayStart, minutes: number): string {
  return new Date(start.wallMs + minutes * 60_000).toISOString().slice(0, 19) + start.offset
}

export interface ScheduleStep {
  load: number
  step: StepName
  label: string
  cannerId: string
  start: string
  end: string
  /** Minutes from the start of the day. */
  startMinute: number
  endMinute: number
  minutes: number
}

export interface Schedule {
  startAt: string
  endAt: string
  steps: ScheduleStep[]
  totalMinutes: number
}

/** Lay out the loads' steps: each canner runs its loads in index order, back to back. */
export function buildSchedule(
  loads: ReadonlyArray<{ index: number, cannerId: string, processMinutes: number, coolMinutes: number }>,
  start: DayStart,
  steps: StepMinutes,
): Schedule {
  const clock = new Map<string, number>()
  const out: ScheduleStep[] = []
  for (const load of [...loads].sort((a, b) => a.index - b.index)) {
    let t = clock.get(load.cannerId) ?? 0
    for (const { step, minutes } of loadSteps(load.processMinutes, load.coolMinutes, steps)) {
      out.push({
        load: load.index,
        step,
        label: STEP_LABELS[step],
        cannerId: load.cannerId,
        start: timeAfter(start, t),
        end: timeAfter(start, t + minutes),
        startMinute: t,
        endMinute: t + minutes,
        minutes,
      })
      t += minutes
    }
    clock.set(load.cannerId, t)
  }
  const totalMinutes = Math.max(0, ...clock.values())
  return { startAt: timeAfter(start, 0), endAt: timeAfter(start, totalMinutes), steps: out, totalMinutes }
}
