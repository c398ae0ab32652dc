/**
 * The database schema, one file per domain. drizzle-kit reads this folder (drizzle.config.ts) and
 * knows no Nuxt alias, so these files import utils/ by relative path.
 */
export * from './people'
export * from './reference'
export * from './equipment'
export * from './plans'
export * from './logbook'
export * from './shelf'
export * from './mail'
export * from './access'
export * from './activity'
export * from './day'
export * from './shared'
