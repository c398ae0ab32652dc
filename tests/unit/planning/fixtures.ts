/**
 * Test catalogue. Published values carry their source; jar and canner dimensions are TYPICAL
 * figures from memory (no agency publishes them — canning reference §5.2), so tests built on
 * them assert only what holds across the typical range.
 */
import type { Canner, Catalogue, HouseholdSettings, Ingredient, JarSize, PressureBand, Recipe } from '~~/utils/planning'

// Nominal capacities: exact US customary volumes (NIST; canning reference §5.1).
// Diameters and heights: typical, from memory (reference §5.2 ranges), not published.
const jar = (key: string, name: string, capacityMl: number, outsideDiameterMm: number, heightMm: number, mouth: JarSize['mouth']): JarSize => ({
  id: `j-${key}`, key, name, capacityMl, outsideDiameterMm, heightMm, mouth,
})
export const halfPint = jar('half-pint', 'Half-pint', 236.5882365, 71, 98, 'regular')
export const pint = jar('pint', 'Pint', 473.176473, 76, 135, 'regular')
export const pintAndAHalf = jar('pint-and-a-half', 'Pint-and-a-half', 709.7647095, 89, 165, 'wide')
export const quart = jar('quart', 'Quart', 946.352946, 89, 175, 'regular')
export const halfGallon = jar('half-gallon', 'Half-gallon', 1892.705892, 112, 240, 'wide')
export const jarSizes = [halfPint, pint, pintAndAHalf, quart, halfGallon]

// Grams per cup, raw dry mature seeds: USDA SR28 / FoodData Central SR Legacy (reference §4.1).
// Expansion ratio 3: "1 cup dry ≈ 3 cups cooked" (U.S. Dry Bean Council; reference §4.3).
const bean = (id: string, name: string, gramsPerCup: number): Ingredient => ({
  id, name, gramsPerCup, expansionRatio: 3, source: 'USDA SR Legacy portion weight; expansion: U.S. Dry Bean Council',
})
export const blackBeans = bean('i-black', 'Black beans', 194)
export const kidneyBeans = bean('i-kidney', 'Kidney beans', 184)
export const pintoBeans = bean('i-pinto', 'Pinto beans', 193)
export const ingredients = [blackBeans, kidneyBeans, pintoBeans]

/** CG Tables 1 and 2 (reference §1.3): the same bands for every low-acid product. */
export const usdaBands: PressureBand[] = [
  { gaugeType: 'dial', minFt: 0, maxFt: 2000, psi: 11 },
  { gaugeType: 'dial', minFt: 2001, maxFt: 4000, psi: 12 },
  { gaugeType: 'dial', minFt: 4001, maxFt: 6000, psi: 13 },
  { gaugeType: 'dial', minFt: 6001, maxFt: 8000, psi: 14 },
  { gaugeType: 'weighted', minFt: 0, maxFt: 1000, psi: 10 },
  // "Above 1,000 ft: 15 psi" has no upper end in the CG; 30,000 ft is above any kitchen.
  { gaugeType: 'weighted', minFt: 1001, maxFt: 30000, psi: 15 },
]

const LB = 453.59237
const times = (pintMin: number, quartMin: number) => [
  { jarKey: 'pint', minutes: pintMin },
  { jarKey: 'quart', minutes: quartMin },
]

/** CG Guide 4 "Beans or peas—shelled, dried": hot pack, 1 in headspace, 75/90 min, ¾ lb per quart, 3¼ lb per 9 pints. */
export const usdaDryBeans: Recipe = {
  id: 'r-usda-dry', name: 'Dried beans, hot pack (USDA)', status: 'tested', packStyle: 'hot', ingredientId: blackBeans.id,
  headspaceMm: 25.4, solidsFillFraction: 0.75, fillBasis: 'published',
  perJar: [
    { jarKey: 'pint', dryGrams: (3.25 * LB) / 9, saltTsp: 0.5 },
    { jarKey: 'quart', dryGrams: 0.75 * LB, saltTsp: 1 },
  ],
  processMinutes: times(75, 90), pressureBands: usdaBands, source: 'USDA Complete Guide (AIB 539) Guide 4',
}

