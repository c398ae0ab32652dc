import { describe, expect, it } from 'vitest'
import { buildShopping, costSummary } from '~~/utils/planning'
import { blackBeans, household, ingredients, jarSizes, pint } from './fixtures'

const LB = 453.59237

function cost(jars: number, jarsPerMonth: number | null = null) {
  const needs = {
    ingredientGrams: new Map([[blackBeans.id, jars * 97]]),
    saltGrams: jars * 1.5,
    jarsBySize: new Map([[pint.id, jars]]),
    vinegarMl: jars * 5,
  }
  const { items } = buildShopping(needs, household, ingredients, jarSizes, 'us')
  return costSummary(
    { jars, gramsUsed: needs.ingredientGrams, ...needs, jarsPerMonth },
    items,
    household,
    jarSizes,
  )
}

describe('cost per jar and the saving over store-bought cans', () => {
  // 9 dry-pack pints (97 g beans, ¼ tsp = 1.5 g salt, 5 mL vinegar each), 12 pint jars owned.
  // Worked by hand from the fixture prices:
  //   beans   873 g at $3.49 per 2 lb bag (907.18 g)      = 335.85 ¢
  //   salt    13.5 g at $3.99 per 1,360 g                  =   3.96 ¢
  //   lids    9 at $3.99 per 12                            = 299.25 ¢
  //   vinegar 45 mL at $2.49 per quart bottle (946.35 mL)  =  11.84 ¢
  //   total 650.90 ¢ → 651 ¢; per jar 72.32 ¢ → 72 ¢; store 9 × 129 ¢ = 1,161 ¢; saving 510 ¢.
  it('9 pints: 72 ¢ a jar, $6.51 in all, $5.10 saved; the market list costs $13.96', () => {
    const c = cost(9)
    expect(c.breakdown).toEqual({ goods: 336, salt: 4, lids: 299, vinegar: 12, jars: 0 })
    expect(c).toMatchObject({ total: 651, perJar: 72, storeEquivalent: 1161, saving: 510, shoppingTotal: 1396, incomplete: false })
    expect(c.savingPerYear).toBeNull()
  })
  it('jars bought are amortised over the expected uses: 6 new pints at $13.99 per 12, 10 uses → 70 ¢', () => {
    // 18 pints, 12 owned: the 6 new jars cost 6 × 1399/12 = 699.5 ¢, over 10 uses = 69.95 ¢
    expect(cost(18).breakdown.jars).toBe(70)
  })
  it('saving per year from the household consumption: (store price − cost per jar) × jars a month × 12', () => {
    const c = cost(9, 2)
    // (129 − 650.90/9) × 2 × 12 = (129 − 72.32) × 24 = 1,360.3 ¢
    expect(c.savingPerYear).toBe(1360)
  })
  it('beans bought in a 4 lb bag are charged at that bag’s price per gram', () => {
    const needs = { ingredientGrams: new Map([[blackBeans.id, 3.25 * LB]]), saltGrams: 0, jarsBySize: new Map([[pint.id, 9]]), vinegarMl: 0 }
    const { items } = buildShopping(needs, household, ingredients, jarSizes, 'us')
    const input = { jars: 9, gramsUsed: needs.ingredientGrams, ...needs, jarsPerMonth: null }
    const c = costSummary(input, items, household, jarSizes)
    // 3¼ lb at $5.99 per 4 lb = 486.7 ¢
    expect(c.breakdown.goods).toBe(487)
  })
})
