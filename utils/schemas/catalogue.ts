/**
 * Schemas and pure rules for the catalogue and household equipment: house recipes, canners,
 * the price list and empty jars owned. Shared by the API routes and the forms.
 */
import { gaugeTypes, jarMouths, packStyles } from '../vocabulary'
import { z } from './z'
import { inPlausibleYears, isCalendarDate, PLAUSIBLE_YEARS_MESSAGE } from './fields'
import { formatLength } from '../planning/units'
import { gaugeTestWarning } from '../planning/process'
import type { Canner, GaugeType } from '../planning/types'

const num = (message: string) => z.number({ invalid_type_error: message, required_error: message })
const uuid = (what: string) => z.string().uuid(`That ${what} id is not valid.`)

/** "150 mm (5⅞ in)–600 mm (23⅝ in)": a range a person can check with either tape measure. */
const mmRange = (min: number, max: number) =>
  `${formatLength(min, 'metric')} and ${formatLength(max, 'metric')} (${formatLength(min, 'us')} and ${formatLength(max, 'us')})`
const mmBetween = (what: string, min: number, max: number, how = '') => {
  const message = `${what} must be between ${mmRange(min, max)}.${how ? ` ${how}` : ''}`
  return num(message).min(min, message).max(max, message)
}

export const HouseholdQuerySchema = z.object({ householdId: uuid('household') })
export const RecipeParamsSchema = z.object({ id: z.string().min(1).max(120) })
export const HouseRecipeParamsSchema = z.object({ id: uuid('household'), recipeId: z.string().min(1).max(120) })
export const CannerParamsSchema = z.object({ id: uuid('household'), cannerId: uuid('canner') })
export const PriceParamsSchema = z.object({ id: uuid('household'), priceId: uuid('price') })

// ---------------------------------------------------------------------------
// Recipes

/** Low-acid foods need at least 1 inch of headspace in a pressure canner (CG Guide 1; reference §5.3). */
export const MIN_HEADSPACE_MM = 25.4

/** Every house recipe carries this text first; the canner's own note follows it. */
export const HOUSE_CAUTION = 'Untested — your own risk. This is a household recipe, not a laboratory-tested process. '
  + 'Its process time and pressure are copied from the tested recipe named below, which was tested only as published. '
  + 'Never exceed the fill cap, and follow current USDA/NCHFP guidance, your local extension service and your canner\'s manual.'

export function houseCaution(note: string | null | undefined): string {
  return note ? `${HOUSE_CAUTION}\n\nCanner's note: ${note}` : HOUSE_CAUTION
}

const refusedField = (message: string) => z.never({ errorMap: () => ({ message }) }).optional()
const BORROWED = 'A house recipe cannot set its own process time or pressure: they are copied from the tested recipe it is based on (basedOnRecipeId).'

/** The most of a jar swollen dried beans may take (the planning model's f = ¾, computation.md §2). */
export const DRY_BEANS_MAX_FILL = 0.75

export const HouseRecipeSchema = z.object({
  name: z.string().trim().min(1, 'Name the recipe, for example "Dry-packed pintos".').max(80, 'Keep the name under 80 characters.'),
  basedOnRecipeId: z.string({ required_error: 'Choose the tested recipe whose process table this recipe borrows.', invalid_type_error: 'Choose the tested recipe whose process table this recipe borrows.' })
    .min(1, 'Choose the tested recipe whose process table this recipe borrows.'),
  ingredientId: z.string({ required_error: 'Choose the bean.', invalid_type_error: 'Choose the bean.' }).min(1, 'Choose the bean.'),
  packStyle: z.enum(packStyles, { errorMap: () => ({ message: 'Choose hot pack, raw pack or dry pack.' }) }),
  headspaceMm: num('Choose the headspace.')
    .min(MIN_HEADSPACE_MM, 'Beans are low-acid: leave at least 1 inch (25.4 mm) of headspace in a pressure canner.')
    .max(50.8, 'More than 2 inches (51 mm) of headspace can leave too much air in the jar to seal well.'),
  solidsFillFraction: num('Choose how full of beans a jar may be.')
    .gt(0, 'The beans must take some part of the jar: more than 0.')
    .max(1, 'The swollen beans cannot take more than the whole jar (1).'),
  summary: z.string().trim().max(300, 'Keep the summary under 300 characters.').default(''),
  steps: z.string().trim().min(1, 'Write the steps, so everyone who fills jars does the same.').max(4000, 'Keep the steps under 4,000 characters.'),
  note: z.string().trim().max(600, 'Keep the note under 600 characters.').default(''),
  jars: z.array(z.object({
    sizeKey: z.string().min(1, 'Choose a jar size.'),
    saltTsp: num('Enter the salt per jar in teaspoons, or 0 for none.').min(0, 'Salt cannot be negative.').max(2, 'More than 2 tsp of salt per jar is not a canning amount.'),
  })).min(1, 'Choose at least one jar size.').max(5)
    .refine(jars => new Set(jars.map(j => j.sizeKey)).size === jars.length, 'Choose each jar size once.'),
  processMinutes: refusedField(BORROWED),
  pressureBands: refusedField(BORROWED),
})
export type HouseRecipeInput = z.infer<typeof HouseRecipeSchema>

