/**
 * What a logged load needed, and whether it got it: the published pressure and minutes for its
 * lines (the planner's own tables), and the shortfall when the canner used less.
 */
import { bandAltitude, pressureFor, processMinutesFor } from '../planning/process'
import type { GaugeType, JarSize, Recipe } from '../planning/types'

/** "L-007": the load code written on labels. */
export function loadCode(number: number): string {
  return `L-${String(number).padStart(3, '0')}`
}

export interface RequiredProcess {
  psi: number
  minutes: number
  /** Where the figures come from, in words. */
  source: string
}

/**
 * The pressure and minutes a load needed: for each line the recipe's published time for the jar
 * size and pressure for the gauge type and altitude band, the load taking the highest of each
 * (as the planner times a mixed load by its longest process). Throws the planner's refusal
 * (PlanningRefusal) when no published table covers a line.
 */
export function requiredProcess(
  lines: ReadonlyArray<{ recipe: Recipe, jarSize: JarSize }>,
  jarSizes: readonly JarSize[],
  gaugeType: GaugeType,
  altitudeFt: number,
): RequiredProcess {
  const { feet } = bandAltitude(altitudeFt, 'altitudeFt')
  let psi = 0
  let minutes = 0
  const sources = new Set<string>()
  lines.forEach(({ recipe, jarSize }, i) => {
    minutes = Math.max(minutes, processMinutesFor(recipe, jarSize, jarSizes, `lines.${i}`).minutes)
    psi = Math.max(psi, pressureFor(recipe, gaugeType, feet, `lines.${i}.recipeId`))
    sources.add(recipe.source)
  })
  return { psi, minutes, source: `${gaugeType} gauge at ${feet.toLocaleString('en-US')} ft: ${[...sources].join('; ')}` }
}

export interface Shortfall {
  kind: 'under-processed' | 'no-published-process'
  message: string
}

/** Null when the load got at least the pressure and minutes it needed; else what went short and what to do. */
export function loadShortfall(
  used: { psi: number, minutes: number },
  required: { psi: number, minutes: number } | null,
  refusal?: string,
): Shortfall | null {
  if (!required) {
    return {
      kind: 'no-published-process',
      message: `No published process covers this load${refusal ? ` (${refusal})` : ''}. Do not shelve these jars: refrigerate and eat within several days, and ask your local extension office.`,
    }
  }
  const short: string[] = []
  if (used.psi < required.psi) short.push(`${fmt(used.psi)} psi instead of ${fmt(required.psi)} psi`)
  if (used.minutes < required.minutes) short.push(`${used.minutes} min instead of ${required.minutes} min`)
  if (!short.length) return null
  return {
    kind: 'under-processed',
    message: `Under-processed: ${short.join(' and ')}. These jars are not safe to shelve, sealed or not. `
      + `Reprocess within 24 hours of unloading with a new lid and the full time (${required.minutes} min at ${fmt(required.psi)} psi), or refrigerate and eat within several days.`,
  }
}

const fmt = (n: number) => (Number.isInteger(n) ? String(n) : n.toFixed(1))
