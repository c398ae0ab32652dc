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
 * Cost per jar = that cost ÷ jars. The store comparison counts one store-bought can per jar, as
 * the household's price is entered. `shoppingTotal` is the cash for the market list today.
 * Items without a price are left out and `incomplete` is set.
 */
import type { HouseholdSettings, JarSize } from './types'
import { lidOptions, optionsOf, type PackageOption, type ShoppingItem } from './shopping'

export interface CostSummary {
  perJar: number
  total: number
  storeEquivalent: number
  saving: number
  /**
   * Saving over a year of the household's use, when some line was planned from consumption:
   * (store price − this batch's average cost per jar) × jars eaten per month × 12.
   */
  savingPerYear: number | null
  shoppingTotal: number
  breakdown: { goods: number, salt: number, lids: number, vinegar: number, jars: number }
  /** True when some price was missing and its cost is left out. */
  incomplete: boolean
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
}

/** Price the batch from what it uses and what the market list buys (rules above). */
export function costSummary(
  input: CostInput,
  shopping: readonly ShoppingItem[],
  household: HouseholdSettings,
  jarSizes: readonly JarSize[],
): CostSummary {
  const prices = household.prices
  let incomplete = shopping.some(s => s.cost === null)
  /** Cheapest price per gram, mL or piece; a missing price counts 0 and marks the sum incomplete. */
  const rate = (options: readonly PackageOption[]): number => {
    const rates = options.map(o => o.priceCents / o.size)
    if (rates.length === 0) incomplete = true
    return rates.length ? Math.min(...rates) : 0
  }

  let goods = 0
  for (const [ingredientId, grams] of input.gramsUsed) {
    const bought = shopping.find(s => s.kind === 'ingredient' && s.ref === ingredientId && s.cost !== null)
    const boughtSize = bought ? bought.quantity + bought.leftover : 0
    const perGram
      = bought && boughtSize > 0
        ? bought.cost! / boughtSize
        : rate(optionsOf(prices, 'ingredient', p => p.packageGrams, p => p.ingredientId === ingredientId))
    goods += grams * perGram
  }
  const salt = input.saltGrams > 0 ? input.saltGrams * rate(optionsOf(prices, 'salt', p => p.packageGrams)) : 0
  const vinegar = input.vinegarMl > 0 ? input.vinegarMl * rate(optionsOf(prices, 'vinegar', p => p.packageMl)) : 0
  let lids = 0
  for (const [jarSizeId, jars] of input.jarsBySize) {
    lids += jars * rate(lidOptions(prices, jarSizes.find(j => j.id === jarSizeId), jarSizeId).options)
  }
  const jarsAmortised
    = shopping
      .filter(s => s.kind === 'jar' && s.cost !== null && s.quantity + s.leftover > 0)
      .reduce((sum, s) => sum + (s.cost! * s.quantity) / (s.quantity + s.leftover), 0) / household.jarUses

  const exact = goods + salt + vinegar + lids + jarsAmortised
  const total = Math.round(exact)
  const perJarExact = input.jars > 0 ? exact / input.jars : 0
  const storeEquivalent = Math.round(household.storeCanPriceCents * input.jars)
  return {
    perJar: Math.round(perJarExact),
    total,
    storeEquivalent,
    saving: storeEquivalent - total,
    savingPerYear:
      input.jarsPerMonth === null ? null : Math.round((household.storeCanPriceCents - perJarExact) * input.jarsPerMonth * 12),
    shoppingTotal: shopping.reduce((s, i) => s + (i.cost ?? 0), 0),
    breakdown: {
      goods: Math.round(goods),
      salt: Math.round(salt),
      lids: Math.round(lids),
      vinegar: Math.round(vinegar),
      jars: Math.round(jarsAmortised),
    },
    incomplete,
  }
}
