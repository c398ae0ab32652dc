/**
 * Scaling both ways between jars and dry goods, and from a household's consumption to jars.
 */
import { PlanningRefusal, requireNumber } from './errors'
import type { LineAmount } from './types'

/** Guard against floating-point noise when dividing grams by grams per jar (1 part in 10⁹). */
const COUNT_EPSILON = 1e-9

/** The most jars one plan may hold: more than a long canning day, so likely a typing slip. */
export const MAX_JARS_PER_PLAN = 2000

export interface JarsFromGoods {
  jars: number
  /** Dry grams not used by whole jars. */
  leftoverGrams: number
  /** The part of one more jar the leftover would fill (0 ≤ partJar < 1). */
  partJar: number
}

/** Jars → goods: total dry grams for `jars` jars. */
export const goodsForJars = (jars: number, perJarGrams: number): number => jars * perJarGrams

/** Goods → jars: whole jars the goods fill, the grams left over and the part-jar they'd make. */
export function jarsFromGoods(totalGrams: number, perJarGrams: number): JarsFromGoods {
  const exact = totalGrams / perJarGrams
  const jars = Math.floor(exact + COUNT_EPSILON)
  const leftoverGrams = Math.max(0, totalGrams - jars * perJarGrams)
  return { jars, leftoverGrams, partJar: Math.max(0, exact - jars) }
}

/**
 * Consumption → jars: jars per month × months, less the jars already on the shelf, rounded up
 * to whole jars (a household eating 1.5 jars a month for 3 months needs 5), never negative.
 */
export function jarsFromConsumption(jarsPerMonth: number, months: number, jarsOnShelf = 0): number {
  return Math.max(0, Math.ceil(jarsPerMonth * months - jarsOnShelf - COUNT_EPSILON))
}

export interface LineJars extends JarsFromGoods {
  /** Dry grams the household already has for this line (goods modes), else null. */
  suppliedGrams: number | null
  /** Jars eaten per month, when the line was planned from consumption. */
  jarsPerMonth: number | null
}

/**
 * The number of jars a line asks for, from any of the four amount modes. Refuses a request that
 * makes no jar (0 jars, goods for less than one jar, a shelf that already covers the need) with
 * a message that says why, and any negative or non-numeric amount.
 */
export function jarsForAmount(amount: LineAmount, perJarGrams: number, field: string, jarName: string): LineJars {
  const f = `${field}.amount`
  const none = { leftoverGrams: 0, partJar: 0, suppliedGrams: null, jarsPerMonth: null }
  let result: LineJars
  switch (amount.mode) {
    case 'jars':
      requireNumber(amount.jars, `${f}.jars`, 'The number of jars', { min: 1, integer: true })
      result = { ...none, jars: amount.jars }
      break
    case 'dryGrams':
    case 'packages': {
      let grams: number
      if (amount.mode === 'dryGrams') {
        grams = requireNumber(amount.grams, `${f}.grams`, 'The dry weight', { min: 0, above: true })
      }
      else {
        if (!Array.isArray(amount.packages) || amount.packages.length === 0) {
          throw new PlanningRefusal('List at least one package of dry goods.', `${f}.packages`)
        }
        grams = amount.packages.reduce((sum, p, i) => {
          requireNumber(p.grams, `${f}.packages[${i}].grams`, 'A package weight', { min: 0, above: true })
          requireNumber(p.count, `${f}.packages[${i}].count`, 'A package count', { min: 0, integer: true })
          return sum + p.grams * p.count
        }, 0)
      }
      const made = jarsFromGoods(grams, perJarGrams)
      if (made.jars === 0) {
        throw new PlanningRefusal(
          `${Math.round(grams)} g of dry goods fills less than one ${jarName} jar (one jar takes ${Math.round(perJarGrams)} g).`,
          f,
        )
      }
      result = { ...made, suppliedGrams: grams, jarsPerMonth: null }
      break
    }
    case 'consumption': {
      requireNumber(amount.jarsPerMonth, `${f}.jarsPerMonth`, 'Jars per month', { min: 0, above: true })
      requireNumber(amount.months, `${f}.months`, 'The number of months', { min: 0, above: true })
      const onShelf = amount.jarsOnShelf ?? 0
      requireNumber(onShelf, `${f}.jarsOnShelf`, 'Jars on the shelf', { min: 0, integer: true })
      const jars = jarsFromConsumption(amount.jarsPerMonth, amount.months, onShelf)
      if (jars === 0) {
        throw new PlanningRefusal(
          `The ${onShelf} jars on the shelf already cover ${amount.jarsPerMonth} a month for ${amount.months} months: `
          + 'nothing to can.',
          f,
        )
      }
      result = { ...none, jars, jarsPerMonth: amount.jarsPerMonth }
      break
    }
    default:
      throw new PlanningRefusal('Choose how to give the amount: jars, dry weight, packages or consumption.', f)
  }
  if (result.jars > MAX_JARS_PER_PLAN) {
    throw new PlanningRefusal(
      `${result.jars} jars is more than one plan can hold (${MAX_JARS_PER_PLAN}); split it into several canning days.`,
      f,
    )
  }
  return result
}
