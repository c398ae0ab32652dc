/**
 * The canning day: a start and end for every step of every load, and the preparation before it.
 *
 * Per load (CG "Using pressure canners"; MSU-PFS 01600948; EDIS HE8302): heat to venting 15 min,
 * vent 10, come up to pressure 5, process, cool naturally to zero (30 min for pints and smaller,
 * 45 for anything larger — a pint-and-a-half cools like a quart; household-adjustable), wait
 * 10 min with the weight off (or the petcock open), then open and unload (5). Each canner runs
 * its loads back to back: the next load starts when the previous one is unloaded, and its jars
 * are filled in the kitchen while the previous one processes. Several canners run side by side
 * from the same start.
 *
 * Before the start, in the kitchen lane, counted back from it: each recipe's preparation — for a
 * soaking recipe the overnight soak (12–18 h in a cool place) or the quick method (boil 2 min,
 * stand 1 h), then its cooking step (dried beans: drain and boil 30 min; CG Guide 4); for a
 * dry pack, sort and rinse — and then filling the jars of the first loads. Prep steps have
 * negative minutes; the soak also says the earliest it may start (18 h before it must end).
 *
 * Times: `startAt` keeps its own offset — "Z", "±hh:mm", or none for local wall-clock time —
 * and every step is written back with that same offset. Without `startAt` the day starts at
 * 08:00 wall-clock time on `today` (the household's date, given by the caller). A pure function has no
 * household time zone, so wall-clock times ignore daylight-saving changes within the day.
 */
import { PlanningRefusal } from './errors'
import type { GaugeType, RecipePrep, SoakMethod, StepMinutes } from './types'
import { ML_PER_QUART } from './units'

export const DEFAULT_STEP_MINUTES: Readonly<StepMinutes> = {
  heat: 15,
  vent: 10,
  pressurise: 5,
  waitAfterZero: 10,
  unload: 5,
}

export const DEFAULT_COOL_DOWN = { pint: 30, quart: 45 } as const

/**
 * Hydrating dried beans (CG Guide 4, "Beans or peas—shelled, dried"; reference §1.1): soak 12 to
 * 18 hours in a cool place, or boil 2 minutes and let stand 1 hour.
 */
export const SOAK_MINUTES = { overnightMin: 12 * 60, overnightMax: 18 * 60, quickBoil: 2, quickStand: 60 } as const
/** Filling one canner load of jars; sorting and rinsing dry-pack beans. Common practice, no published source. */
export const FILL_MINUTES = 15
export const RINSE_MINUTES = 15

export type LoadStepName = 'heat' | 'vent' | 'pressurise' | 'process' | 'cool' | 'wait' | 'unload'
export type PrepStepName = 'soak' | 'quick-boil' | 'stand' | 'cook' | 'rinse' | 'fill'
export type StepName = LoadStepName | PrepStepName
export const LOAD_STEPS: readonly LoadStepName[] = ['heat', 'vent', 'pressurise', 'process', 'cool', 'wait', 'unload']
/** The lane of the steps people do at the counter, beside the canners' lanes. */
export const KITCHEN_LANE = 'kitchen'

/** A load step in the words of the canner's gauge (CG "Using pressure canners"; the canner's manual decides the details). */
export function loadStepLabel(step: LoadStepName, gauge: GaugeType, psi: number): string {
  switch (step) {
    case 'heat': return 'Heat the canner until steam flows from the vent'
    case 'vent': return 'Vent steam 10 minutes, then close the vent'
    case 'pressurise': return gauge === 'dial'
      ? `Bring up until the dial reads ${psi} psi`
      : `Put the ${psi} psi weight on and bring up until it jiggles or rocks as the manual says`
    case 'process': return `Process at ${psi} psi`
    case 'cool': return gauge === 'dial'
      ? 'Turn off the heat; cool naturally until the dial reads zero'
      : 'Turn off the heat; cool naturally until the pressure is gone (the lid lock drops)'
    case 'wait': return gauge === 'dial'
      ? 'Open the petcock (or take the weight off) and wait 10 minutes'
      : 'Take the weight off and wait 10 minutes'
    case 'unload': return 'Open the lid away from you and lift the jars out'
  }
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
): Array<{ step: LoadStepName, minutes: number }> {
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
  /** The load the step belongs to (a fill step: the load being filled); 0 for a recipe's preparation. */
  load: number
  step: StepName
  label: string
  /** The canner's lane, or KITCHEN_LANE for preparation and filling. */
  lane: string
  /** The canner, for a load step; null in the kitchen. */
  cannerId: string | null
  /** For preparation: the planning recipe it prepares. */
  recipeId?: string
  start: string
  end: string
  /** Minutes from the start of canning (negative before it). */
  startMinute: number
  endMinute: number
  minutes: number
  /** The earliest the step may start, when it has a window (an overnight soak: 18 h before it ends). */
  earliestStart?: string
}

