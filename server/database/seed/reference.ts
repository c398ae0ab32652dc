/**
 * Published reference data, seeded at first start. Every value carries its source; where no
 * agency publishes a value (jar outside dimensions, expansion ratios) the row says so.
 * Sources: ../shared/reference/canning-reference.md (USDA Complete Guide to Home Canning,
 * AIB 539, rev. 2015 — "CG"; MSU Extension "Preserving Food Safely" reprints; USDA SR Legacy).
 */
import type { GaugeType } from '~~/utils/vocabulary'
import type { recipeJarSpecs, recipes } from '../schema'

/**
 * The version of the reference data below. Raise it with every correction of a published value
 * (a process time, a pressure band, a jar's capacity): a database holding an older version gets
 * the corrected rows at the next start, in one transaction.
 */
export const REFERENCE_VERSION = 2

const INCH_MM = 25.4
const POUND_G = 453.59237
const US_FL_OZ_ML = 29.5735295625

const NIST = 'NIST US customary definitions: 1 US fl oz = 29.5735295625 mL exactly'
const TYPICAL = 'Typical outside dimensions, measured by hand; no agency publishes them. Measure your own jars and edit.'

export const jarSizeSeed = [
  { id: 'half-pint-regular', sizeKey: 'half-pint', name: 'Half-pint, regular mouth', flOz: 8, odIn: 2.85, heightIn: 3.85, mouth: 'regular' },
  { id: 'pint-regular', sizeKey: 'pint', name: 'Pint, regular mouth', flOz: 16, odIn: 3.0, heightIn: 5.3, mouth: 'regular' },
  { id: 'pint-wide', sizeKey: 'pint', name: 'Pint, wide mouth', flOz: 16, odIn: 3.5, heightIn: 5.1, mouth: 'wide' },
  { id: 'pint-and-a-half-wide', sizeKey: 'pint-and-a-half', name: 'Pint-and-a-half, wide mouth', flOz: 24, odIn: 3.5, heightIn: 6.75, mouth: 'wide' },
  { id: 'quart-regular', sizeKey: 'quart', name: 'Quart, regular mouth', flOz: 32, odIn: 3.5, heightIn: 6.9, mouth: 'regular' },
  { id: 'quart-wide', sizeKey: 'quart', name: 'Quart, wide mouth', flOz: 32, odIn: 3.9, heightIn: 6.9, mouth: 'wide' },
  { id: 'half-gallon-wide', sizeKey: 'half-gallon', name: 'Half-gallon, wide mouth', flOz: 64, odIn: 4.4, heightIn: 9.3, mouth: 'wide' },
].map((j, i) => ({
  id: j.id,
  sizeKey: j.sizeKey,
  name: j.name,
  capacityMl: j.flOz * US_FL_OZ_ML,
  capacitySource: NIST,
  outsideDiameterMm: Math.round(j.odIn * INCH_MM * 10) / 10,
  heightMm: Math.round(j.heightIn * INCH_MM * 10) / 10,
  dimensionsNote: TYPICAL,
  mouth: j.mouth as 'regular' | 'wide',
  sortOrder: i,
}))

const SR = 'USDA SR Legacy (SR28) household measure, 1 cup raw mature seeds'
const EXPANSION = 'Rule of thumb: 1 cup dry makes about 3 cups cooked (U.S. Dry Bean Council "Counting Beans"; Nebraska Extension "Bean Counting"). Not a laboratory value.'

