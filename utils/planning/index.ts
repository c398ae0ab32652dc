/**
 * The planning computation: plain TypeScript, plain data in and out, shared by the server
 * routes, the pages and the unit tests. Start with `planBatch`.
 *
 * Nuxt auto-imports this file's exports into the app, so only deliberately named pieces are
 * exported here; internal helpers stay in their modules.
 */
export * from './types'
export { PlanningRefusal, type PlanWarning, type WarningLevel } from './errors'
export * from './units'
export { fillCapMl, gramsForMl, mlForGrams, perJarFill, type PerJarFill } from './fill'
export * from './scaling'
export * from './process'
export {
  PACKOMANIA_RATIOS,
  MAX_JARS_PER_LAYER,
  tableJarsPerLayer,
  drawnRatio,
  jarPositions,
  layoutLayer,
  layersFor,
  layoutTimings,
  type LayerLayout,
} from './packing'
export { type Point, type UnitPacking, type SearchOptions } from './packing-search'
export { buildLoads, spreadEvenly, type CannerFit, type Load, type LoadContent, type LoadLine } from './loads'
export {
  DEFAULT_STEP_MINUTES,
  KITCHEN_LANE,
  LOAD_STEPS,
  buildSchedule,
  coolDownMinutes,
  parseStart,
  type DayStart,
  type LoadStepName,
  type PrepStepName,
  type Schedule,
  type ScheduleLoad,
  type ScheduleRecipe,
  type ScheduleStep,
  type StepName,
} from './schedule'
export {
  buildShopping,
  cheapestCombination,
  marketItemKey,
  type Combination,
  type PackageOption,
  type ShoppingItem,
  type ShoppingKind,
  type ShoppingNeeds,
  type ShoppingPackage,
} from './shopping'
export { DRAINED_ML_PER_NET_GRAM, DEFAULT_STORE_CAN, costSummary, storeCanBeansMl, type CostInput, type CostSummary } from './cost'
export * from './results'
export { planBatch } from './plan'
