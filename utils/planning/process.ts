/**
 * Process time by jar size, pressure by gauge type and altitude, and the dial-gauge test check.
 */
import { differenceInCalendarDays, parseISO } from 'date-fns'
import { PlanningRefusal, caution, info, type PlanWarning } from './errors'
import type { Canner, GaugeType, JarSize, Recipe } from './types'

export interface ProcessTimeResult {
  minutes: number
  /** The jar key whose time is used. */
  fromJarKey: string
  /** True when a smaller jar takes the next larger size's time. */
  borrowed: boolean
}

/**
 * Process minutes for a jar. A jar with its own time uses it. A smaller jar without one takes the
 * time of the next LARGER size the recipe lists (Iowa State AnswerLine 2019: half-pints use the
 * pint time) — never the reverse: a jar larger than every tested size is refused, since a time
 * "cannot be extended by any formula" (Penn State Extension; NCHFP). Listed jar keys that the jar
 * catalogue does not know cannot be compared by size and are skipped.
 */
export function processMinutesFor(
  recipe: Recipe,
  jar: JarSize,
  jarSizes: readonly JarSize[],
  field: string,
): ProcessTimeResult {
  const own = recipe.processMinutes.find(p => p.jarKey === jar.key)
  if (own) return { minutes: own.minutes, fromJarKey: jar.key, borrowed: false }
  const listed = recipe.processMinutes
    .map(p => ({ p, size: jarSizes.find(j => j.key === p.jarKey) }))
    .filter((x): x is { p: (typeof recipe.processMinutes)[number], size: JarSize } => x.size !== undefined)
    .sort((a, b) => a.size.capacityMl - b.size.capacityMl)
  const larger = listed.find(x => x.size.capacityMl >= jar.capacityMl)
  if (larger) return { minutes: larger.p.minutes, fromJarKey: larger.p.jarKey, borrowed: true }
  const largest = listed[listed.length - 1]
  if (!largest) {
    throw new PlanningRefusal(`${recipe.name} has no process time for any jar size.`, `${field}.recipeId`)
  }
  throw new PlanningRefusal(
    `There is no tested process time for ${jar.name} jars of ${recipe.name}. Published times stop at `
    + `${largest.size.name} jars, and a process time "cannot be extended by any formula" to a larger jar `
    + `(Penn State Extension; NCHFP). Choose ${largest.size.name} jars or smaller.`,
    `${field}.jarSizeId`,
  )
}

/** Altitudes below this are taken to be a typing slip (the lowest inhabited land is about −1,400 ft). */
const LOWEST_ALTITUDE_FT = -1500

/** A household that has not entered its altitude gets no pressure: the published bands depend on it. */
export const NO_ALTITUDE = 'Your household has no altitude yet, and the canner pressure depends on it. '
  + 'Enter it on the Household page (a map or your local extension office can tell you the altitude of your kitchen).'

/**
 * The altitude used to look up a pressure band, in whole feet. A fractional altitude is rounded
 * UP (2,000.5 ft → 2,001 ft → the higher band), so rounding can only add pressure. Below sea level
 * the 0-ft band applies: the air pressure is higher there, so the sea-level setting gives at least
 * the published temperature.
 */
export function bandAltitude(altitudeFt: number | null | undefined, field: string): { feet: number, warnings: PlanWarning[] } {
  if (altitudeFt === null || altitudeFt === undefined) throw new PlanningRefusal(NO_ALTITUDE, field)
  if (typeof altitudeFt !== 'number' || !Number.isFinite(altitudeFt)) {
    throw new PlanningRefusal('Enter the altitude of your kitchen in feet.', field)
  }
  if (altitudeFt < LOWEST_ALTITUDE_FT) {
    throw new PlanningRefusal(`An altitude of ${altitudeFt} ft is below any inhabited place; check the altitude.`, field)
  }
  const feet = Math.ceil(altitudeFt)
  if (feet < 0) {
    const note = info('below-sea-level', `Below sea level the sea-level pressure applies (${altitudeFt} ft).`, field)
    return { feet: 0, warnings: [note] }
  }
  return { feet, warnings: [] }
}

/**
 * Gauge pressure in psi for a recipe, gauge type and altitude: the band whose inclusive range
 * [minFt, maxFt] holds the altitude. Outside every band the planner refuses: above the highest
 * dial band (8,000 ft in the USDA tables) there is no published value to fall back on.
 */
export function pressureFor(recipe: Recipe, gaugeType: GaugeType, feet: number, field: string, cannerName?: string): number {
  const bands = recipe.pressureBands.filter(b => b.gaugeType === gaugeType)
  const band = bands.find(b => b.minFt <= feet && feet <= b.maxFt)
  if (band) return band.psi
  const top = Math.max(...bands.map(b => b.maxFt))
  if (bands.length > 0 && feet > top) {
    throw new PlanningRefusal(
      `No published ${gaugeType}-gauge pressure above ${top.toLocaleString('en-US')} ft for ${recipe.name} `
      + `(your altitude: ${feet.toLocaleString('en-US')} ft). `
      + (gaugeType === 'dial' ? 'Use a weighted-gauge canner if its table covers your altitude, or ' : '')
      + 'consult your local extension office before canning.'
      + (cannerName ? ` (Canner: ${cannerName}.)` : ''),
      field,
    )
  }
  throw new PlanningRefusal(
    `${recipe.name} gives no ${gaugeType}-gauge pressure for ${feet.toLocaleString('en-US')} ft; `
    + 'consult your local extension office before canning.',
    field,
  )
}

/** The pressure at the lowest band for this gauge type (the sea-level setting). */
export function seaLevelPsi(recipe: Recipe, gaugeType: GaugeType): number | undefined {
  const bands = recipe.pressureBands.filter(b => b.gaugeType === gaugeType)
  return bands.sort((a, b) => a.minFt - b.minFt)[0]?.psi
}

/** Whole calendar days from date `a` to date `b` (ISO date strings), or null if either is unreadable. */
function daysBetween(a: string, b: string): number | null {
  const days = differenceInCalendarDays(parseISO(b.slice(0, 10)), parseISO(a.slice(0, 10)))
  return Number.isNaN(days) ? null : days
}

/**
 * A dial gauge should be tested for accuracy every year (PNW 421; Illinois Extension). Warn when
 * the canner has a dial gauge and no test date, an unreadable one, or one more than 365 days
 * before `today`. Weighted gauges need no test (University of Missouri Extension).
 */
export function gaugeTestWarning(canner: Canner, today: string, field: string): PlanWarning | null {
  if (canner.gaugeType !== 'dial') return null
  const days = canner.lastGaugeTestAt ? daysBetween(canner.lastGaugeTestAt, today) : null
  if (days !== null && days <= 365) return null
  const when = days === null ? 'has no recorded accuracy test' : `was last tested ${canner.lastGaugeTestAt}`
  return caution(
    'gauge-test-due',
    `The dial gauge of ${canner.name} ${when}. Have it tested before canning (yearly; replace it if it `
    + 'reads more than 2 psi off). Local extension offices often test gauges.',
    field,
  )
}
