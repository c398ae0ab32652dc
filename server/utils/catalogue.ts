import { and, asc, eq, inArray, isNull, or } from 'drizzle-orm'
import { sharedReference } from './referenceCache'
import { jarsPerMonthByProduct } from '~~/utils/after'
import type { Canner, Catalogue, HouseholdSettings, PriceItem, Recipe, RecipePrep } from '~~/utils/planning'
import type { Currency } from '~~/utils/vocabulary'
import { FUTURE_GAUGE_TEST } from '~~/utils/schemas/catalogue'
import type { Database } from './database'

/** Recipes a household may use: the shared library plus its own house recipes. */
export function visibleRecipes(householdId: string) {
  return or(isNull(tables.recipes.householdId), eq(tables.recipes.householdId, householdId))
}

type RecipeRow = typeof tables.recipes.$inferSelect
const day = (d: Date) => d.toISOString().slice(0, 10)
const why = (reason: string | null) => (reason ?? 'no reason given').replace(/[\s.]+$/, '')

/** Why a recipe may not be planned: it, or the tested recipe it borrows from, left the shared library. */
function retiredSentence(row: RecipeRow, basis: RecipeRow | undefined): string | undefined {
  if (row.retiredAt) return `${row.name} was retired from the shared library on ${day(row.retiredAt)}: ${why(row.retiredReason)}.`
  if (basis?.retiredAt) return `${row.name} borrows its time and pressure from ${basis.name}, which was retired from the shared library on ${day(basis.retiredAt)}: ${why(basis.retiredReason)}.`
  return undefined
}

/** A dry pack is only sorted and rinsed; household practice, no published source. */
const DRY_PACK_PREP: RecipePrep = { soak: 'none', cook: null, source: 'Dry pack, household practice: sort and rinse, then measure into jars (no soak)' }

/** A household's house recipe prepares as its pack says: a dry pack is rinsed, anything else as its tested basis. */
function prepOf(row: RecipeRow, basis: RecipeRow | undefined): RecipePrep | null {
  if (row.prep || row.householdId === null) return row.prep
  return row.packStyle === 'dry' ? DRY_PACK_PREP : basis?.prep ?? null
}

/**
 * Read the reference data into the planning computation's shapes. Recipe rows keep their
 * descriptive fields (source, summary, caution …) beside the planning fields.
 */
export async function loadCatalogue(db: Database, householdId: string) {
  // The published rows from memory (sharedReference checks their version); the house recipes read each time.
  const [shared, houseRows] = await Promise.all([
    sharedReference(db),
    db.select().from(tables.recipes).where(eq(tables.recipes.householdId, householdId)),
  ])
  const houseIds = houseRows.map(r => r.id)
  const [houseSpecs, houseBands] = houseIds.length
    ? await Promise.all([
        db.select().from(tables.recipeJarSpecs).where(inArray(tables.recipeJarSpecs.recipeId, houseIds)),
        db.select().from(tables.recipePressureBands).where(inArray(tables.recipePressureBands.recipeId, houseIds)),
      ])
    : [[], []]
  const recipeRows = [...shared.recipes, ...houseRows]
    .sort((a, b) => (a.status === b.status ? a.name.localeCompare(b.name) : a.status < b.status ? -1 : 1))
  const specs = [...shared.specs, ...houseSpecs]
  const bands = [...shared.bands, ...houseBands]
  const jarRows = shared.jarSizes
  const ingredientRows = shared.ingredients

  const recipes = recipeRows.map(row => ({
    ...row,
    caution: row.caution ?? undefined,
    retired: retiredSentence(row, recipeRows.find(b => b.id === row.basedOnRecipeId)),
    prep: prepOf(row, recipeRows.find(b => b.id === row.basedOnRecipeId)),
    perJar: specs.filter(s => s.recipeId === row.id && (s.dryGrams !== null || s.saltTsp !== null))
      .map(s => ({ jarKey: s.sizeKey, dryGrams: s.dryGrams ?? undefined, saltTsp: s.saltTsp ?? undefined })),
    processMinutes: specs.filter(s => s.recipeId === row.id && s.processMinutes !== null)
      .map(s => ({ jarKey: s.sizeKey, minutes: s.processMinutes! })),
    pressureBands: bands.filter(b => b.recipeId === row.id)
      .map(b => ({ gaugeType: b.gaugeType, minFt: b.minFt, maxFt: b.maxFt, psi: b.psi, source: b.source })),
  }))
  const catalogue: Catalogue = {
    recipes: recipes satisfies Recipe[],
    jarSizes: jarRows.map(j => ({ ...j, key: j.sizeKey })),
    ingredients: ingredientRows.map(i => ({ ...i, source: i.gramsPerCupSource })),
  }
  return { catalogue, recipes, jarSizes: [...jarRows], ingredients: [...ingredientRows] }
}

export function toPlanningCanner(row: typeof tables.canners.$inferSelect): Canner {
  return {
    id: row.id,
    name: row.name,
    innerDiameterMm: row.innerDiameterMm,
    usableHeightMm: row.usableHeightMm,
    rackThicknessMm: row.rackThicknessMm,
    gaugeType: row.gaugeType,
    maxLayers: row.maxLayers,
    waterDepthMm: row.waterDepthMm,
    lastGaugeTestAt: row.lastGaugeTestAt,
  }
}

