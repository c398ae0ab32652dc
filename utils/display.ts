/** Formatting shared by several screens: jar size names, money, plurals, recipe cautions, fill shares. */
import { countOf } from './planning/units'
import type { ShelfCorrectionCause } from './vocabulary'

/**
 * "1 jar", "2 jars", "1,200 jars": a count and its noun, the form chosen by
 * Intl.PluralRules('en-US') (the one rule, in utils/planning/units.ts `countOf`).
 */
export const plural = (n: number, one: string, other: string): string => countOf(n, one, other)

const pluralRules = new Intl.PluralRules('en-US')
/** The word alone, for a count shown apart from it: "jar" for 1, "jars" for 0 or 2. */
export const pluralWord = (n: number, one: string, other: string): string => (pluralRules.select(n) === 'one' ? one : other)

/** "Pint", "Half-pint": the size family's name from the jar catalogue ("Pint, regular mouth"). */
export function sizeName(jarSizes: ReadonlyArray<{ sizeKey: string, name: string }> | null | undefined, sizeKey: string): string {
  const jar = jarSizes?.find(j => j.sizeKey === sizeKey)
  return jar ? jar.name.split(',')[0]! : sizeKey
}

/** The jar size families of the catalogue, smallest first, with their largest capacity and name. */
export function jarSizeFamilies(jarSizes: ReadonlyArray<{ sizeKey: string, name: string, capacityMl: number }>) {
  const capacity = (key: string) => Math.max(0, ...jarSizes.filter(j => j.sizeKey === key).map(j => j.capacityMl))
  return [...new Set(jarSizes.map(j => j.sizeKey))]
    .map(key => ({ key, name: sizeName(jarSizes, key), capacityMl: capacity(key) }))
    .sort((a, b) => a.capacityMl - b.capacityMl)
}

/** Money entered and shown in currency units; stored in cents. */
export const centsToUnits = (cents: number): number => cents / 100
export const unitsToCents = (units: number): number => Math.round(units * 100)
const moneyFormats = new Map<string, Intl.NumberFormat>()
/**
 * "$13.96", "CA$13.96", "€13.96": cents in the household's currency through Intl.NumberFormat
 * (every currency the household can choose has two minor digits). Read in US English, as the
 * rest of the product is.
 */
export function formatMoney(cents: number, currency: string = 'USD'): string {
  let format = moneyFormats.get(currency)
  if (!format) {
    format = new Intl.NumberFormat('en-US', { style: 'currency', currency })
    moneyFormats.set(currency, format)
  }
  return format.format(cents / 100)
}

export const packStyleLabels = { dry: 'Dry pack (no soak)', hot: 'Hot pack', raw: 'Raw pack' } as const

/** What happened to a lot whose count is corrected, as the correction form offers it. */
export const shelfCorrectionCauseLabels: Record<ShelfCorrectionCause, string> = {
  miscounted: 'Miscounted: the count was wrong',
  mistake: 'Recorded by mistake: these jars were never filled',
  broken: 'Broken or lost',
  discarded: 'Thrown out; the emptied jars were washed and kept',
}

/** The caution text without its leading "Untested — your own risk." (shown as the title instead). */
export function cautionBody(caution: string | undefined): string {
  return (caution ?? '').replace(/^Untested — your own risk\.\s*/, '')
}

const SHARES: Array<[number, string]> = [[1 / 4, '¼'], [1 / 3, '⅓'], [1 / 2, '½'], [2 / 3, '⅔'], [3 / 4, '¾']]

/** "¾ of the jar", "the whole jar", or a percentage for an unusual share. */
export function fillShareText(fraction: number): string {
  if (Math.abs(fraction - 1) < 1e-6) return 'the whole jar'
  const named = SHARES.find(([value]) => Math.abs(value - fraction) < 1e-6)
  return `${named ? named[1] : `${Math.round(fraction * 100)} %`} of the jar`
}

/**
 * The name a load's jars get on the Shelf: the recipe's own name when the jars hold the recipe's
 * own bean, otherwise the bean and the pack ("Pinto beans, hot pack") for a recipe that covers
 * several varieties.
 */
export function shelfProductName(recipe: { name: string, ingredientId: string, packStyle: 'hot' | 'raw' | 'dry' }, bean: { id: string, name: string } | undefined): string {
  if (!bean || bean.id === recipe.ingredientId) return recipe.name
  return `${bean.name}, ${recipe.packStyle} pack`
}

/** A jar size as a table row says it: "pint", "pint (wide)", from the catalogue's own name. */
export function jarShortName(jarSizes: ReadonlyArray<{ id: string, name: string, mouth: string }> | null | undefined, jarSizeId: string): string {
  const jar = jarSizes?.find(j => j.id === jarSizeId)
  if (!jar) return jarSizeId
  return `${jar.name.split(',')[0]!.toLowerCase()}${jar.mouth === 'wide' ? ' (wide)' : ''}`
}

/** "87%", or a dash when there is nothing to rate yet. */
export function percent(rate: number | null): string {
  return rate === null ? '—' : `${Math.round(rate * 100)}%`
}

/**
 * A recipe picker's options: tested recipes first, then house recipes marked untested; a retired
 * recipe only when `keep` names it (a line that already uses it, so the refusal can say why).
 */
export function recipeOptions(recipes: ReadonlyArray<{ id: string, name: string, status: string, retired?: string | null }>, keep?: string | null) {
  return recipes
    .filter(r => !r.retired || r.id === keep)
    .toSorted((a, b) => Number(a.status === 'house') - Number(b.status === 'house'))
    .map(r => ({ value: r.id, label: `${r.name}${r.status === 'house' ? ' (house, untested)' : ''}${r.retired ? ' (retired)' : ''}` }))
}
