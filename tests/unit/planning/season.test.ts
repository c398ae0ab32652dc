/**
 * The plan over a season: the market list of a plan part-way through, dry goods on hand, items
 * marked as at home, missing prices, and the store comparison by equal volume of beans.
 */
import convert from 'convert-units'
import { describe, expect, it } from 'vitest'
import { countOf, planBatch, type HouseholdSettings, type PlanLineRequest, type PlanRequest } from '~~/utils/planning'
import { TODAY, blackBeans, catalogue, dryPack, household, pint, quart, standardCanner, usdaDryBeans } from './fixtures'

const LB = 453.59237
const request = (lines: PlanLineRequest[], over: Partial<PlanRequest> = {}): PlanRequest => ({
  lines, canners: [standardCanner], altitudeFt: 500, today: TODAY, startAt: `${TODAY}T08:00`, ...over,
})
const jars = (recipeId: string, jarSizeId: string, n: number): PlanLineRequest => ({ recipeId, jarSizeId, amount: { mode: 'jars', jars: n } })
const item = (r: ReturnType<typeof planBatch>, kind: string) => r.shopping.find(s => s.kind === kind)

describe('the store comparison is by equal volume of beans', () => {
  // U.S. Dry Bean Council, "Counting Beans" (canning-reference.md §4.3): 1 cup dry = 3 cups
  // cooked, drained; one 15-oz can = 1½ cups drained. The dry pack fills ½ cup a pint and 1 cup
  // a quart (computation.md §2, f = ¾, E = 3), so a pint holds one can's beans and a quart two.
  const cups = (n: number) => convert(n).from('cup').to('ml')

  it('a quart of dry-pack beans replaces two 15-oz cans; a pint one', () => {
    const r = planBatch(request([jars(dryPack.id, quart.id, 7), jars(dryPack.id, pint.id, 9)]), catalogue, household)
    const perJar = Object.fromEntries(r.cost.storeCansPerJar.map(c => [c.jarSizeId, c.cans]))
    expect(r.lines[0]!.perJar.dryMl).toBeCloseTo(cups(1), 3)
    expect(perJar[quart.id]).toBeCloseTo(2, 5)
    expect(perJar[pint.id]).toBeCloseTo(1, 5)
    expect(r.cost.storeCans).toBeCloseTo(7 * 2 + 9, 4)
    expect(r.cost.storeEquivalent).toBe(Math.round(23 * household.storeCanPriceCents))
  })

  it('a quart batch saves money rather than "losing" it against one can per jar', () => {
    const r = planBatch(request([jars(dryPack.id, quart.id, 7)]), catalogue, household)
    expect(r.cost.storeEquivalent).toBe(14 * household.storeCanPriceCents)
    expect(r.cost.saving).toBe(r.cost.storeEquivalent - r.cost.total)
    expect(r.cost.saving).toBeGreaterThan(0)
  })

  it('a can given by its drained beans: Nebraska Extension\'s 1.75 cups a 15-oz can makes a pint 1.5 / 1.75 of a can', () => {
    const h: HouseholdSettings = { ...household, storeCan: { basis: 'drained', amount: cups(1.75) } }
    const r = planBatch(request([jars(dryPack.id, pint.id, 9)]), catalogue, h)
    expect(r.cost.storeCansPerJar[0]!.cans).toBeCloseTo(1.5 / 1.75, 6)
  })

  it('never counts more beans than the solids\' share of the jar: the hot pack\'s published amount swells past it', () => {
    const r = planBatch(request([jars(usdaDryBeans.id, pint.id, 9), jars(usdaDryBeans.id, quart.id, 7)]), catalogue, household)
    // 164 g of black beans (194 g a cup) is 0.85 cup dry, 2.5 cups swollen: more than a pint holds.
    // The solids take at most ¾ of the jar (computation.md §2): 1½ cups a pint, 3 cups a quart —
    // one and two 15-oz cans of drained beans (U.S. Dry Bean Council).
    expect(r.lines[0]!.perJar.dryMl * 3).toBeGreaterThan(convert(2).from('cup').to('ml'))
    expect(r.lines[0]!.perJar.hydratedMl).toBeCloseTo(0.75 * pint.capacityMl, 6)
    expect(r.lines[0]!.perJar.display.cooked).toBe('1½ cups')
    const perJar = Object.fromEntries(r.cost.storeCansPerJar.map(c => [c.jarSizeId, c.cans]))
    expect(perJar[pint.id]).toBeCloseTo(1, 5)
    expect(perJar[quart.id]).toBeCloseTo(2, 5)
  })
})

