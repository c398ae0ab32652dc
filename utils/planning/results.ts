/**
 * Output shape of `planBatch`. Field names are an API contract with the server and the pages:
 * add fields freely, but do not rename or remove them.
 */
import type { CostSummary } from './cost'
import type { PlanWarning } from './errors'
import type { Load, LoadContent } from './loads'
import type { LayerLayout } from './packing'
import type { Schedule } from './schedule'
import type { ShoppingItem } from './shopping'
import type { KitchenMeasure } from './units'

export interface PerJarDisplay {
  /** e.g. "scant ½ cup (92 g)" or "118 mL (92 g)". */
  dry: string
  /** e.g. "½ tsp", "3 g (½ tsp)" or "no salt". */
  salt: string
  water: string
  headspace: string
  /** The swollen beans a hot pack fills: "1½ cups" or "355 mL". */
  cooked: string
  dryCups: KitchenMeasure
  saltSpoons: KitchenMeasure | null
}

export interface LineResult {
  lineIndex: number
  recipeId: string
  recipeName: string
  jarSizeId: string
  jarKey: string
  jars: number
  perJar: {
    dryGrams: number
    dryMl: number
    /** The beans once swollen (cooked, drained), mL. */
    hydratedMl: number
    saltTsp: number
    saltGrams: number
    /** Boiling water (or cooking liquid) to the headspace line. */
    waterMl: number
    display: PerJarDisplay
  }
  dryGramsTotal: number
  /**
   * Goods lines: grams the supplied goods leave after whole jars. Jar and consumption lines:
   * grams the packages bought leave over (on the last line buying that ingredient).
   */
  leftoverGrams: number
  /** The part of one more jar the supplied goods' leftover would fill (goods lines), else 0. */
  partJar: number
  /** Dry grams the household already has for this line, or null when they will be bought. */
  suppliedGrams: number | null
  capMl: number
  fillFractionOfCap: number
  fillBasis: 'cap' | 'published'
  packStyle: 'hot' | 'raw' | 'dry'
  headspaceMm: number
  saltTspTotal: number
  saltGramsTotal: number
  waterMlTotal: number
  processMinutes: number
  /** The jar key whose published time is used (a half-pint uses the pint's). */
  processTimeFrom: string
}

export interface LoadResult extends Omit<Load, 'contents'> {
  gaugeType: 'dial' | 'weighted'
  coolMinutes: number
  /** Each line's jars in the load, named by recipe and bean ("9 × Dried beans or peas, hot pack — Black beans"). */
  contents: Array<LoadContent & { label: string }>
}

export interface CannerLayout extends LayerLayout {
  cannerId: string
  jarSizeId: string
  /** Layers the canner's height allows for this jar. */
  layers: number
}

export interface PlanResult {
  lines: LineResult[]
  loads: LoadResult[]
  /** The layer drawing of the first load. */
  layout: CannerLayout
  /** One drawing per canner and jar size the loads use. */
  layouts: CannerLayout[]
  /** What is still to buy: for a saved plan in progress, what the loads not yet logged need. */
  shopping: ShoppingItem[]
  /** A saved plan's loads logged so far (by index) and what is left to can. */
  progress: { loggedLoads: number[], loadsLeft: number, jarsLeft: number }
  schedule: Schedule
  cost: CostSummary
  water: {
    /** Boiling water for all jars (a kettle total, no margin). */
    kettleMl: number
    kettleDisplay: string
    /** Water to put in each canner for each load: its depth over its floor. */
    canners: Array<{ cannerId: string, mlPerLoad: number, display: string }>
  }
  totals: { jars: number, loads: number, dryGrams: number, saltGrams: number }
  /** The altitude used for the pressure bands, in whole feet. */
  altitudeFt: number
  /** Cautions first, then information. */
  warnings: PlanWarning[]
}
