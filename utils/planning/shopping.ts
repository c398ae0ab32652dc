/**
 * The market list: dry goods, salt, lids, jars and vinegar, in the package sizes the household
 * buys, each by the cheapest combination of packages that covers the need.
 */
import { info, type PlanWarning } from './errors'
import type { HouseholdSettings, Ingredient, JarSize, PriceItem, UnitSystem } from './types'
import { countOf, formatMass, formatVolume } from './units'

export interface PackageOption {
  /** Grams, millilitres or pieces in one package. */
  size: number
  priceCents: number
}

export interface Combination {
  /** Packages of each option, in the order of the options given. */
  counts: number[]
  totalSize: number
  totalCents: number
  packages: number
}

/** The most grid steps the search walks; the grid coarsens for large needs to stay under it. */
const MAX_SEARCH_STEPS = 20_000

/**
 * The cheapest combination of packages covering `need`; among equally cheap ones the one with
 * the least left over, then the fewest packages. A covering search over a grid of 0.1 units
 * (g, mL or pieces), coarser by powers of ten for needs above 2,000 units so it stays under
 * 20,000 steps. Package sizes and the need are both rounded down to the grid, so the packages
 * cover the need to within one grid step (0.1 g for a kitchen-sized need, 1 g up to 20 kg) and
 * a need exactly equal to a package buys that one package. Returns null with no usable option.
 */
export function cheapestCombination(need: number, options: readonly PackageOption[]): Combination | null {
  const step = Math.max(0.1, 10 ** Math.ceil(Math.log10(Math.max(need, 1) / MAX_SEARCH_STEPS)))
  const onGrid = (x: number): number => Math.floor(x / step + 1e-7)
  const usable = options
    .map((o, i) => ({ ...o, i, units: onGrid(o.size) }))
    .filter(o => o.units >= 1 && Number.isFinite(o.priceCents) && o.priceCents >= 0)
  if (usable.length === 0) return null
  const counts = options.map(() => 0)
  if (!(need > 0)) return { counts, totalSize: 0, totalCents: 0, packages: 0 }
  const units = Math.max(1, onGrid(need))
  const cost = new Float64Array(units + 1)
  const size = new Float64Array(units + 1)
  const count = new Int32Array(units + 1)
  const choice = new Int32Array(units + 1)
  for (let g = 1; g <= units; g++) {
    let best = -1
    for (let k = 0; k < usable.length; k++) {
      const o = usable[k]!
      const prev = Math.max(0, g - o.units)
      const c = cost[prev]! + o.priceCents
      const s = size[prev]! + o.size
      const n = count[prev]! + 1
      if (best < 0 || c < cost[g]! || (c === cost[g]! && (s < size[g]! || (s === size[g]! && n < count[g]!)))) {
        best = k
        cost[g] = c
        size[g] = s
        count[g] = n
      }
    }
    choice[g] = best
  }
  for (let g = units; g > 0;) {
    const o = usable[choice[g]!]!
    counts[o.i] = counts[o.i]! + 1
    g = Math.max(0, g - o.units)
  }
  return { counts, totalSize: size[units]!, totalCents: cost[units]!, packages: count[units]! }
}

export type ShoppingKind = PriceItem['kind']

export interface ShoppingPackage {
  size: number
  count: number
  priceCents: number
  label: string
}

export interface ShoppingItem {
  /** Stable across recomputes ("ingredient:black-beans", "lid:regular"): what check-offs are kept by. */
  key: string
  kind: ShoppingKind
  /** What to buy, e.g. "Black beans" or "Lids, regular mouth". */
  item: string
  /** The amount needed, in `unit`. */
  quantity: number
  unit: 'g' | 'mL' | 'count'
  packages: ShoppingPackage[]
  /** Cents for the packages, or null when the household has no price for the item. */
  cost: number | null
  /** What the packages leave over, in `unit`. */
  leftover: number
  /** The need in the household's units, e.g. "3 lb 4 oz". */
  display: string
  /** For ingredients: the ingredient; for lids and jars: the jar size or mouth the price matched. */
  ref?: string
  note?: string
  /** Salt and vinegar: a household often has enough at home (said in the note). */
  optional: boolean
  /** The household marked it as already at home: listed, but left out of the shopping total. */
  atHome: boolean
}