interface BaseRecipe {
  id: string
  name: string
  status: 'tested' | 'house'
  householdId: string | null
  source: string
  retired?: string
  processMinutes: Array<{ jarKey: string, minutes: number }>
  pressureBands: Array<{ gaugeType: GaugeType, minFt: number, maxFt: number, psi: number, source: string }>
}

export interface CatalogueIssue { field: string, message: string }
/** 400 for a reference to nothing; 422 when the tested table gives no basis for what was asked. */
export interface HouseRecipeRefusal { status: 400 | 422, issues: CatalogueIssue[] }

/**
 * The rows a house recipe is stored as. Its process minutes and pressure bands are copied
 * from a shared tested recipe, never taken from the client. Its jar sizes must be covered by
 * that table: the same size, or a smaller one (which takes the next larger size's time, Iowa
 * State AnswerLine 2019); a larger jar is refused, since a time "cannot be extended by any
 * formula" (Penn State Extension; NCHFP).
 */
export function houseRecipeTables(
  body: HouseRecipeInput,
  catalogue: {
    recipes: readonly BaseRecipe[]
    jarSizes: ReadonlyArray<{ sizeKey: string, name: string, capacityMl: number }>
    ingredients: ReadonlyArray<{ id: string, form?: string }>
  },
): HouseRecipeRefusal | { base: BaseRecipe, specs: Array<{ sizeKey: string, saltTsp: number | null, processMinutes: number | null }>, bands: BaseRecipe['pressureBands'] } {
  const { recipes, jarSizes, ingredients } = catalogue
  const base = recipes.find(r => r.id === body.basedOnRecipeId && r.status === 'tested' && r.householdId === null)
  if (!base || base.processMinutes.length === 0) {
    return { status: 400, issues: [{ field: 'basedOnRecipeId', message: 'Choose one of the shared tested recipes: a house recipe borrows its process time and pressure from one.' }] }
  }
  if (base.retired) return { status: 422, issues: [{ field: 'basedOnRecipeId', message: `${base.retired} Choose another tested recipe.` }] }
  const bean = ingredients.find(i => i.id === body.ingredientId)
  if (!bean) {
    return { status: 400, issues: [{ field: 'ingredientId', message: 'That bean is not in the ingredient list.' }] }
  }
  if (bean.form === 'dry') {
    // Dried beans are soaked and hot-packed (CG Guide 4) or, as household practice, dry-packed;
    // a raw pack is for fresh beans, and swollen beans packed to the top leave no room for the heat.
    if (body.packStyle === 'raw') {
      return { status: 422, issues: [{ field: 'packStyle', message: 'Dried beans are not raw-packed: soak and boil them for a hot pack (USDA Complete Guide, Guide 4), or dry-pack them. Raw pack is for fresh beans.' }] }
    }
    if (body.solidsFillFraction > DRY_BEANS_MAX_FILL + 1e-9) {
      return { status: 422, issues: [{ field: 'solidsFillFraction', message: 'Swollen dried beans may fill at most ¾ of the jar; packed tighter, the heat cannot reach the middle of the jar in the published time.' }] }
    }
  }
  const unknown = body.jars.findIndex(j => !jarSizes.some(s => s.sizeKey === j.sizeKey))
  if (unknown >= 0) return { status: 400, issues: [{ field: `jars.${unknown}.sizeKey`, message: 'That jar size is not in the jar catalogue.' }] }
  const capacity = (key: string) => Math.max(0, ...jarSizes.filter(j => j.sizeKey === key).map(j => j.capacityMl))
  const largestKey = [...base.processMinutes].sort((a, b) => capacity(b.jarKey) - capacity(a.jarKey))[0]!.jarKey
  const largestName = jarSizes.find(j => j.sizeKey === largestKey)?.name.split(',')[0] ?? largestKey
  const issues: CatalogueIssue[] = []
  body.jars.forEach((jar, i) => {
    if (capacity(jar.sizeKey) > capacity(largestKey)) {
      issues.push({
        field: `jars.${i}.sizeKey`,
        message: `${base.name} was tested in jars up to ${largestName.toLowerCase()} size; a process time cannot be extended to a larger jar (Penn State Extension; NCHFP). Choose ${largestName.toLowerCase()} jars or smaller.`,
      })
    }
  })
  if (issues.length) return { status: 422, issues }
  const keys = [...new Set([...base.processMinutes.map(p => p.jarKey), ...body.jars.map(j => j.sizeKey)])]
  const specs = keys.map(sizeKey => ({
    sizeKey,
    saltTsp: body.jars.find(j => j.sizeKey === sizeKey)?.saltTsp ?? null,
    processMinutes: base.processMinutes.find(p => p.jarKey === sizeKey)?.minutes ?? null,
  }))
  const bands = base.pressureBands.map(b => ({ ...b, source: `${b.source}, as published for "${base.name}"` }))
  return { base, specs, bands }
}