describe('a saved plan in progress: the market list is what the loads not yet logged need', () => {
  const lines = [jars(usdaDryBeans.id, pint.id, 27)]
  const before = planBatch(request(lines), catalogue, household)

  it('27 pints make three loads of nine (the fixture canner holds nine pints)', () => {
    expect(before.loads.map(l => l.jars)).toEqual([9, 9, 9])
    expect(before.progress).toEqual({ loggedLoads: [], loadsLeft: 3, jarsLeft: 27 })
  })

  // Logging load 1 took its 9 pints out of the 12 empty pints owned, leaving 3.
  const afterOwned = household.jarsOwned.map(o => (o.jarSizeId === pint.id ? { ...o, count: o.count - 9 } : o))
  const after = planBatch(
    request(lines, { progress: { loggedLoads: [1], jarsTaken: [{ jarSizeId: pint.id, count: 9 }] } }),
    catalogue,
    { ...household, jarsOwned: afterOwned },
  )

  it('jars: 18 still to fill less the 3 empty pints left = 15, the same 15 as before logging (27 − 12) — none counted twice', () => {
    expect(item(before, 'jar')!.quantity).toBe(27 - 12)
    expect(item(after, 'jar')!.quantity).toBe(18 - 3)
  })
  it('dry beans, salt and vinegar only for the 18 jars left', () => {
    expect(item(after, 'ingredient')!.quantity).toBeCloseTo(18 * (3.25 * LB) / 9, 6)
    // ½ tsp salt a pint (CG Guide 4), 6 g a tsp (USDA SR "Salt, table").
    expect(item(after, 'salt')!.quantity).toBeCloseTo(18 * 0.5 * 6, 6)
    expect(item(after, 'vinegar')!.quantity).toBeCloseTo(18 * 5, 6)
    expect(after.progress).toEqual({ loggedLoads: [1], loadsLeft: 2, jarsLeft: 18 })
  })
  it('the batch costs what it did before the load was logged', () => {
    expect(after.cost.total).toBe(before.cost.total)
    expect(after.cost.perJar).toBe(before.cost.perJar)
  })
  it('a load number the plan does not have is ignored, not subtracted', () => {
    const odd = planBatch(request(lines, { progress: { loggedLoads: [7] } }), catalogue, household)
    expect(odd.progress.loadsLeft).toBe(3)
    expect(item(odd, 'jar')!.quantity).toBe(15)
  })
})

describe('what the household already has', () => {
  it('dry goods in the pantry are taken off the need, and the note says so', () => {
    const h: HouseholdSettings = { ...household, dryGoodsOnHand: [{ ingredientId: blackBeans.id, grams: 2 * LB }] }
    const r = planBatch(request([jars(usdaDryBeans.id, pint.id, 9)]), catalogue, h)
    const beans = item(r, 'ingredient')!
    expect(beans.quantity).toBeCloseTo(1.25 * LB, 6)
    expect(beans.note).toMatch(/3 lb 4 oz.*2 lb is in the pantry/)
  })
  it('enough in the pantry: no beans on the list', () => {
    const h: HouseholdSettings = { ...household, dryGoodsOnHand: [{ ingredientId: blackBeans.id, grams: 4 * LB }] }
    expect(item(planBatch(request([jars(usdaDryBeans.id, pint.id, 9)]), catalogue, h), 'ingredient')).toBeUndefined()
  })
  it('an item marked as at home stays on the list but out of the shopping total', () => {
    const all = planBatch(request([jars(usdaDryBeans.id, pint.id, 9)]), catalogue, household)
    const salt = item(all, 'salt')!
    expect(salt.optional).toBe(true)
    expect(all.cost.shoppingTotal).toBe(all.shopping.reduce((s, i) => s + (i.cost ?? 0), 0))
    const marked = planBatch(request([jars(usdaDryBeans.id, pint.id, 9)], { progress: { loggedLoads: [], atHome: [salt.key] } }), catalogue, household)
    expect(item(marked, 'salt')!.atHome).toBe(true)
    expect(marked.cost.shoppingTotal).toBe(all.cost.shoppingTotal - salt.cost!)
    expect(marked.cost.shoppingOptional).toBe(item(all, 'vinegar')!.cost)
  })
  it('with no prices at all, the cost names every missing price instead of reading $0.00 as a price', () => {
    const r = planBatch(request([jars(usdaDryBeans.id, pint.id, 9)]), catalogue, { ...household, prices: [] })
    expect(r.cost.incomplete).toBe(true)
    expect(r.cost.missingPrices).toEqual(expect.arrayContaining(['Black beans', 'Canning salt', 'Lids, regular mouth']))
  })
})

describe('counting words (Intl.PluralRules)', () => {
  it('"1 jar", "0 jars", "2 jars", "1,200 jars", and an irregular plural', () => {
    expect([countOf(1, 'jar'), countOf(0, 'jar'), countOf(2, 'jar'), countOf(1200, 'jar'), countOf(2, 'box', 'boxes')])
      .toEqual(['1 jar', '0 jars', '2 jars', '1,200 jars', '2 boxes'])
  })
})