/** The key of a market list item: its kind and what it refers to. */
export function marketItemKey(item: { kind: string, ref?: string, item: string }): string {
  return `${item.kind}:${item.ref ?? item.item}`
}

export interface ShoppingNeeds {
  /** Dry grams to buy, by ingredient id (goods the household already has are not included). */
  ingredientGrams: ReadonlyMap<string, number>
  saltGrams: number
  /** Jars filled, by jar size id. */
  jarsBySize: ReadonlyMap<string, number>
  vinegarMl: number
}

export interface ShoppingMarks {
  /** Keys of items the household marked as already at home. */
  atHome?: readonly string[]
}

type ItemBase = Omit<ShoppingItem, 'packages' | 'cost' | 'leftover' | 'key' | 'optional' | 'atHome'> & { optional?: boolean }

/** One shopping item from a need and the household's price options for it. */
function priced(
  input: ItemBase,
  options: readonly PackageOption[],
  label: (size: number) => string,
  missing: string[],
  atHome: ReadonlySet<string>,
): ShoppingItem {
  const key = marketItemKey(input)
  const base = { ...input, key, optional: input.optional ?? false, atHome: atHome.has(key) }
  const combo = cheapestCombination(base.quantity, options)
  if (!combo) {
    missing.push(base.item)
    return { ...base, packages: [], cost: null, leftover: 0 }
  }
  const packages = options.flatMap((o, i) => {
    const count = combo.counts[i]!
    return count > 0 ? [{ size: o.size, count, priceCents: o.priceCents, label: label(o.size) }] : []
  })
  return { ...base, packages, cost: combo.totalCents, leftover: Math.max(0, combo.totalSize - base.quantity) }
}

/** The household's package options of one kind: its size and price. */
export function optionsOf<K extends PriceItem['kind']>(
  prices: readonly PriceItem[],
  kind: K,
  size: (p: Extract<PriceItem, { kind: K }>) => number,
  keep: (p: Extract<PriceItem, { kind: K }>) => boolean = () => true,
): PackageOption[] {
  return prices.flatMap((p) => {
    if (p.kind !== kind) return []
    const item = p as Extract<PriceItem, { kind: K }>
    return keep(item) ? [{ size: size(item), priceCents: item.priceCents }] : []
  })
}

/**
 * Lid options for a jar size: packs priced for that jar size if the household has any (then
 * the lids are listed per jar size), else packs priced for its mouth size (pooled by mouth).
 */
export function lidOptions(prices: readonly PriceItem[], jar: JarSize | undefined, jarSizeId: string) {
  const own = optionsOf(prices, 'lid', p => p.packCount, p => p.jarSizeId === jarSizeId)
  if (own.length) {
    return { key: `size:${jarSizeId}`, ref: jarSizeId, options: own, name: `Lids for ${jar?.name ?? jarSizeId} jars` }
  }
  const mouth = jar?.mouth ?? 'regular'
  const pooled = optionsOf(prices, 'lid', p => p.packCount, p => p.jarSizeId === undefined && p.jarMouth === mouth)
  return { key: `mouth:${mouth}`, ref: mouth, options: pooled, name: `Lids, ${mouth} mouth` }
}

/**
 * Build the market list. Rules the model leaves open, chosen as a careful canner would:
 * - dry goods: only what the household does not already have (lines given as goods add none,
 *   and the dry goods on hand in the pantry are taken off the need);
 * - jars: those beyond the empty jars owned of each size, in whole cases;
 * - lids: one new lid per jar, less the lids that come with the new jars bought (a case of jars
 *   comes with a lid and band for each, including jars left over for later);
 * - salt and vinegar: the packages needed if the household has none at home (said in a note);
 * - an item without a price is listed without a cost and reported once in a warning.
 */