/** The recipe row of a house recipe: always 'house', always capped fill, always cautioned. */
export function houseRecipeRow(body: HouseRecipeInput, base: { name: string, source: string }) {
  return {
    name: body.name,
    status: 'house' as const,
    packStyle: body.packStyle,
    ingredientId: body.ingredientId,
    headspaceMm: body.headspaceMm,
    solidsFillFraction: body.solidsFillFraction,
    fillBasis: 'cap' as const,
    summary: body.summary,
    steps: body.steps,
    source: `Household recipe; no published process. Process time and pressure copied from "${base.name}" (${base.source}).`,
    caution: houseCaution(body.note),
    cautionNote: body.note || null,
    basedOnRecipeId: body.basedOnRecipeId,
  }
}

// ---------------------------------------------------------------------------
// Canners

const isoDate = /^\d{4}-\d{2}-\d{2}$/
export const CannerSchema = z.object({
  name: z.string().trim().min(1, 'Name the canner, for example "Tall canner (23 qt)".').max(80, 'Keep the name under 80 characters.'),
  innerDiameterMm: mmBetween('The inside diameter', 150, 600, 'Measure straight across the inside of the pot.'),
  usableHeightMm: mmBetween('The usable height', 100, 600, 'Measure from the rack to the underside of the closed lid.'),
  rackThicknessMm: mmBetween('The rack thickness', 0, 40),
  gaugeType: z.enum(gaugeTypes, { errorMap: () => ({ message: 'Choose a dial gauge or a weighted gauge.' }) }),
  maxLayers: num('Enter how many layers of jars the canner takes.').int('Enter whole layers.').min(1, 'A canner takes at least one layer.').max(3, 'No home canner stacks more than 3 layers.'),
  waterDepthMm: mmBetween('The water depth', 25, 200, 'Use the depth your canner\'s manual gives, usually 2–3 inches.'),
  lastGaugeTestAt: z.preprocess(
    v => (v === '' ? null : v),
    z.string().regex(isoDate, 'Enter the date of the last gauge test, or leave it empty.')
      .refine(isCalendarDate, 'That date does not exist.')
      .refine(inPlausibleYears, PLAUSIBLE_YEARS_MESSAGE)
      .nullable(),
  ).optional(),
})
export type CannerInput = z.infer<typeof CannerSchema>

/**
 * Dial gauges are due for an accuracy test when never tested or tested more than a year ago
 * (PNW 421; Illinois Extension); weighted gauges need none (University of Missouri Extension).
 * The rule itself is the planner's, so the Household page and the planner always agree.
 */
export function gaugeTestDue(canner: Canner, today: string): boolean {
  return gaugeTestWarning(canner, today, 'canner') !== null
}

/** Message for a gauge test dated after the household's today (checked by the server, which knows the date). */
export const FUTURE_GAUGE_TEST = 'A gauge test date cannot be in the future.'

/** A canner row as the API answers it: with `gaugeTestDue` as of today. */
export function withGaugeStatus<T extends Canner>(canner: T, today: string): T & { gaugeTestDue: boolean } {
  return { ...canner, gaugeTestDue: gaugeTestDue(canner, today) }
}

// ---------------------------------------------------------------------------
// Price list and jars owned

