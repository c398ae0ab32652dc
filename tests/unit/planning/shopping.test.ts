import { describe, expect, it } from 'vitest'
import { buildShopping, cheapestCombination } from '~~/utils/planning'
import { blackBeans, household, ingredients, jarSizes, pint, quart } from './fixtures'

const LB = 453.59237

describe('cheapest package combination', () => {
  it('2 kg of beans from 2 lb @ $3.49 and 4 lb @ $5.99: one of each ($9.48), not 2 × 4 lb ($11.98) or 3 × 2 lb ($10.47)', () => {
    const c = cheapestCombination(2000, [{ size: 2 * LB, priceCents: 349 }, { size: 4 * LB, priceCents: 599 }])!
    expect(c.counts).toEqual([1, 1])
    expect(c.totalCents).toBe(948)
    expect(c.totalSize).toBeCloseTo(6 * LB, 9)
  })
  it('3¼ lb (CG Guide 4, 9 pints): one 4 lb bag ($5.99) beats two 2 lb bags ($6.98)', () => {
    const c = cheapestCombination(3.25 * LB, [{ size: 2 * LB, priceCents: 349 }, { size: 4 * LB, priceCents: 599 }])!
    expect(c.counts).toEqual([0, 1])
  })
  it('a need equal to one bag buys one bag', () => {
    expect(cheapestCombination(2 * LB, [{ size: 2 * LB, priceCents: 349 }])!.counts).toEqual([1])
  })
  it('equal cost: less left over wins, then fewer packages', () => {
    expect(cheapestCombination(900, [{ size: 500, priceCents: 100 }, { size: 1000, priceCents: 200 }])!.counts).toEqual([0, 1])
    expect(cheapestCombination(450, [{ size: 500, priceCents: 100 }, { size: 1000, priceCents: 100 }])!.counts).toEqual([1, 0])
  })
  it('no need, no packages; no price, no answer', () => {
    expect(cheapestCombination(0, [{ size: 500, priceCents: 100 }])!.packages).toBe(0)
    expect(cheapestCombination(10, [])).toBeNull()
  })
})

describe('the market list', () => {
  const build = (jars: number, jarSizeId = pint.id, grams = jars * 97) =>
    buildShopping(
      {
        ingredientGrams: new Map([[blackBeans.id, grams]]),
        saltGrams: jars * 1.5,
        jarsBySize: new Map([[jarSizeId, jars]]),
        vinegarMl: jars * 5,
      },
      household,
      ingredients,
      jarSizes,
      'us',
    )
  it('9 pints with 12 pint jars owned: beans, salt, one pack of 12 lids, vinegar; no jars', () => {
    const { items } = build(9)
    expect(items.map(i => [i.kind, i.quantity, i.packages.map(p => p.count), i.cost])).toEqual([
      ['ingredient', 873, [1], 349],
      ['salt', 13.5, [1], 399],
      ['lid', 9, [1], 399],
      ['vinegar', 45, [1], 249],
    ])
    expect(items[0]!.leftover).toBeCloseTo(2 * LB - 873, 9)
  })
  it('18 pints with 12 owned: a case of 12 jars (6 used), and its 12 lids leave 6 lids to buy', () => {
    const { items } = build(18)
    expect(items.find(i => i.kind === 'jar')).toMatchObject({ quantity: 6, leftover: 6, cost: 1399 })
    expect(items.find(i => i.kind === 'lid')).toMatchObject({ quantity: 6, cost: 399 })
  })
  it('a missing price is listed without a cost and reported', () => {
    const r = buildShopping(
      { ingredientGrams: new Map([['unpriced', 500]]), saltGrams: 0, jarsBySize: new Map([[quart.id, 1]]), vinegarMl: 0 },
      household,
      ingredients,
      jarSizes,
      'us',
    )
    expect(r.items[0]).toMatchObject({ cost: null, packages: [] })
    expect(r.warnings[0]?.code).toBe('no-price')
  })
})
