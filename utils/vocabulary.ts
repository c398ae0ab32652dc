/**
 * Every enumerated value the product stores or sends, in one place: the database columns, the
 * request schemas, the planning model and the pages all take their lists and types from here.
 * Canning terms follow the trade's usage (dial gauge, weighted gauge, hot pack, raw pack).
 */

/** A member's role in a household, least to most. */
export const roles = ['helper', 'canner', 'owner'] as const
export type Role = (typeof roles)[number]
/** How roles compare: a route that needs `canner` also admits `owner`. */
export const roleRank: Record<Role, number> = { helper: 1, canner: 2, owner: 3 }

export const unitSystems = ['us', 'metric'] as const
export type UnitSystem = (typeof unitSystems)[number]

export const gaugeTypes = ['dial', 'weighted'] as const
export type GaugeType = (typeof gaugeTypes)[number]

export const jarMouths = ['regular', 'wide'] as const
export type JarMouth = (typeof jarMouths)[number]

/** Dry goods (beans, lentils) or fresh produce. */
export const ingredientForms = ['dry', 'fresh'] as const
export type IngredientForm = (typeof ingredientForms)[number]

/** A published, tested recipe, or a household's own untested (house) recipe. */
export const recipeStatuses = ['tested', 'house'] as const
export type RecipeStatus = (typeof recipeStatuses)[number]

/** Hydrating dried beans (CG Guide 4): soak 12–18 h, or the quick method (boil 2 min, stand 1 h). */
export const soakMethods = ['overnight', 'quick'] as const
export type SoakMethodName = (typeof soakMethods)[number]
/** What a recipe allows: either soak, the quick one only, or none (fresh beans, dry pack). */
export const recipeSoaks = ['either', 'quick', 'none'] as const

export const packStyles = ['hot', 'raw', 'dry'] as const
export type PackStyle = (typeof packStyles)[number]

/** 'published': the recipe gives the dry amount per jar; 'cap': the swell cap sets it. */
export const fillBases = ['cap', 'published'] as const
export type FillBasis = (typeof fillBases)[number]

export const priceKinds = ['ingredient', 'salt', 'lid', 'jar', 'vinegar'] as const
export type PriceKind = (typeof priceKinds)[number]

/** Currencies a household can keep its prices in (ISO 4217; each has 2 minor digits, so prices stay in cents). */
export const currencies = ['USD', 'CAD', 'EUR', 'GBP', 'AUD', 'NZD', 'CHF'] as const
export type Currency = (typeof currencies)[number]

/**
 * How the household measures the store can it compares with: 'net', the net weight printed on
 * the can (grams), or 'drained', the drained beans it holds (mL).
 */
export const storeCanBases = ['net', 'drained'] as const
export type StoreCanBasis = (typeof storeCanBases)[number]

/** A Market list item marked off: 'bought' (got it at the store) or 'at-home' (already had it: left out of the total). */
export const marketCheckStates = ['bought', 'at-home'] as const
export type MarketCheckState = (typeof marketCheckStates)[number]

export const planStatuses = ['planned', 'in-progress', 'done'] as const
export type PlanStatus = (typeof planStatuses)[number]
/** Plans still being worked through, shown on the Pantry board. */
export const openPlanStatuses = ['planned', 'in-progress'] as const satisfies readonly PlanStatus[]

/** 'pending': a reprocessing load waiting to be run. */
export const loadStatuses = ['done', 'pending'] as const
export type LoadStatus = (typeof loadStatuses)[number]

export const unsealedActions = ['refrigerate', 'reprocess'] as const
export type UnsealedAction = (typeof unsealedActions)[number]

export const sealCheckStatuses = ['cooling', 'due', 'overdue'] as const
export type SealCheckStatus = (typeof sealCheckStatuses)[number]

export const bestByStatuses = ['past', 'near', 'ok'] as const
export type BestByStatus = (typeof bestByStatuses)[number]

export const shelfSources = ['seal-check', 'import'] as const
/** A move off the Shelf: jars eaten ('taken'), or a correction of the count that is not use (a lot recorded wrong, or removed). */
export const shelfMoveKinds = ['taken', 'correction'] as const
export type ShelfMoveKind = (typeof shelfMoveKinds)[number]
/**
 * Why a lot's count is corrected: miscounted (the count was wrong, either way), recorded by
 * mistake (the jars were never filled), broken or lost, or thrown out with the jars kept (the
 * emptied jars go back to jar stock). None of them is use.
 */
export const shelfCorrectionCauses = ['miscounted', 'mistake', 'broken', 'discarded'] as const
export type ShelfCorrectionCause = (typeof shelfCorrectionCauses)[number]
/** Why an imported row added nothing: its lot is on the Shelf, or was eaten or removed since. */
export const shelfImportSkips = ['on-shelf', 'gone'] as const
export type ShelfImportSkip = (typeof shelfImportSkips)[number]
/** Label stock: US letter 30-up (1 × 2⅝ in), A4 24-up (70 × 37 mm), or plain paper to cut. */
export const labelLayouts = ['sheet-30', 'a4-24', 'plain'] as const
export type LabelLayout = (typeof labelLayouts)[number]
export const reminderKinds = ['seal-check'] as const

/** What a queued outgoing e-mail is (server/utils/mailQueue.ts): the mail that is retried until the mail server takes it. */
export const queuedMailKinds = ['market-list', 'seal-check'] as const
export type QueuedMailKind = (typeof queuedMailKinds)[number]

export const imageTypes = ['image/jpeg', 'image/png', 'image/webp'] as const
export type ImageType = (typeof imageTypes)[number]

/** What the household's activity record notes. */
export const activityKinds = [
  'settings', 'member', 'invitation', 'canner', 'price', 'jar-stock', 'dry-goods', 'recipe',
  'plan', 'market', 'load', 'seal-check', 'shelf', 'photo',
] as const
export type ActivityKind = (typeof activityKinds)[number]

/**
 * What can be pressed on the Canning day: a load's steps in their published order, a kitchen
 * task's start, pause, resume and done, and undo (the last action of a load or task).
 */
export const dayEventKinds = [
  'start-heat', 'start-vent', 'close-vent', 'pressure-reached', 'pressure-dropped', 'process-done', 'stop-early', 'at-zero', 'open', 'out',
  'task-start', 'task-pause', 'task-resume', 'task-done',
  'undo',
] as const
export type DayEventKind = (typeof dayEventKinds)[number]
