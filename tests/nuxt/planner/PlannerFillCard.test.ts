import convert from 'convert-units'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import PlannerFillCard from '~/components/planner/PlannerFillCard.vue'
import { planBatch, type Catalogue, type HouseholdSettings } from '~/utils/planning'

const cupMl = convert(1).from('cup').to('ml')
const catalogue: Catalogue = {
  jarSizes: [{ id: 'pint', key: 'pint', name: 'Pint', capacityMl: convert(1).from('pnt').to('ml'), outsideDiameterMm: 76.2, heightMm: 134.6, mouth: 'regular' }],
  // USDA SR Legacy 16014: black beans 194 g per cup; expansion about 3 (U.S. Dry Bean Council rule of thumb)
  ingredients: [{ id: 'black', name: 'Black beans', gramsPerCup: 194, expansionRatio: 3, source: 'USDA SR' }],
  recipes: [{
    id: 'dry', name: 'Dry-packed beans', status: 'house', packStyle: 'dry', ingredientId: 'black', headspaceMm: 25.4,
    solidsFillFraction: 0.75, fillBasis: 'cap', perJar: [{ jarKey: 'pint', saltTsp: 0.25 }], processMinutes: [{ jarKey: 'pint', minutes: 75 }],
    pressureBands: [{ gaugeType: 'weighted', minFt: 0, maxFt: 1000, psi: 10 }], source: 'household practice',
  }, {
    // CG Guide 4: soaked and boiled beans, hot-packed; 3¼ lb of dry beans per 9 pints.
    id: 'hot', name: 'Dried beans, hot pack', status: 'tested', packStyle: 'hot', ingredientId: 'black', headspaceMm: 25.4,
    solidsFillFraction: 0.75, fillBasis: 'published', perJar: [{ jarKey: 'pint', dryGrams: convert(3.25).from('lb').to('g') / 9, saltTsp: 0.5 }],
    processMinutes: [{ jarKey: 'pint', minutes: 75 }], pressureBands: [{ gaugeType: 'weighted', minFt: 0, maxFt: 1000, psi: 10 }], source: 'USDA CG Guide 4',
  }],
}
const household: HouseholdSettings = { altitudeFt: 500, unitSystem: 'us', storeCanPriceCents: 119, jarUses: 10, jarsOwned: [], prices: [] }
const canner = { id: 'c', name: 'C', innerDiameterMm: 310, usableHeightMm: 330, rackThicknessMm: 6, gaugeType: 'weighted' as const, maxLayers: 2, waterDepthMm: 76, lastGaugeTestAt: null }

describe('per-jar fill card', () => {
  it('shows the dry-pack pint at its cap of ½ cup and the grams from USDA cup weights (common practice, no published source)', async () => {
    const plan = planBatch({ lines: [{ recipeId: 'dry', jarSizeId: 'pint', amount: { mode: 'jars', jars: 18 } }], canners: [canner], altitudeFt: 500, today: '2026-12-01' }, catalogue, household)
    const line = plan.lines[0]!
    expect(line.perJar.dryMl).toBeCloseTo(cupMl / 2, 2)
    const wrapper = await mountSuspended(PlannerFillCard, { props: { line, jarName: 'Pint', unitSystem: 'us' } })
    expect(wrapper.get('[data-testid="fill-dry"]').text()).toBe('½ cup')
    expect(wrapper.text()).toContain(`${Math.round(194 / 2)} g`)
    expect(wrapper.get('[data-testid="fill-salt"]').text()).toBe('¼ tsp')
    expect(wrapper.get('[role="meter"]').attributes('aria-valuenow')).toBe('100')
    expect(wrapper.text()).toContain('18 × Pint')
  })

  it('headlines a hot pack by the cooked beans that go in the jar, with the dry weight to buy beside it', async () => {
    const plan = planBatch({ lines: [{ recipeId: 'hot', jarSizeId: 'pint', amount: { mode: 'jars', jars: 9 } }], canners: [canner], altitudeFt: 500, today: '2026-12-01' }, catalogue, household)
    const wrapper = await mountSuspended(PlannerFillCard, { props: { line: plan.lines[0]!, jarName: 'Pint', unitSystem: 'us' } })
    expect(wrapper.text()).toContain('Cooked beans per jar')
    expect(wrapper.text()).not.toContain('Dry beans per jar')
    // Swollen beans take at most ¾ of the pint (computation.md §2): 1½ cups.
    expect(wrapper.get('[data-testid="fill-cooked"]').text()).toBe('1½ cups')
    expect(wrapper.get('[data-testid="fill-dry"]').text()).toContain(`${Math.round(convert(3.25).from('lb').to('g') / 9)} g a jar`)
  })

  it('shows millilitres, not cups, for a metric household', async () => {
    const plan = planBatch({ lines: [{ recipeId: 'dry', jarSizeId: 'pint', amount: { mode: 'jars', jars: 9 }, dryMlPerJar: 100 }], canners: [canner], altitudeFt: 500, today: '2026-12-01' }, catalogue, { ...household, unitSystem: 'metric' })
    const wrapper = await mountSuspended(PlannerFillCard, { props: { line: plan.lines[0]!, jarName: 'Pint', unitSystem: 'metric' } })
    expect(wrapper.get('[data-testid="fill-dry"]').text()).toBe('100 mL')
    expect(wrapper.text()).not.toMatch(/cup/)
    // 100 mL of a 118.29 mL cap
    expect(wrapper.get('[role="meter"]').attributes('aria-valuenow')).toBe(String(Math.round((100 / (cupMl / 2)) * 100)))
  })
})