export interface Schedule {
  /** The start of canning (the first canner heating) and the latest end over every lane. */
  startAt: string
  endAt: string
  /** The first preparation step's start (the soak the evening before), or `startAt`. */
  prepStartAt: string
  steps: ScheduleStep[]
  /** Minutes of canning, from `startAt` to `endAt`. */
  totalMinutes: number
}

export interface ScheduleLoad {
  index: number
  cannerId: string
  processMinutes: number
  coolMinutes: number
  gaugeType: GaugeType
  pressurePsi: number
}

/** A recipe of the day to prepare: its planning id, the name shown, and its preparation. */
export interface ScheduleRecipe {
  id: string
  name: string
  prep: RecipePrep | null | undefined
}

/** The preparation steps of one recipe, in order, with their minutes (the last ends when filling starts). */
function prepSteps(recipe: ScheduleRecipe, soak: SoakMethod): Array<{ step: PrepStepName, label: string, minutes: number, window?: number }> {
  const prep = recipe.prep
  const out: Array<{ step: PrepStepName, label: string, minutes: number, window?: number }> = []
  if (prep && prep.soak !== 'none') {
    if (soak === 'overnight' && prep.soak === 'either') {
      out.push({ step: 'soak', label: `Soak the ${recipe.name}: 12–18 h in cold water in a cool place, then drain`, minutes: SOAK_MINUTES.overnightMin, window: SOAK_MINUTES.overnightMax })
    }
    else {
      out.push({ step: 'quick-boil', label: `Quick soak the ${recipe.name}: cover with water and boil 2 minutes`, minutes: SOAK_MINUTES.quickBoil })
      out.push({ step: 'stand', label: 'Take off the heat, cover and let stand 1 hour, then drain', minutes: SOAK_MINUTES.quickStand })
    }
  }
  if (prep?.cook) out.push({ step: 'cook', label: `${recipe.name.charAt(0).toUpperCase()}${recipe.name.slice(1)}: ${prep.cook.label}`, minutes: prep.cook.minutes })
  else if (!prep || prep.soak === 'none') out.push({ step: 'rinse', label: `Sort and rinse the ${recipe.name}`, minutes: RINSE_MINUTES })
  return out
}

/**
 * Lay out the day: each canner runs its loads in index order, back to back; the kitchen lane
 * prepares every recipe before the start and fills each load's jars in time (the first loads
 * just before the start, later ones while the load before them processes).
 */
export function buildSchedule(
  loads: readonly ScheduleLoad[],
  start: DayStart,
  steps: StepMinutes,
  recipes: readonly ScheduleRecipe[] = [],
  soak: SoakMethod = 'overnight',
): Schedule {
  const clock = new Map<string, number>()
  const out: ScheduleStep[] = []
  const at = (m: number) => timeAfter(start, m)
  const push = (s: Omit<ScheduleStep, 'start' | 'end' | 'endMinute'>) =>
    out.push({ ...s, start: at(s.startMinute), end: at(s.startMinute + s.minutes), endMinute: s.startMinute + s.minutes })

  for (const recipe of recipes) {
    const mine = prepSteps(recipe, soak)
    let t = -FILL_MINUTES - mine.reduce((sum, p) => sum + p.minutes, 0)
    for (const p of mine) {
      push({
        load: 0, step: p.step, label: p.label, lane: KITCHEN_LANE, cannerId: null, recipeId: recipe.id, startMinute: t, minutes: p.minutes,
        ...(p.window ? { earliestStart: at(t + p.minutes - p.window) } : {}),
      })
      t += p.minutes
    }
  }
  for (const load of [...loads].sort((a, b) => a.index - b.index)) {
    let t = clock.get(load.cannerId) ?? 0
    const first = !clock.has(load.cannerId)
    for (const { step, minutes } of loadSteps(load.processMinutes, load.coolMinutes, steps)) {
      // Fill this load's jars before the start (a first load), or while the load before it processes.
      if (step === 'heat') {
        const previous = out.findLast(s => s.lane === load.cannerId && s.step === 'process')
        push({ load: load.index, step: 'fill', label: `Fill the jars for load ${load.index}`, lane: KITCHEN_LANE, cannerId: null, startMinute: first || !previous ? -FILL_MINUTES : previous.startMinute, minutes: FILL_MINUTES })
      }
      push({ load: load.index, step, label: loadStepLabel(step, load.gaugeType, load.pressurePsi), lane: load.cannerId, cannerId: load.cannerId, startMinute: t, minutes })
      t += minutes
    }
    clock.set(load.cannerId, t)
  }
  out.sort((a, b) => a.startMinute - b.startMinute || (a.lane === KITCHEN_LANE ? -1 : 1))
  const totalMinutes = Math.max(0, ...clock.values())
  const prepStart = Math.min(0, ...out.map(s => s.startMinute))
  return { startAt: at(0), endAt: at(totalMinutes), prepStartAt: at(prepStart), steps: out, totalMinutes }
}