export function buildShopping(
  needs: ShoppingNeeds,
  household: HouseholdSettings,
  ingredients: readonly Ingredient[],
  jarSizes: readonly JarSize[],
  system: UnitSystem,
  marks: ShoppingMarks = {},
): { items: ShoppingItem[], warnings: PlanWarning[] } {
  const prices = household.prices
  const atHomeKeys = new Set(marks.atHome ?? [])
  const items: ShoppingItem[] = []
  const missing: string[] = []
  const mass = (g: number): string => formatMass(g, system)
  const atHome = 'Skip if you have enough at home.'

  for (const [ingredientId, need] of needs.ingredientGrams) {
    const onHand = (household.dryGoodsOnHand ?? []).filter(g => g.ingredientId === ingredientId).reduce((s, g) => s + g.grams, 0)
    const grams = need - onHand
    // Less than a gram short is weighing noise, not something to buy.
    if (grams < 1) continue
    const name = ingredients.find(i => i.id === ingredientId)?.name ?? ingredientId
    const options = optionsOf(prices, 'ingredient', p => p.packageGrams, p => p.ingredientId === ingredientId)
    const base = {
      kind: 'ingredient' as const, item: name, quantity: grams, unit: 'g' as const, display: mass(grams), ref: ingredientId,
      ...(onHand > 0 ? { note: `Needs ${mass(need)}; ${mass(onHand)} is in the pantry.` } : {}),
    }
    items.push(priced(base, options, mass, missing, atHomeKeys))
  }
  if (needs.saltGrams > 0) {
    const base = {
      kind: 'salt' as const, item: 'Canning salt', quantity: needs.saltGrams, unit: 'g' as const,
      display: mass(needs.saltGrams), note: atHome, optional: true,
    }
    items.push(priced(base, optionsOf(prices, 'salt', p => p.packageGrams), mass, missing, atHomeKeys))
  }

  const lids = new Map<string, { count: number } & ReturnType<typeof lidOptions>>()
  for (const [jarSizeId, jars] of needs.jarsBySize) {
    const jar = jarSizes.find(j => j.id === jarSizeId)
    const owned = household.jarsOwned.filter(o => o.jarSizeId === jarSizeId).reduce((s, o) => s + o.count, 0)
    const buy = Math.max(0, jars - owned)
    let lidsWithJars = 0
    if (buy > 0) {
      const base = {
        kind: 'jar' as const, item: `${jar?.name ?? jarSizeId} jars`, quantity: buy, unit: 'count' as const,
        display: countOf(buy, 'jar'), ref: jarSizeId, note: `Needs ${countOf(jars, 'jar')}; you have ${countOf(owned, 'empty jar')}. New jars come with lids and bands.`,
      }
      const options = optionsOf(prices, 'jar', p => p.packCount, p => p.jarSizeId === jarSizeId)
      const bought = priced(base, options, n => `case of ${n}`, missing, atHomeKeys)
      items.push(bought)
      lidsWithJars = buy + bought.leftover
    }
    const lid = lidOptions(prices, jar, jarSizeId)
    const entry = lids.get(lid.key) ?? { ...lid, count: 0 }
    entry.count += Math.max(0, jars - lidsWithJars)
    lids.set(lid.key, entry)
  }
  for (const lid of lids.values()) {
    if (lid.count <= 0) continue
    const base = {
      kind: 'lid' as const, item: lid.name, quantity: lid.count, unit: 'count' as const,
      display: countOf(lid.count, 'lid'), ref: lid.ref,
    }
    items.push(priced(base, lid.options, n => `pack of ${n}`, missing, atHomeKeys))
  }
  if (needs.vinegarMl > 0) {
    const volume = (ml: number): string => formatVolume(ml, system)
    const base = {
      kind: 'vinegar' as const, item: 'White vinegar (for wiping rims)', quantity: needs.vinegarMl, unit: 'mL' as const,
      display: volume(needs.vinegarMl), note: atHome, optional: true,
    }
    items.push(priced(base, optionsOf(prices, 'vinegar', p => p.packageMl), volume, missing, atHomeKeys))
  }
  const warnings = missing.length
    ? [info('no-price', `No price on file for ${missing.join(', ')}; the costs leave them out. Add them on the Household page.`)]
    : []
  return { items, warnings }
}
