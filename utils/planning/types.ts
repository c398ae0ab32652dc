/**
 * Input shapes of the planning computation. The server maps database rows into these; the
 * computation works in SI units (mL, g, mm, minutes) plus psi and feet, as the published tables
 * give them. Money is always integer cents.
 */

import type { FillBasis, GaugeType, JarMouth, PackStyle, RecipeStatus, UnitSystem } from '../vocabulary'

export type { GaugeType, JarMouth, UnitSystem }

export interface JarSize {
  id: string
  /** 'half-pint' | 'pint' | 'pint-and-a-half' | 'quart' | 'half-gallon' … */
  key: string
  name: string
  capacityMl: number
  outsideDiameterMm: number
  heightMm: number
  mouth: JarMouth
}

export interface Ingredient {
  id: string
  name: string
  /** Dry grams per level US cup (USDA SR Legacy portion weights). */
  gramsPerCup: number
  /** Hydrated volume ÷ dry volume. */
  expansionRatio: number
  source: string
}

export interface PerJarAmount {
  jarKey: string
  dryGrams?: number
  saltTsp?: number
}

export interface ProcessTime {
  jarKey: string
  minutes: number
}

/** Inclusive altitude band in whole feet. */
export interface PressureBand {
  gaugeType: GaugeType
  minFt: number
  maxFt: number
  psi: number
}

export interface Recipe {
  id: string
  name: string
  status: RecipeStatus
  packStyle: PackStyle
  ingredientId: string
  headspaceMm: number
  /** f: the largest fraction of the jar's capacity the hydrated solids may take. */
  solidsFillFraction: number
  /** 'cap': dry volume per jar is the cap f·V/E (or less); 'published': grams from `perJar`. */
  fillBasis: FillBasis
  perJar: PerJarAmount[]
  processMinutes: ProcessTime[]
  pressureBands: PressureBand[]
  source: string
  caution?: string
  /** Set when the recipe (or the tested recipe a house recipe borrows from) left the shared library: why, in a sentence. */
  retired?: string
  /** What is done before the jars are filled; none given: the jars are only filled. */
  prep?: RecipePrep | null
}

/** How dried goods are hydrated before a soaking recipe is cooked (CG Guide 4). */
export type SoakMethod = 'overnight' | 'quick'

/**
 * A recipe's preparation before filling: whether the dry goods soak ('either' overnight or the
 * quick method, 'quick' only, or 'none'), then one cooking step with its minutes (boil 30 min,
 * bake 4–5 h …), and where the values come from.
 */
export interface RecipePrep {
  soak: 'either' | 'quick' | 'none'
  cook: { label: string, minutes: number } | null
  source: string
}

export interface Canner {
  id: string
  name: string
  innerDiameterMm: number
  usableHeightMm: number
  rackThicknessMm: number
  gaugeType: GaugeType
  maxLayers: number
  waterDepthMm: number
  /** ISO date of the last dial-gauge accuracy test, or null if never tested. */
  lastGaugeTestAt: string | null
}

export interface IngredientPrice {
  kind: 'ingredient'
  ingredientId: string
  packageGrams: number
  priceCents: number
}

export interface SaltPrice {
  kind: 'salt'
  packageGrams: number
  priceCents: number
}

/** A lid pack for one jar size, or for every jar of one mouth size. */
export interface LidPrice {
  kind: 'lid'
  jarMouth?: JarMouth
  jarSizeId?: string
  packCount: number
  priceCents: number
}

export interface JarPrice {
  kind: 'jar'
  jarSizeId: string
  packCount: number
  priceCents: number
}

export interface VinegarPrice {
  kind: 'vinegar'
  packageMl: number
  priceCents: number
}

export type PriceItem = IngredientPrice | SaltPrice | LidPrice | JarPrice | VinegarPrice

export interface HouseholdSettings {
  /** Null until the household enters it; the planner then refuses to give a pressure. */
  altitudeFt: number | null
  unitSystem: UnitSystem
  /** Price of one store-bought can of the same product. */
  storeCanPriceCents: number
  /**
   * The store can compared with, by equal volume of beans: its net weight in grams ('net', as
   * printed on the can) or the drained beans it holds in mL ('drained'). Default: a 15-oz can, net.
   */
  storeCan?: { basis: 'net' | 'drained', amount: number }
  /** Expected uses of one jar, for amortising jars bought for this batch. */
  jarUses: number
  /** Natural cool-down to zero pressure; defaults 30 (pints and smaller) and 45 (larger). */
  coolDownMinutes?: { pint: number, quart: number }
  jarsOwned: Array<{ jarSizeId: string, count: number }>
  /** Dry goods in the pantry, by ingredient (grams): the market list buys only the rest. */
  dryGoodsOnHand?: Array<{ ingredientId: string, grams: number }>
  /** What the household eats, measured from its Shelf: jars a month by recipe, for the yearly saving. */
  jarsEatenPerMonth?: Array<{ recipeId: string, jarsPerMonth: number }>
  prices: PriceItem[]
}

/**
 * A saved plan part-way through its canning: the loads already logged, and what they took out
 * of the household's stock (so the plan's cost stays what it was before they were logged).
 * Market list items the household marked as already at home are named by their item key.
 */
export interface PlanProgress {
  loggedLoads: number[]
  jarsTaken?: Array<{ jarSizeId: string, count: number }>
  dryGramsTaken?: Array<{ ingredientId: string, grams: number }>
  atHome?: string[]
}

export type LineAmount
  = | { mode: 'jars', jars: number }
    | { mode: 'dryGrams', grams: number }
    | { mode: 'packages', packages: Array<{ grams: number, count: number }> }
    | { mode: 'consumption', jarsPerMonth: number, months: number, jarsOnShelf?: number }

export interface PlanLineRequest {
  recipeId: string
  jarSizeId: string
  amount: LineAmount
  /** Salt per jar in tsp; defaults to the recipe's amount for the jar; 0 for none. */
  saltTsp?: number
  /** A smaller dry fill per jar than the cap, for 'cap' recipes only. */
  dryMlPerJar?: number
}

export interface PlanRequest {
  lines: PlanLineRequest[]
  /** One canner, or two run side by side. */
  canners: Canner[]
  /** ISO date-time; its offset (Z, ±hh:mm or none for local wall-clock time) is kept. */
  startAt?: string
  /** Null when the household has not entered its altitude: refused (NO_ALTITUDE). */
  altitudeFt: number | null
  /** The household's date today (server clock, household time zone): the gauge-test check and the default start. */
  today: string
  /** How soaking recipes are hydrated; overnight unless said (a recipe that allows only the quick method uses it). */
  soak?: SoakMethod
  /** A saved plan in progress: its market list is what the loads not yet logged still need. */
  progress?: PlanProgress
}

export interface Catalogue {
  recipes: Recipe[]
  jarSizes: JarSize[]
  ingredients: Ingredient[]
}

/** Minutes of the fixed steps of one canner load (the process and the cool-down vary). */
export interface StepMinutes {
  heat: number
  vent: number
  pressurise: number
  waitAfterZero: number
  unload: number
}

export interface PlanOptions {
  /** Gap added to each jar's diameter when packing a layer, in mm (default 6). */
  clearanceMm?: number
  stepMinutes?: Partial<StepMinutes>
  /** Vinegar for wiping rims, per jar (default 5 mL). */
  vinegarMlPerJar?: number
}
