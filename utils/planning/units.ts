/**
 * Units at the edges. Everything inside the planner is SI (mL, g, mm); conversions to US
 * customary go through `convert-units`, and kitchen measures are rounded with `fraction.js`.
 *
 * Note: convert-units 2.3.4 carries slightly rounded anchors (1 lb = 453.592 g instead of
 * 453.59237 g; 1 US cup = 236.588237 mL instead of 236.5882365 mL). The differences are below
 * one part in a million and far below any kitchen measure, so we use the library as is.
 */
import convert from 'convert-units'
import Fraction from 'fraction.js'
import type { UnitSystem } from './types'

export const ML_PER_CUP = convert(1).from('cup').to('ml')
export const ML_PER_TBSP = convert(1).from('Tbs').to('ml')
export const ML_PER_TSP = convert(1).from('tsp').to('ml')
export const ML_PER_QUART = convert(1).from('qt').to('ml')
export const GRAMS_PER_LB = convert(1).from('lb').to('g')

/**
 * Table salt, grams per US teaspoon: 6.0 g (USDA SR Legacy "Salt, table", NDB 02047).
 * Canning salt measures the same by volume; published gram figures for it range 4.6–7.1 g.
 */
export const SALT_GRAMS_PER_TSP = 6

/** Conversions at the edges, all through convert-units. */
export const mlToCups = (ml: number): number => convert(ml).from('ml').to('cup')
export const gramsToLb = (g: number): number => convert(g).from('g').to('lb')
export const lbToGrams = (lb: number): number => convert(lb).from('lb').to('g')
export const mmToInches = (mm: number): number => convert(mm).from('mm').to('in')
export const inchesToMm = (inches: number): number => convert(inches).from('in').to('mm')

export type KitchenUnit = 'cup' | 'tsp'

/** A kitchen measure rounded to the nearest eighth, with "scant"/"heaping" when it matters. */
export interface KitchenMeasure {
  /** The exact amount in `unit`. */
  value: number
  /** The amount rounded to the nearest 1/8 of `unit`. */
  rounded: number
  unit: KitchenUnit
  /** Plain-text fraction of `rounded`, e.g. "1 1/2". */
  fraction: string
  /** "scant" when the rounded measure is over 5 % more than the amount, "heaping" when under. */
  qualifier: 'scant' | 'heaping' | null
  /** For display, e.g. "scant ½ cup". */
  text: string
}

/**
 * x as an exact fraction rounded to the nearest 1/8. The value goes in as a 9-decimal string:
 * fraction.js reads that exactly and at once, whereas its float reader searches continued
 * fractions and takes tens of milliseconds for a float a hair off a simple fraction (the pint
 * cap is 0.4999999985 cup by convert-units' factors).
 */
const toEighths = (x: number): Fraction => new Fraction(x.toFixed(9)).roundTo('1/8')

const GLYPHS: Record<string, string> = {
  '1/8': '⅛',
  '1/4': '¼',
  '3/8': '⅜',
  '1/2': '½',
  '5/8': '⅝',
  '3/4': '¾',
  '7/8': '⅞',
}

/** "1½", "⅜", "2" for a multiple of 1/8. */
function glyphText(f: Fraction): string {
  const whole = f.floor()
  const part = f.sub(whole)
  const wholeText = whole.n === 0n ? '' : whole.toString()
  if (part.n === 0n) return wholeText || '0'
  return wholeText + (GLYPHS[`${part.n}/${part.d}`] ?? part.toFraction())
}

/**
 * Round an amount to the nearest 1/8 cup or 1/8 tsp. If the rounding moves the amount by more
 * than 5 %, the measure is called "scant" (the real amount is a little less than the spoon or
 * cup shows) or "heaping" (a little more). An amount under 1/16 rounds to nothing: it is shown
 * as "less than ⅛" rather than as zero, so a non-zero amount never disappears.
 */
