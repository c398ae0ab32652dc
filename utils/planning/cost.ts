/**
 * Money, in integer cents.
 *
 * Cost of the batch = what goes into the jars, at the household's prices:
 * - dry goods: the grams used at the price per gram of the packages bought for them (goods the
 *   household already had: at its cheapest price per gram);
 * - salt and vinegar: the grams / mL used at the cheapest price per gram / mL (a box of salt
 *   outlasts one batch);
 * - lids: one new lid per jar at the cheapest price per lid (lids are single-use; a new jar's lid
 *   is also in its jar price, so the cost errs a few cents high);
 * - jars: the new jars this batch fills, at the price per jar of the cases bought, amortised over
 *   the household's expected uses per jar (jars already owned, and spare jars from a case, are
 *   not charged to this batch).
 * Cost per jar = that cost ÷ jars. The store comparison is by equal volume of beans: each jar's
 * hydrated beans (its dry volume × the ingredient's expansion ratio) against the drained beans of
 * the household's store can, so a quart jar counts as the cans it replaces (storeCansPerJar).
 * `shoppingTotal` is the cash for the market list today, without what the household marked as
 * at home. Items without a price are left out, named in `missingPrices`, and `incomplete` is set.
 */
import convert from 'convert-units'
import type { HouseholdSettings, JarSize } from './types'
import { lidOptions, optionsOf, type PackageOption, type ShoppingItem } from './shopping'

/**
 * Drained beans in a store can for each gram of its net weight: "one 15-oz can = 1½ cups
 * drained" (U.S. Dry Bean Council, "Counting Beans"; canning-reference.md §4.3). About 0.83 mL/g.
 */
export const DRAINED_ML_PER_NET_GRAM = convert(1.5).from('cup').to('ml') / convert(15).from('oz').to('g')

/** The household's can when it has not said: 15 oz net, the common size of a can of beans. */
export const DEFAULT_STORE_CAN = { basis: 'net' as const, amount: convert(15).from('oz').to('g') }

/** Drained beans in the household's store can, in mL. */
export function storeCanBeansMl(can: HouseholdSettings['storeCan']): number {
  const c = can ?? DEFAULT_STORE_CAN
  return c.basis === 'drained' ? c.amount : c.amount * DRAINED_ML_PER_NET_GRAM
}

export interface CostSummary {
  perJar: number
  total: number
  /** What the same beans would cost in store cans: cans replaced × the can's price. */
  storeEquivalent: number
  /** Store cans the batch replaces, by equal volume of beans, and per jar by jar size. */
  storeCans: number
  storeCansPerJar: Array<{ jarSizeId: string, cans: number }>
  saving: number
  /**
   * Saving over a year of the household's use, when some line was planned from consumption:
   * (store price − this batch's average cost per jar) × jars eaten per month × 12.
   */
  savingPerYear: number | null
  /** Jars eaten a month behind savingPerYear: 'plan' (lines planned from consumption) or 'measured' (the Shelf). */
  usePerMonth: { jars: number, from: 'plan' | 'measured' } | null
  /** Cash for the market list: every priced item not marked as at home. */
  shoppingTotal: number
  /** Of that, salt and vinegar, which many households already have. */
  shoppingOptional: number
  breakdown: { goods: number, salt: number, lids: number, vinegar: number, jars: number }
  /** True when some price was missing and its cost is left out. */
  incomplete: boolean
  /** What has no price on the household's list, by item name, so the page can say which price to add. */
  missingPrices: string[]
}

export interface CostInput {
  jars: number
  /** Grams used, by ingredient id. */
  gramsUsed: ReadonlyMap<string, number>
  saltGrams: number
  vinegarMl: number
  /** Jars filled, by jar size id. */
  jarsBySize: ReadonlyMap<string, number>
  /** Jars eaten per month, summed over lines planned from consumption; null if none. */
  jarsPerMonth: number | null
  /** Jars eaten per month measured from the Shelf for the plan's recipes; used when no line gives a rate. */
  measuredJarsPerMonth?: number | null
  /** Hydrated beans per jar (mL), by jar size: dry volume × expansion ratio, averaged over the lines. */
  beansMlBySize?: ReadonlyMap<string, number>
  /** Ingredient names by id, to name a missing price. */
  ingredientNames?: ReadonlyMap<string, string>
}

/**
 * Price the batch from what it uses and what the market list buys (rules above). `shopping` is
 * the list to buy now; `costing` the list the whole batch needed (they differ once some of a
 * saved plan's loads are logged), from which goods and jars are priced.
 */