export const ingredientSeed = [
  { id: 'black-beans', name: 'Black beans', gramsPerCup: 194, sr: '16014' },
  { id: 'pinto-beans', name: 'Pinto beans', gramsPerCup: 193, sr: '16042' },
  { id: 'kidney-beans', name: 'Kidney beans', gramsPerCup: 184, sr: '16027' },
  { id: 'navy-beans', name: 'Navy beans', gramsPerCup: 208, sr: '16037' },
  { id: 'great-northern-beans', name: 'Great northern beans', gramsPerCup: 183, sr: '16024' },
  { id: 'chickpeas', name: 'Chickpeas (garbanzo)', gramsPerCup: 200, sr: '16056' },
  { id: 'large-lima-beans', name: 'Large lima beans (dry)', gramsPerCup: 178, sr: '16071' },
  { id: 'baby-lima-beans', name: 'Baby lima beans (dry)', gramsPerCup: 202, sr: '16074' },
  { id: 'small-white-beans', name: 'Small white beans', gramsPerCup: 215, sr: '16045' },
  { id: 'pink-beans', name: 'Pink beans', gramsPerCup: 210, sr: '16040' },
  { id: 'cranberry-beans', name: 'Cranberry (roman) beans', gramsPerCup: 195, sr: '16019' },
  { id: 'black-eyed-peas', name: 'Black-eyed peas (dry cowpeas)', gramsPerCup: 167, sr: '16062' },
  { id: 'soybeans', name: 'Soybeans (dry)', gramsPerCup: 186, sr: '16108' },
].map(i => ({
  id: i.id,
  name: i.name,
  form: 'dry' as 'dry' | 'fresh',
  gramsPerCup: i.gramsPerCup,
  gramsPerCupSource: `${SR}, NDB ${i.sr}`,
  expansionRatio: 3,
  expansionSource: EXPANSION,
}))

/** Fresh beans are bought by weight in the pod; they do not swell in the jar. */
ingredientSeed.push({
  id: 'lima-beans-fresh',
  name: 'Lima, butter or pinto beans, fresh in the pod',
  form: 'fresh',
  gramsPerCup: 156,
  gramsPerCupSource: 'USDA SR Legacy 11031 "Lima beans, immature seeds, raw", 1 cup shelled = 156 g [from memory, unverified]',
  expansionRatio: 1,
  expansionSource: 'Fresh shelled beans are already hydrated and do not swell in the jar.',
})

/** The pressure bands are the same for every low-acid legume product in the CG (reference §1.3). */
const pressureBands: Array<{ gaugeType: GaugeType, minFt: number, maxFt: number, psi: number, source: string }> = [
  { gaugeType: 'dial', minFt: 0, maxFt: 2000, psi: 11, source: 'CG Guide 4, Table 1 (dial gauge)' },
  { gaugeType: 'dial', minFt: 2001, maxFt: 4000, psi: 12, source: 'CG Guide 4, Table 1 (dial gauge)' },
  { gaugeType: 'dial', minFt: 4001, maxFt: 6000, psi: 13, source: 'CG Guide 4, Table 1 (dial gauge)' },
  { gaugeType: 'dial', minFt: 6001, maxFt: 8000, psi: 14, source: 'CG Guide 4, Table 1 (dial gauge)' },
  { gaugeType: 'weighted', minFt: 0, maxFt: 1000, psi: 10, source: 'CG Guide 4, Table 2 (weighted gauge)' },
  // The published table says "above 1,000 ft" with no upper edge.
  { gaugeType: 'weighted', minFt: 1001, maxFt: 2_147_483_647, psi: 15, source: 'CG Guide 4, Table 2 (weighted gauge)' },
]

const HEADSPACE_1_IN = INCH_MM
/** CG Guide 4 "Quantity": 3¼ lb per 9 pints; ¾ lb per quart. */
const PINT_DRY_G = (3.25 * POUND_G) / 9
const QUART_DRY_G = 0.75 * POUND_G

const HYDRATE = 'Sort and rinse the beans. Soak 12–18 hours in cold water in a cool place, or cover with boiling water, boil 2 minutes, take off the heat and soak 1 hour. Drain.'

const GUIDE_4 = 'USDA Complete Guide to Home Canning (2015), Guide 4'
/** Time to bring a pot of beans back to a boil: common practice, no published source. */
const TO_A_BOIL_MIN = 15

/** A shared library recipe row, with its per-jar-size specs beside it. */
export type RecipeSeed = Omit<typeof recipes.$inferInsert, 'householdId' | 'createdBy' | 'createdAt' | 'updatedAt'> & {
  jarSpecs: Array<Omit<typeof recipeJarSpecs.$inferInsert, 'recipeId'>>
}