export function kitchenMeasure(value: number, unit: KitchenUnit): KitchenMeasure {
  if (value <= 0) {
    return { value: 0, rounded: 0, unit, fraction: '0', qualifier: null, text: `0 ${unit}` }
  }
  const f = toEighths(value)
  const rounded = f.valueOf()
  if (rounded === 0) {
    return { value, rounded, unit, fraction: '0', qualifier: null, text: `less than ⅛ ${unit}` }
  }
  const label = unit === 'cup' && rounded > 1 ? 'cups' : unit
  const change = (rounded - value) / value
  const qualifier = change > 0.05 ? 'scant' : change < -0.05 ? 'heaping' : null
  const text = `${qualifier ? `${qualifier} ` : ''}${glyphText(f)} ${label}`
  return { value, rounded, unit, fraction: f.toFraction(true), qualifier, text }
}

const grouped = (x: number, digits = 0): string =>
  x.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits })

const pluralRules = new Intl.PluralRules('en-US')

/**
 * "1 jar", "2 jars", "1,200 jars": a count and its noun, the plural chosen by Intl.PluralRules.
 * `plural` defaults to the noun + "s"; give it for nouns that change otherwise ("1 box", "2 boxes").
 */
export function countOf(n: number, noun: string, plural = `${noun}s`): string {
  return `${grouped(n, Number.isInteger(n) ? 0 : 1)} ${pluralRules.select(n) === 'one' ? noun : plural}`
}

/** Weight for display: "340 g" / "1.47 kg", or "12 oz" / "3 lb 4 oz" to the nearest ounce. */
export function formatMass(grams: number, system: UnitSystem): string {
  if (system === 'metric') return grams < 1000 ? `${grouped(grams)} g` : `${grouped(grams / 1000, 2)} kg`
  const ounces = Math.round(convert(grams).from('g').to('oz'))
  const lb = Math.floor(ounces / 16)
  const oz = ounces % 16
  if (lb === 0) return `${oz} oz`
  return oz === 0 ? `${lb} lb` : `${lb} lb ${oz} oz`
}

/**
 * Liquid volume for display: cups as a kitchen fraction below a quart, else quarts to one
 * decimal (US; a quart bottle reads "1.0 qt", not "4 cups"); mL to the nearest 5 below a
 * litre, else litres to two decimals (metric).
 */
export function formatVolume(ml: number, system: UnitSystem): string {
  if (system === 'metric') {
    return ml < 1000 ? `${grouped(Math.round(ml / 5) * 5)} mL` : `${grouped(ml / 1000, 2)} L`
  }
  const cups = mlToCups(ml)
  if (cups < 3.99) return kitchenMeasure(cups, 'cup').text
  // Jugs are sold by the gallon: a whole number of gallons reads as such, not as "4.0 qt".
  const gallons = convert(ml).from('ml').to('gal')
  if (Math.round(gallons) >= 1 && Math.abs(gallons - Math.round(gallons)) < 0.005) return `${Math.round(gallons)} gal`
  return `${grouped(convert(ml).from('ml').to('qt'), 1)} qt`
}

/** Dry goods per jar: "½ cup (92 g)" (US) or "118 mL (92 g)" (metric). */
export function formatDry(ml: number, grams: number, system: UnitSystem): string {
  const g = `${grouped(grams)} g`
  if (system === 'metric') return `${grouped(ml)} mL (${g})`
  return `${kitchenMeasure(mlToCups(ml), 'cup').text} (${g})`
}

/** Cooked (swollen) beans per jar: "1½ cups" (US, a kitchen fraction) or "355 mL" (metric, to the nearest 5). */
export function formatCooked(ml: number, system: UnitSystem): string {
  if (system === 'metric') return `${grouped(Math.round(ml / 5) * 5)} mL`
  return kitchenMeasure(mlToCups(ml), 'cup').text
}

/** Salt per jar: "½ tsp" (US) or "3 g (½ tsp)" (metric), or "no salt". */
export function formatSalt(tsp: number, system: UnitSystem): string {
  if (tsp <= 0) return 'no salt'
  const spoon = kitchenMeasure(tsp, 'tsp').text
  if (system === 'us') return spoon
  // A metric household weighs salt: grams only (about 6 g per tsp, USDA SR "Salt, table").
  return `${grouped(tsp * SALT_GRAMS_PER_TSP, 1)} g`
}

/** Length for display: inches to the nearest 1/8 (US) or whole mm (metric). */
export function formatLength(mm: number, system: UnitSystem): string {
  if (system === 'metric') return `${grouped(mm)} mm`
  const f = toEighths(mmToInches(mm))
  return `${glyphText(f)} in`
}
