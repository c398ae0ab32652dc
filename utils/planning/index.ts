/**
 * The planning computation: plain TypeScript, plain data in and out, shared by the server
 * routes, the pages and the unit tests.
 *
 * Nuxt auto-imports this file's exports into the app, so only deliberately named pieces are
 * exported here; internal helpers stay in their modules.
 */
export * from './types'
export { PlanningRefusal, type PlanWarning, type WarningLevel } from './errors'
export * from './units'
export { fillCapMl, gramsForMl, mlForGrams, volumeToHeadspaceMl, perJarFill, type PerJarFill } from './fill'
export * from './scaling'
export * from './process'