export function costSummary(
  input: CostInput,
  shopping: readonly ShoppingItem[],
  household: HouseholdSettings,
  jarSizes: readonly JarSize[],
  costing: readonly ShoppingItem[] = shopping,
): CostSummary {
  const prices = household.prices
  const names = input.ingredientNames ?? new Map(shopping.filter(s => s.kind === 'ingredient' && s.ref).map(s => [s.ref!, s.item]))
  const missing = new Set([...shopping, ...costing].filter(s => s.cost === null).map(s => s.item))
  /** Cheapest price per gram, mL or piece; a missing price counts 0 and is named in `missingPrices`. */
  const rate = (options: readonly PackageOption[], what: string): number => {
    const rates = options.map(o => o.priceCents / o.size)
    if (rates.length === 0) missing.add(what)
    return rates.length ? Math.min(...rates) : 0
  }

  let goods = 0
  for (const [ingredientId, grams] of input.gramsUsed) {
    const bought = costing.find(s => s.kind === 'ingredient' && s.ref === ingredientId && s.cost !== null)
    const boughtSize = bought ? bought.quantity + bought.leftover : 0
    const perGram
      = bought && boughtSize > 0
        ? bought.cost! / boughtSize
        : rate(optionsOf(prices, 'ingredient', p => p.packageGrams, p => p.ingredientId === ingredientId), names.get(ingredientId) ?? ingredientId)
    goods += grams * perGram
  }
  const salt = input.saltGrams > 0 ? input.saltGrams * rate(optionsOf(prices, 'salt', p => p.packageGrams), 'Canning salt') : 0
  const vinegar = input.vinegarMl > 0 ? input.vinegarMl * rate(optionsOf(prices, 'vinegar', p => p.packageMl), 'White vinegar (for wiping rims)') : 0
  let lids = 0
  for (const [jarSizeId, jars] of input.jarsBySize) {
    const lid = lidOptions(prices, jarSizes.find(j => j.id === jarSizeId), jarSizeId)
    lids += jars * rate(lid.options, lid.name)
  }
  const jarsAmortised
    = costing
      .filter(s => s.kind === 'jar' && s.cost !== null && s.quantity + s.leftover > 0)
      .reduce((sum, s) => sum + (s.cost! * s.quantity) / (s.quantity + s.leftover), 0) / household.jarUses

  const exact = goods + salt + vinegar + lids + jarsAmortised
  const total = Math.round(exact)
  const perJarExact = input.jars > 0 ? exact / input.jars : 0
  // Equal volume of beans: each jar's hydrated beans against the drained beans of one store can.
  const canMl = storeCanBeansMl(household.storeCan)
  const storeCansPerJar = [...input.jarsBySize.keys()].map(jarSizeId => ({ jarSizeId, cans: (input.beansMlBySize?.get(jarSizeId) ?? canMl) / canMl }))
  const storeCans = [...input.jarsBySize].reduce((sum, [jarSizeId, jars]) => sum + jars * storeCansPerJar.find(c => c.jarSizeId === jarSizeId)!.cans, 0)
  const storeExact = household.storeCanPriceCents * storeCans
  const storeEquivalent = Math.round(storeExact)
  const usePerMonth = input.jarsPerMonth !== null
    ? { jars: input.jarsPerMonth, from: 'plan' as const }
    : input.measuredJarsPerMonth ? { jars: input.measuredJarsPerMonth, from: 'measured' as const } : null
  const storePerJar = input.jars > 0 ? storeExact / input.jars : 0
  const toBuy = shopping.filter(i => !i.atHome)
  return {
    perJar: Math.round(perJarExact),
    total,
    storeEquivalent,
    storeCans,
    storeCansPerJar,
    saving: storeEquivalent - total,
    savingPerYear: usePerMonth === null ? null : Math.round((storePerJar - perJarExact) * usePerMonth.jars * 12),
    usePerMonth,
    shoppingTotal: toBuy.reduce((s, i) => s + (i.cost ?? 0), 0),
    shoppingOptional: toBuy.filter(i => i.optional).reduce((s, i) => s + (i.cost ?? 0), 0),
    breakdown: {
      goods: Math.round(goods),
      salt: Math.round(salt),
      lids: Math.round(lids),
      vinegar: Math.round(vinegar),
      jars: Math.round(jarsAmortised),
    },
    incomplete: missing.size > 0,
    missingPrices: [...missing],
  }
}