/** Published products of CG Guide 4 with their pint/quart times (reference §3). */
export const publishedProducts: Array<{ name: string, pint: number, quart: number, source: string }> = [
  { name: 'Dry beans or peas', pint: 75, quart: 90, source: 'CG Guide 4 Tables 1–2; MSU-PFS 01600235' },
  { name: 'Beans with tomato or molasses sauce', pint: 65, quart: 75, source: 'CG Guide 4; MSU-PFS 01600236; EDIS FCS8304' },
  { name: 'Baked beans', pint: 65, quart: 75, source: 'CG Guide 4; MSU-PFS 01600237' },
  { name: 'Fresh lima, butter, pinto or soy beans', pint: 40, quart: 50, source: 'CG Guide 4; MSU-PFS 01600712' },
  { name: 'Soups with dried beans', pint: 60, quart: 75, source: 'CG Guide 4; MSU-PFS 01600886' },
]

export function productRecipe(p: { name: string, pint: number, quart: number, source: string }): Recipe {
  return { ...usdaDryBeans, id: `r-${p.name}`, name: p.name, processMinutes: times(p.pint, p.quart), source: p.source }
}

/** House dry-pack recipe (common practice, no published source): cap f·V/E with f = ¾. */
export const dryPack: Recipe = {
  id: 'r-dry', name: 'Dry-pack black beans (house)', status: 'house', packStyle: 'dry', ingredientId: blackBeans.id,
  headspaceMm: 25.4, solidsFillFraction: 0.75, fillBasis: 'cap',
  perJar: [{ jarKey: 'pint', saltTsp: 0.25 }, { jarKey: 'quart', saltTsp: 0.5 }],
  processMinutes: times(75, 90), pressureBands: usdaBands, source: 'Household practice', caution: 'Soak-free beans.',
}
export const dryPackKidney: Recipe = {
  ...dryPack, id: 'r-dry-kidney', name: 'Dry-pack kidney beans (house)', ingredientId: kidneyBeans.id,
}

export const recipes = [usdaDryBeans, dryPack, dryPackKidney]
export const catalogue: Catalogue = { recipes, jarSizes, ingredients }

/**
 * Canners, TYPICAL dimensions from memory (not published): a standard canner about 300 mm
 * (11.8 in) across, one layer tall for quarts; a large one of the same width, tall enough for
 * two layers of pints; a small one about 240 mm across.
 */
export const standardCanner: Canner = {
  id: 'c-std', name: 'Standard canner', innerDiameterMm: 300, usableHeightMm: 200, rackThicknessMm: 10,
  gaugeType: 'weighted', maxLayers: 2, waterDepthMm: 76, lastGaugeTestAt: null,
}
export const largeCanner: Canner = { ...standardCanner, id: 'c-large', name: 'Large canner', usableHeightMm: 290 }
export const smallCanner: Canner = { ...standardCanner, id: 'c-small', name: 'Small canner', innerDiameterMm: 240 }
export const dialCanner: Canner = { ...largeCanner, id: 'c-dial', name: 'Dial canner', gaugeType: 'dial', lastGaugeTestAt: '2025-03-01' }

export const household: HouseholdSettings = {
  altitudeFt: 500,
  unitSystem: 'us',
  storeCanPriceCents: 129,
  jarUses: 10,
  jarsOwned: [{ jarSizeId: pint.id, count: 12 }, { jarSizeId: quart.id, count: 7 }],
  prices: [
    { kind: 'ingredient', ingredientId: blackBeans.id, packageGrams: 2 * LB, priceCents: 349 },
    { kind: 'ingredient', ingredientId: blackBeans.id, packageGrams: 4 * LB, priceCents: 599 },
    { kind: 'ingredient', ingredientId: kidneyBeans.id, packageGrams: 2 * LB, priceCents: 379 },
    { kind: 'salt', packageGrams: 1360, priceCents: 399 },
    { kind: 'lid', jarMouth: 'regular', packCount: 12, priceCents: 399 },
    { kind: 'lid', jarMouth: 'wide', packCount: 12, priceCents: 499 },
    { kind: 'jar', jarSizeId: pint.id, packCount: 12, priceCents: 1399 },
    { kind: 'jar', jarSizeId: quart.id, packCount: 12, priceCents: 1599 },
    { kind: 'vinegar', packageMl: 946.352946, priceCents: 249 },
  ],
}

export const TODAY = '2025-09-14'