export const recipeSeed: RecipeSeed[] = [
  {
    id: 'usda-dried-beans-hot-pack',
    name: 'Dried beans or peas, hot pack',
    status: 'tested',
    packStyle: 'hot',
    ingredientId: 'pinto-beans',
    headspaceMm: HEADSPACE_1_IN,
    solidsFillFraction: 1,
    fillBasis: 'published',
    summary: 'Any variety of dried beans or peas, soaked, boiled 30 minutes, packed hot with their cooking water.',
    steps: `${HYDRATE} Cover with fresh water and boil 30 minutes. Add ½ tsp salt per pint or 1 tsp per quart if desired. Fill jars with beans and cooking water, leaving 1 inch headspace.`,
    source: 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 4 "Beans or peas—shelled, dried, all varieties"; MSU Extension PFS 01600235; UF/IFAS EDIS HE8302',
    caution: null,
    prep: { soak: 'either', cook: { label: 'drain, cover with fresh water and boil 30 minutes', minutes: 30 }, source: `${GUIDE_4} "Beans or peas—shelled, dried": soak 12–18 h, or boil 2 min and stand 1 h; boil 30 min` },
    jarSpecs: [
      { sizeKey: 'pint', dryGrams: PINT_DRY_G, saltTsp: 0.5, processMinutes: 75 },
      { sizeKey: 'quart', dryGrams: QUART_DRY_G, saltTsp: 1, processMinutes: 90 },
    ],
  },
  {
    id: 'usda-beans-in-sauce',
    name: 'Dried beans with tomato or molasses sauce',
    status: 'tested',
    packStyle: 'hot',
    ingredientId: 'navy-beans',
    headspaceMm: HEADSPACE_1_IN,
    solidsFillFraction: 0.75,
    fillBasis: 'published',
    summary: 'Quick-soaked beans, jars filled three-quarters full, topped with hot tomato or molasses sauce.',
    steps: 'Cover each cup of beans with 3 cups water, boil 2 minutes, soak 1 hour, drain. Bring to a boil in fresh water and keep the liquid for the sauce. Fill jars ¾ full with hot beans, add a ¾-inch cube of pork if desired, top with hot sauce leaving 1 inch headspace.',
    source: 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 4 "Beans, dry, with tomato or molasses sauce"; MSU Extension PFS 01600236; UF/IFAS EDIS FCS8304',
    caution: null,
    prep: { soak: 'quick', cook: { label: 'drain, bring to a boil in fresh water and keep the liquid for the sauce', minutes: TO_A_BOIL_MIN }, source: `${GUIDE_4} "Beans, dry, with tomato or molasses sauce": quick soak; ${TO_A_BOIL_MIN} min to a boil: common practice, no published source` },
    jarSpecs: [
      { sizeKey: 'pint', dryGrams: PINT_DRY_G, saltTsp: null, processMinutes: 65 },
      { sizeKey: 'quart', dryGrams: QUART_DRY_G, saltTsp: null, processMinutes: 75 },
    ],
  },
  {
    id: 'usda-baked-beans',
    name: 'Baked beans',
    status: 'tested',
    packStyle: 'hot',
    ingredientId: 'navy-beans',
    headspaceMm: HEADSPACE_1_IN,
    solidsFillFraction: 1,
    fillBasis: 'published',
    summary: 'Soaked and boiled beans baked with molasses sauce, packed hot.',
    steps: 'Soak and boil as for beans in sauce. Bake 4–5 hours at 350 °F with molasses sauce and pork. Fill jars hot, leaving 1 inch headspace.',
    source: 'USDA Complete Guide to Home Canning (AIB 539, rev. 1994 and 2015), Guide 4 "Beans, baked"; MSU Extension PFS 01600237',
    caution: null,
    prep: { soak: 'quick', cook: { label: 'drain, bring to a boil, then bake 4–5 hours at 350 °F with the molasses sauce', minutes: 4 * 60 }, source: `${GUIDE_4} "Beans, baked": soak and boil as for beans in sauce, bake 4–5 h at 350 °F (the shortest bake is timed)` },
    jarSpecs: [
      { sizeKey: 'pint', dryGrams: PINT_DRY_G, saltTsp: null, processMinutes: 65 },
      { sizeKey: 'quart', dryGrams: QUART_DRY_G, saltTsp: null, processMinutes: 75 },
    ],
  },
  {
    id: 'usda-bean-soup',
    name: 'Soup with dried beans or peas',
    status: 'tested',
    packStyle: 'hot',
    ingredientId: 'great-northern-beans',
    headspaceMm: HEADSPACE_1_IN,
    solidsFillFraction: 0.5,
    fillBasis: 'cap',
    summary: 'Rehydrated beans with vegetables or meat; jars only half full of solids, topped with broth. Never thickened.',
    steps: 'Cover each cup of beans with 3 cups water, boil 2 minutes, soak 1 hour, heat to a boil. Combine with the other soup ingredients and boil 5 minutes. Do not thicken. Fill jars halfway with solids, top with liquid, leaving 1 inch headspace.',
    source: 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 4 "Soups"; MSU Extension PFS 01600886',
    caution: 'Soups with seafood need 100 minutes for pints and quarts; this entry is for soups without seafood.',
    prep: { soak: 'quick', cook: { label: 'drain, heat to a boil in fresh water, combine with the other ingredients and boil 5 minutes', minutes: TO_A_BOIL_MIN + 5 }, source: `${GUIDE_4} "Soups": boil 2 min, soak 1 h, heat to a boil, boil 5 min combined; ${TO_A_BOIL_MIN} min to a boil: common practice, no published source` },
    jarSpecs: [
      { sizeKey: 'pint', dryGrams: null, saltTsp: null, processMinutes: 60 },
      { sizeKey: 'quart', dryGrams: null, saltTsp: null, processMinutes: 75 },
    ],
  },
  {
    id: 'usda-fresh-lima-hot-pack',
    name: 'Fresh lima, butter or pinto beans, shelled, hot pack',
    status: 'tested',
    packStyle: 'hot',
    ingredientId: 'lima-beans-fresh',
    headspaceMm: HEADSPACE_1_IN,
    solidsFillFraction: 1,
    fillBasis: 'published',
    summary: 'Young tender beans, shelled, boiled and packed loosely with their boiling liquid. Amounts are weights in the pod.',
    steps: 'Shell and wash the beans. Cover with boiling water and bring to a boil. Fill jars loosely with the hot beans, add 1 tsp salt per quart if desired, top with boiling water leaving 1 inch headspace.',
    source: 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 4 "Beans, lima—shelled"; MSU Extension PFS 01600712 (28 lb in pods per 7 quarts, 18 lb per 9 pints)',
    caution: null,
    prep: { soak: 'none', cook: { label: 'shell and wash the beans, cover with boiling water and bring to a boil', minutes: 30 }, source: `${GUIDE_4} "Beans, lima—shelled"; 30 min for shelling and boiling: common practice, no published source` },
    jarSpecs: [
      { sizeKey: 'pint', dryGrams: (18 * POUND_G) / 9, saltTsp: 0.5, processMinutes: 40 },
      { sizeKey: 'quart', dryGrams: (28 * POUND_G) / 7, saltTsp: 1, processMinutes: 50 },
    ],
  },
  {
    id: 'house-dry-pack-beans',
    name: 'Dry-packed beans (no soak)',
    status: 'house',
    packStyle: 'dry',
    ingredientId: 'black-beans',
    headspaceMm: HEADSPACE_1_IN,
    solidsFillFraction: 0.75,
    fillBasis: 'cap',
    summary: 'Rinsed dry beans measured straight into jars, topped with boiling water. A household practice.',
    steps: 'Sort and rinse the dry beans. Measure no more than the fill cap into each hot jar, add salt if you like, fill with boiling water to 1 inch headspace, wipe rims with vinegar, lid and load.',
    source: 'Household practice; no published process. Time and pressure borrowed from the USDA hot-pack table (CG Guide 4), which was tested only for soaked and boiled beans.',
    basedOnRecipeId: 'usda-dried-beans-hot-pack',
    caution: 'Untested — your own risk. Dry-packing (no soak) is not a laboratory-tested process: USDA and extension guidance (OSU EM 9435, 2024; Penn State Extension) say dried beans must be hydrated before canning. Never exceed the fill cap: beans swell about threefold and can crowd out the liquid or break the jar.',
    prep: { soak: 'none', cook: null, source: 'Household practice: sort and rinse, then measure into jars (no soak)' },
    jarSpecs: [
      { sizeKey: 'pint', dryGrams: null, saltTsp: 0.25, processMinutes: 75 },
      { sizeKey: 'quart', dryGrams: null, saltTsp: 0.5, processMinutes: 90 },
    ],
  },
]

export const recipePressureBandSeed = recipeSeed.flatMap(r =>
  pressureBands.map(b => ({ recipeId: r.id, ...b })),
)