export async function loadCanners(db: Database, householdId: string) {
  return db.select().from(tables.canners)
    .where(eq(tables.canners.householdId, householdId))
    .orderBy(asc(tables.canners.name))
}

function toPriceItem(row: typeof tables.priceItems.$inferSelect): PriceItem | null {
  switch (row.kind) {
    case 'ingredient':
      return row.ingredientId && row.packageGrams ? { kind: 'ingredient', ingredientId: row.ingredientId, packageGrams: row.packageGrams, priceCents: row.priceCents } : null
    case 'salt':
      return row.packageGrams ? { kind: 'salt', packageGrams: row.packageGrams, priceCents: row.priceCents } : null
    case 'lid':
      return row.packCount ? { kind: 'lid', jarMouth: row.mouth ?? undefined, jarSizeId: row.jarSizeId ?? undefined, packCount: row.packCount, priceCents: row.priceCents } : null
    case 'jar':
      return row.jarSizeId && row.packCount ? { kind: 'jar', jarSizeId: row.jarSizeId, packCount: row.packCount, priceCents: row.priceCents } : null
    case 'vinegar':
      return row.packageMl ? { kind: 'vinegar', packageMl: row.packageMl, priceCents: row.priceCents } : null
  }
}

/** The household's settings, prices and empty jars in the planning computation's shape. */
/** The household's today; a gauge test dated after it is refused, naming the field. */
export async function cannerToday(db: Database, householdId: string, lastGaugeTestAt?: string | null): Promise<string> {
  const today = householdToday(await householdTimeZone(db, householdId))
  if (lastGaugeTestAt && lastGaugeTestAt > today) badInput('lastGaugeTestAt', FUTURE_GAUGE_TEST)
  return today
}

/** The household's time zone: its dates ("today", a month, a best-by) are read in it. */
export async function householdTimeZone(db: Database, householdId: string): Promise<string> {
  const [household] = await db.select({ timeZone: tables.households.timeZone }).from(tables.households).where(eq(tables.households.id, householdId))
  if (!household) notFound('No such household.')
  return household.timeZone
}

export async function loadHouseholdSettings(db: Database, householdId: string): Promise<HouseholdSettings & { name: string, timeZone: string, currency: Currency }> {
  const [household] = await db.select().from(tables.households).where(eq(tables.households.id, householdId))
  if (!household) notFound('No such household.')
  const [prices, stock, dryGoods, eaten] = await Promise.all([
    db.select().from(tables.priceItems).where(eq(tables.priceItems.householdId, householdId)),
    db.select().from(tables.jarStock).where(eq(tables.jarStock.householdId, householdId)),
    db.select().from(tables.dryGoodsStock).where(eq(tables.dryGoodsStock.householdId, householdId)),
    jarsEatenByRecipe(db, householdId, household.timeZone),
  ])
  return {
    name: household.name,
    timeZone: household.timeZone,
    currency: household.currency,
    altitudeFt: household.altitudeFt,
    unitSystem: household.unitSystem,
    storeCanPriceCents: household.storeCanPriceCents,
    storeCan: { basis: household.storeCanBasis, amount: household.storeCanAmount },
    jarUses: household.jarUses,
    coolDownMinutes: { pint: household.coolDownPintMinutes, quart: household.coolDownQuartMinutes },
    jarsOwned: stock.map(s => ({ jarSizeId: s.jarSizeId, count: s.count })),
    dryGoodsOnHand: dryGoods.filter(g => g.grams > 0).map(g => ({ ingredientId: g.ingredientId, grams: g.grams })),
    jarsEatenPerMonth: eaten,
    prices: prices.map(toPriceItem).filter((p): p is PriceItem => p !== null),
  }
}

/**
 * Jars taken off the Shelf as eaten (not corrections, not undone), as the Pantry board's
 * "What you eat" reads them: every product's jars a month over the last 12 months.
 */
export async function jarsEatenRows(db: Database, householdId: string) {
  return db.select({
    movedAt: tables.shelfMovements.movedAt, jars: tables.shelfMovements.jars,
    product: tables.shelfLots.product, recipeId: tables.shelfLots.recipeId, jarSizeId: tables.shelfLots.jarSizeId,
  })
    .from(tables.shelfMovements).innerJoin(tables.shelfLots, eq(tables.shelfLots.id, tables.shelfMovements.lotId))
    .where(and(eq(tables.shelfMovements.householdId, householdId), isNull(tables.shelfMovements.undoneAt), eq(tables.shelfMovements.kind, 'taken')))
}

/** What the household eats, by recipe: jars a month summed over the recipe's products and jar sizes. */
async function jarsEatenByRecipe(db: Database, householdId: string, zone: string) {
  const rows = await jarsEatenRows(db, householdId)
  const perProduct = jarsPerMonthByProduct(rows.map(m => ({ at: m.movedAt, jars: m.jars, key: `${m.product}|${m.jarSizeId}`, product: m.product, recipeId: m.recipeId, jarSizeId: m.jarSizeId })), serverNow(), zone)
  const byRecipe = new Map<string, number>()
  for (const p of perProduct) if (p.recipeId) byRecipe.set(p.recipeId, (byRecipe.get(p.recipeId) ?? 0) + p.jarsPerMonth)
  return [...byRecipe].map(([recipeId, jarsPerMonth]) => ({ recipeId, jarsPerMonth }))
}