const label = z.string().trim().min(1, 'Say what the package is, for example "Pinto beans, 2 lb bag".').max(80, 'Keep the label under 80 characters.')
const priceCents = num('Enter the price.').int('Enter the price to the cent.').min(0, 'A price cannot be negative.').max(1_000_000, 'Enter the price of one package (at most 10,000).')
const packageGrams = num('Enter the package weight.').positive('A package must weigh more than nothing.').max(50_000, 'A package over 50 kg (110 lb) looks like a typing slip.')
const packCount = num('Enter how many are in the pack.').int('Enter a whole number.').min(1, 'A pack holds at least 1.').max(500, 'A pack of more than 500 looks like a typing slip.')

export const priceKindLabels = { ingredient: 'Beans', salt: 'Salt', lid: 'Lids', jar: 'Jars', vinegar: 'Vinegar' } as const

export const PriceItemSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('ingredient'), label, priceCents, ingredientId: z.string({ invalid_type_error: 'Choose the bean.' }).min(1, 'Choose the bean.'), packageGrams }),
  z.object({ kind: z.literal('salt'), label, priceCents, packageGrams }),
  z.object({ kind: z.literal('lid'), label, priceCents, mouth: z.enum(jarMouths, { errorMap: () => ({ message: 'Choose regular or wide mouth.' }) }), packCount }),
  z.object({ kind: z.literal('jar'), label, priceCents, jarSizeId: z.string({ invalid_type_error: 'Choose the jar size.' }).min(1, 'Choose the jar size.'), packCount }),
  z.object({ kind: z.literal('vinegar'), label, priceCents, packageMl: num('Enter the bottle size.').positive('A bottle holds more than nothing.').max(20_000, 'A bottle over 20 L looks like a typing slip.') }),
], { errorMap: (issue, ctx) => (issue.code === 'invalid_union_discriminator' ? { message: 'Choose what the item is: beans, salt, lids, jars or vinegar.' } : { message: ctx.defaultError }) })
export type PriceItemInput = z.infer<typeof PriceItemSchema>

/** The price row's columns: the fields of the item's kind, the others cleared. */
export function priceColumns(item: PriceItemInput) {
  return {
    kind: item.kind,
    label: item.label,
    priceCents: item.priceCents,
    ingredientId: item.kind === 'ingredient' ? item.ingredientId : null,
    jarSizeId: item.kind === 'jar' ? item.jarSizeId : null,
    mouth: item.kind === 'lid' ? item.mouth : null,
    packageGrams: item.kind === 'ingredient' || item.kind === 'salt' ? item.packageGrams : null,
    packageMl: item.kind === 'vinegar' ? item.packageMl : null,
    packCount: item.kind === 'lid' || item.kind === 'jar' ? item.packCount : null,
  }
}

/** A price or stock row must name a bean and a jar size the catalogue knows (else a 400 on that field). */
export function unknownReference(
  item: { ingredientId?: string | null, jarSizeId?: string | null },
  catalogue: { ingredients: ReadonlyArray<{ id: string }>, jarSizes: ReadonlyArray<{ id: string }> },
): CatalogueIssue | null {
  if (item.ingredientId && !catalogue.ingredients.some(i => i.id === item.ingredientId)) {
    return { field: 'ingredientId', message: 'That bean is not in the ingredient list.' }
  }
  if (item.jarSizeId && !catalogue.jarSizes.some(j => j.id === item.jarSizeId)) {
    return { field: 'jarSizeId', message: 'That jar size is not in the jar catalogue.' }
  }
  return null
}

export const JarStockSchema = z.object({
  jarSizeId: z.string({ required_error: 'Choose the jar size.' }).min(1, 'Choose the jar size.'),
  count: num('Enter how many empty jars you have.').int('Enter whole jars.').min(0, 'You cannot own fewer than 0 jars.').max(10_000, 'More than 10,000 jars looks like a typing slip.'),
})
export type JarStockInput = z.infer<typeof JarStockSchema>

/** Dry goods on hand in the pantry: one ingredient's weight in grams (0 removes it). */
export const DryGoodsSchema = z.object({
  ingredientId: z.string({ required_error: 'Choose the bean.', invalid_type_error: 'Choose the bean.' }).min(1, 'Choose the bean.').max(120),
  grams: num('Enter how much you have.').min(0, 'You cannot have less than nothing; enter 0 to clear it.').max(1_000_000, 'More than 1,000 kg (2,200 lb) looks like a typing slip.'),
})
export type DryGoodsInput = z.infer<typeof DryGoodsSchema>
