/**
 * After the canning day: the rules of the Logbook, the seal check and the Shelf, as plain
 * functions (no Vue, Nuxt or database) shared by the routes, the pages and the unit tests.
 *
 * Published basis (see shared/reference/canning-reference.md §2): cool jars 12–24 h, then test
 * the seals (USDA CG "Testing jar seals", MSU-PFS 01600951); reprocess an unsealed jar within
 * 24 h with a new lid and the same process time, or refrigerate it and eat it within several
 * days (CG "Reprocessing unsealed jars", MSU-PFS 01600593); use within about a year (OSU EM 9435).
 */
export * from './process'
export * from './seal'
export * from './dates'
export * from './stock'
export * from './capacity'
