import { relations, sql } from 'drizzle-orm'
import {
  boolean,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core'
import { DEFAULT_COOL_DOWN } from '../../utils/planning/schedule'
import type { PlanRequestBody } from '../../utils/schemas/plan'
import {
  fillBases, gaugeTypes, imageTypes, ingredientForms, jarMouths, loadStatuses, packStyles, planStatuses, priceKinds,
  recipeStatuses, reminderKinds, roles, shelfSources, unitSystems, unsealedActions,
} from '../../utils/vocabulary'

const timestamps = {
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
}

// ---------------------------------------------------------------------------
// People and households

export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  isAdmin: boolean('is_admin').notNull().default(false),
  ...timestamps,
}, t => [uniqueIndex('users_email_unique').on(sql`lower(${t.email})`)])

export const households = pgTable('households', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  altitudeFt: integer('altitude_ft').notNull().default(0),
  unitSystem: text('unit_system', { enum: unitSystems }).notNull().default('us'),
  /** What the household pays for one store-bought can of cooked beans, in cents. */
  storeCanPriceCents: integer('store_can_price_cents').notNull().default(129),
  /** How many canning seasons a jar is expected to serve; jar cost is spread over them. */
  jarUses: integer('jar_uses').notNull().default(10),
  coolDownPintMinutes: integer('cool_down_pint_minutes').notNull().default(DEFAULT_COOL_DOWN.pint),
  coolDownQuartMinutes: integer('cool_down_quart_minutes').notNull().default(DEFAULT_COOL_DOWN.quart),
  bestByMonths: integer('best_by_months').notNull().default(12),
  /** IANA time zone the household's dates and times are read in ("America/Denver"). */
  timeZone: text('time_zone').notNull().default('UTC'),
  isDemo: boolean('is_demo').notNull().default(false),
  ...timestamps,
})

export const memberships = pgTable('memberships', {
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  role: text('role', { enum: roles }).notNull(),
  ...timestamps,
}, t => [
  primaryKey({ columns: [t.userId, t.householdId] }),
  index('memberships_household_idx').on(t.householdId),
])

// ---------------------------------------------------------------------------
// Published reference data (shared by every household). Sources live in columns.

/**
 * Which version of the published reference data (jar sizes, ingredients, tested recipes and
 * their tables) this database holds; a newer version shipped with the code is applied at start.
 */
export const referenceData = pgTable('reference_data', {
  name: text('name').primaryKey(),
  version: integer('version').notNull(),
  appliedAt: timestamp('applied_at', { withTimezone: true }).notNull().defaultNow(),
})

/**
 * What a reference version changed in this database: one row per changed value, so a saved plan
 * computed before the change can say what changed when it is opened. `recipeId` is null for a
 * change that touches every recipe (a jar size, an ingredient).
 */
export const referenceChanges = pgTable('reference_changes', {
  id: uuid('id').primaryKey().defaultRandom(),
  version: integer('version').notNull(),
  recipeId: text('recipe_id'),
  what: text('what').notNull(),
  appliedAt: timestamp('applied_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('reference_changes_applied_idx').on(t.appliedAt)])

export const jarSizes = pgTable('jar_sizes', {
  id: text('id').primaryKey(),
  /** Size family used by process tables: half-pint, pint, pint-and-a-half, quart, half-gallon. */
  sizeKey: text('size_key').notNull(),
  name: text('name').notNull(),
  capacityMl: doublePrecision('capacity_ml').notNull(),
  capacitySource: text('capacity_source').notNull(),
  outsideDiameterMm: doublePrecision('outside_diameter_mm').notNull(),
  heightMm: doublePrecision('height_mm').notNull(),
  /** Outside dimensions are not published by any agency: typical values, editable. */
  dimensionsNote: text('dimensions_note').notNull(),
  mouth: text('mouth', { enum: jarMouths }).notNull(),
  sortOrder: integer('sort_order').notNull().default(0),
})

export const ingredients = pgTable('ingredients', {
  id: text('id').primaryKey(),
  name: text('name').notNull(),
  /** 'dry' legumes are measured by the cup and swell; 'fresh' ones are bought by weight in the pod. */
  form: text('form', { enum: ingredientForms }).notNull().default('dry'),
  gramsPerCup: doublePrecision('grams_per_cup').notNull(),
  gramsPerCupSource: text('grams_per_cup_source').notNull(),
  /** Hydrated volume / dry volume. */
  expansionRatio: doublePrecision('expansion_ratio').notNull(),
  expansionSource: text('expansion_source').notNull(),
})

export const recipes = pgTable('recipes', {
  id: text('id').primaryKey(),
  /** Null for the shared library of tested recipes; set for a household's house recipe. */
  householdId: uuid('household_id').references(() => households.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  status: text('status', { enum: recipeStatuses }).notNull(),
  packStyle: text('pack_style', { enum: packStyles }).notNull(),
  ingredientId: text('ingredient_id').notNull().references(() => ingredients.id),
  headspaceMm: doublePrecision('headspace_mm').notNull(),
  /** Largest fraction of the jar the hydrated solids may take. */
  solidsFillFraction: doublePrecision('solids_fill_fraction').notNull(),
  /** 'published': per-jar dry amount from the recipe; 'cap': the dry-pack fill cap. */
  fillBasis: text('fill_basis', { enum: fillBases }).notNull(),
  summary: text('summary').notNull().default(''),
  steps: text('steps').notNull().default(''),
  source: text('source').notNull(),
  caution: text('caution'),
  /** A house recipe's basis: the tested recipe whose process table it copies. */
  basedOnRecipeId: text('based_on_recipe_id').references((): AnyPgColumn => recipes.id),
  /** The canner's own words, appended to a house recipe's fixed untested caution. */
  cautionNote: text('caution_note'),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [index('recipes_household_idx').on(t.householdId)])

/** Per jar size: the published dry amount, optional salt and process minutes. */
export const recipeJarSpecs = pgTable('recipe_jar_specs', {
  recipeId: text('recipe_id').notNull().references(() => recipes.id, { onDelete: 'cascade' }),
  sizeKey: text('size_key').notNull(),
  dryGrams: doublePrecision('dry_grams'),
  saltTsp: doublePrecision('salt_tsp'),
  processMinutes: integer('process_minutes'),
}, t => [primaryKey({ columns: [t.recipeId, t.sizeKey] })])

export const recipePressureBands = pgTable('recipe_pressure_bands', {
  recipeId: text('recipe_id').notNull().references(() => recipes.id, { onDelete: 'cascade' }),
  gaugeType: text('gauge_type', { enum: gaugeTypes }).notNull(),
  minFt: integer('min_ft').notNull(),
  maxFt: integer('max_ft').notNull(),
  psi: doublePrecision('psi').notNull(),
  source: text('source').notNull(),
}, t => [primaryKey({ columns: [t.recipeId, t.gaugeType, t.minFt] })])

// ---------------------------------------------------------------------------
// Household equipment and prices

export const canners = pgTable('canners', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  innerDiameterMm: doublePrecision('inner_diameter_mm').notNull(),
  usableHeightMm: doublePrecision('usable_height_mm').notNull(),
  rackThicknessMm: doublePrecision('rack_thickness_mm').notNull().default(6),
  gaugeType: text('gauge_type', { enum: gaugeTypes }).notNull(),
  maxLayers: integer('max_layers').notNull().default(1),
  waterDepthMm: doublePrecision('water_depth_mm').notNull().default(76),
  lastGaugeTestAt: date('last_gauge_test_at'),
  ...timestamps,
}, t => [index('canners_household_idx').on(t.householdId)])

export const priceItems = pgTable('price_items', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  kind: text('kind', { enum: priceKinds }).notNull(),
  label: text('label').notNull(),
  ingredientId: text('ingredient_id').references(() => ingredients.id),
  jarSizeId: text('jar_size_id').references(() => jarSizes.id),
  mouth: text('mouth', { enum: jarMouths }),
  /** Package contents: grams (dry goods, salt), millilitres (vinegar) or a count (lids, jars). */
  packageGrams: doublePrecision('package_grams'),
  packageMl: doublePrecision('package_ml'),
  packCount: integer('pack_count'),
  priceCents: integer('price_cents').notNull(),
  ...timestamps,
}, t => [index('price_items_household_idx').on(t.householdId)])

export const jarStock = pgTable('jar_stock', {
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  jarSizeId: text('jar_size_id').notNull().references(() => jarSizes.id),
  count: integer('count').notNull().default(0),
  ...timestamps,
}, t => [primaryKey({ columns: [t.householdId, t.jarSizeId] })])

// ---------------------------------------------------------------------------
// Relations

export const usersRelations = relations(users, ({ many }) => ({ memberships: many(memberships) }))
export const householdsRelations = relations(households, ({ many }) => ({
  memberships: many(memberships),
  canners: many(canners),
  priceItems: many(priceItems),
  jarStock: many(jarStock),
}))
export const membershipsRelations = relations(memberships, ({ one }) => ({
  user: one(users, { fields: [memberships.userId], references: [users.id] }),
  household: one(households, { fields: [memberships.householdId], references: [households.id] }),
}))
export const recipesRelations = relations(recipes, ({ one, many }) => ({
  ingredient: one(ingredients, { fields: [recipes.ingredientId], references: [ingredients.id] }),
  jarSpecs: many(recipeJarSpecs),
  pressureBands: many(recipePressureBands),
}))
export const recipeJarSpecsRelations = relations(recipeJarSpecs, ({ one }) => ({
  recipe: one(recipes, { fields: [recipeJarSpecs.recipeId], references: [recipes.id] }),
}))
export const recipePressureBandsRelations = relations(recipePressureBands, ({ one }) => ({
  recipe: one(recipes, { fields: [recipePressureBands.recipeId], references: [recipes.id] }),
}))
export const cannersRelations = relations(canners, ({ one }) => ({
  household: one(households, { fields: [canners.householdId], references: [households.id] }),
}))

export type User = typeof users.$inferSelect
export type Household = typeof households.$inferSelect
export type Membership = typeof memberships.$inferSelect
export type JarSizeRow = typeof jarSizes.$inferSelect
export type IngredientRow = typeof ingredients.$inferSelect
export type RecipeRow = typeof recipes.$inferSelect
export type CannerRow = typeof canners.$inferSelect
export type PriceItemRow = typeof priceItems.$inferSelect

// ---------------------------------------------------------------------------
// Plans

/** A saved batch plan: the request only; the result is recomputed from current data on read. */
export const plans = pgTable('plans', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  status: text('status', { enum: planStatuses }).notNull().default('planned'),
  request: jsonb('request').$type<PlanRequestBody>().notNull(),
  /** Jars and recipe names at save time, for lists; the plan itself is always recomputed. */
  summary: jsonb('summary').$type<{ jars: number, loads: number, recipes: string[] }>().notNull(),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [index('plans_household_idx').on(t.householdId, t.updatedAt)])

/** Market list check-offs, shared by every member of the household. */
export const marketChecks = pgTable('market_checks', {
  planId: uuid('plan_id').notNull().references(() => plans.id, { onDelete: 'cascade' }),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  itemKey: text('item_key').notNull(),
  checkedBy: uuid('checked_by').references(() => users.id, { onDelete: 'set null' }),
  checkedAt: timestamp('checked_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [primaryKey({ columns: [t.planId, t.itemKey] })])

export const plansRelations = relations(plans, ({ one, many }) => ({
  household: one(households, { fields: [plans.householdId], references: [households.id] }),
  checks: many(marketChecks),
}))

export type PlanRow = typeof plans.$inferSelect

// ---------------------------------------------------------------------------
// After the plan: the Logbook, seal checks, the Shelf, photos and mail

/** What a logged load fell short of: the pressure and minutes it needed, and what to do. */
export interface LoadShortfall {
  kind: 'under-processed' | 'no-published-process'
  message: string
}

/**
 * One canner load as it was run. A load marked for reprocessing at a seal check starts as
 * 'pending' (no times yet) with a deadline 24 h after the original load came out.
 */
export const canningLoads = pgTable('canning_loads', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  /** Household sequence, shown as the load code "L-007" on labels. */
  number: integer('number').notNull(),
  status: text('status', { enum: loadStatuses }).notNull().default('done'),
  planId: uuid('plan_id').references(() => plans.id, { onDelete: 'set null' }),
  planLoadIndex: integer('plan_load_index'),
  reprocessOfId: uuid('reprocess_of_id').references((): AnyPgColumn => canningLoads.id, { onDelete: 'set null' }),
  cannerId: uuid('canner_id').references(() => canners.id, { onDelete: 'set null' }),
  /** The canner's name and gauge when logged, so the log reads right after a canner is removed. */
  cannerName: text('canner_name').notNull(),
  gaugeType: text('gauge_type', { enum: gaugeTypes }).notNull(),
  altitudeFt: integer('altitude_ft').notNull(),
  pressurePsi: doublePrecision('pressure_psi'),
  processMinutes: integer('process_minutes'),
  /** What the published table (or the plan) asks for this load; null when nothing covers it. */
  requiredPsi: doublePrecision('required_psi'),
  requiredMinutes: integer('required_minutes'),
  requiredSource: text('required_source'),
  startedAt: timestamp('started_at', { withTimezone: true }),
  endedAt: timestamp('ended_at', { withTimezone: true }),
  /** A pending reprocessing load must start before this. */
  deadlineAt: timestamp('deadline_at', { withTimezone: true }),
  shortfall: jsonb('shortfall').$type<LoadShortfall | null>(),
  notes: text('notes').notNull().default(''),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [
  uniqueIndex('canning_loads_number_unique').on(t.householdId, t.number),
  index('canning_loads_household_started_idx').on(t.householdId, t.startedAt),
  index('canning_loads_plan_idx').on(t.planId),
])

/** A recipe in one jar size within a load; the seal check's counts are kept per line. */
export const loadLines = pgTable('load_lines', {
  id: uuid('id').primaryKey().defaultRandom(),
  loadId: uuid('load_id').notNull().references(() => canningLoads.id, { onDelete: 'cascade' }),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  lineIndex: integer('line_index').notNull(),
  recipeId: text('recipe_id').references(() => recipes.id, { onDelete: 'set null' }),
  /** The product name as logged (the recipe's name, or a bean variety chosen for it). */
  product: text('product').notNull(),
  jarSizeId: text('jar_size_id').notNull().references(() => jarSizes.id),
  jars: integer('jars').notNull(),
  sealed: integer('sealed'),
  unsealed: integer('unsealed'),
  unsealedAction: text('unsealed_action', { enum: unsealedActions }),
}, t => [
  index('load_lines_load_idx').on(t.loadId),
  index('load_lines_household_recipe_idx').on(t.householdId, t.recipeId),
])

export const sealChecks = pgTable('seal_checks', {
  id: uuid('id').primaryKey().defaultRandom(),
  loadId: uuid('load_id').notNull().references(() => canningLoads.id, { onDelete: 'cascade' }),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  checkedAt: timestamp('checked_at', { withTimezone: true }).notNull(),
  checkedBy: uuid('checked_by').references(() => users.id, { onDelete: 'set null' }),
  notes: text('notes').notNull().default(''),
  ...timestamps,
}, t => [
  uniqueIndex('seal_checks_load_unique').on(t.loadId),
  index('seal_checks_household_idx').on(t.householdId),
])

/** A lot of sealed jars on the Shelf: one load line's sealed jars, or a row of an imported inventory. */
export const shelfLots = pgTable('shelf_lots', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  loadId: uuid('load_id').references(() => canningLoads.id, { onDelete: 'set null' }),
  loadLineId: uuid('load_line_id').references(() => loadLines.id, { onDelete: 'set null' }),
  recipeId: text('recipe_id').references(() => recipes.id, { onDelete: 'set null' }),
  product: text('product').notNull(),
  jarSizeId: text('jar_size_id').notNull().references(() => jarSizes.id),
  loadCode: text('load_code').notNull().default(''),
  cannedOn: date('canned_on').notNull(),
  bestBy: date('best_by').notNull(),
  jarsIn: integer('jars_in').notNull(),
  jarsLeft: integer('jars_left').notNull(),
  source: text('source', { enum: shelfSources }).notNull(),
  /** When the jars reached the Shelf (for the stock-over-time chart). */
  shelvedAt: timestamp('shelved_at', { withTimezone: true }).notNull(),
  ...timestamps,
}, t => [index('shelf_lots_household_fifo_idx').on(t.householdId, t.cannedOn)])

/**
 * The Shelf's movement ledger: each take-off is a row; the rows of one take-off share a batch,
 * and undo marks the household's latest batch undone and puts its jars back.
 */
export const shelfMovements = pgTable('shelf_movements', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  batchId: uuid('batch_id').notNull(),
  lotId: uuid('lot_id').notNull().references(() => shelfLots.id, { onDelete: 'cascade' }),
  jars: integer('jars').notNull(),
  /** Empty jars returned to the household's jar stock by this take-off. */
  jarsReturned: integer('jars_returned').notNull().default(0),
  movedAt: timestamp('moved_at', { withTimezone: true }).notNull(),
  movedBy: uuid('moved_by').references(() => users.id, { onDelete: 'set null' }),
  undoneAt: timestamp('undone_at', { withTimezone: true }),
}, t => [
  index('shelf_movements_household_idx').on(t.householdId, t.movedAt),
  index('shelf_movements_batch_idx').on(t.batchId),
])

/** Unsealed jars sent to the refrigerator: eat within several days (USDA CG). */
export const fridgeItems = pgTable('fridge_items', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  loadId: uuid('load_id').notNull().references(() => canningLoads.id, { onDelete: 'cascade' }),
  loadLineId: uuid('load_line_id').notNull().references(() => loadLines.id, { onDelete: 'cascade' }),
  product: text('product').notNull(),
  jarSizeId: text('jar_size_id').notNull().references(() => jarSizes.id),
  jars: integer('jars').notNull(),
  refrigeratedAt: timestamp('refrigerated_at', { withTimezone: true }).notNull(),
  clearedAt: timestamp('cleared_at', { withTimezone: true }),
}, t => [index('fridge_items_household_idx').on(t.householdId)])

export const loadPhotos = pgTable('load_photos', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  loadId: uuid('load_id').notNull().references(() => canningLoads.id, { onDelete: 'cascade' }),
  storageKey: text('storage_key').notNull(),
  contentType: text('content_type', { enum: imageTypes }).notNull(),
  bytes: integer('bytes').notNull(),
  originalName: text('original_name').notNull().default(''),
  uploadedBy: uuid('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, t => [index('load_photos_load_idx').on(t.loadId)])

/**
 * Mail that falls due later (a seal-check reminder). The sender claims a row by setting
 * sent_at with a conditional update, so two ticks or a restart never send it twice.
 */
export const reminders = pgTable('reminders', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  kind: text('kind', { enum: reminderKinds }).notNull(),
  loadId: uuid('load_id').notNull().references(() => canningLoads.id, { onDelete: 'cascade' }),
  dueAt: timestamp('due_at', { withTimezone: true }).notNull(),
  sentAt: timestamp('sent_at', { withTimezone: true }),
  cancelledAt: timestamp('cancelled_at', { withTimezone: true }),
  recipients: jsonb('recipients').$type<string[]>(),
  attempts: integer('attempts').notNull().default(0),
  lastError: text('last_error'),
  ...timestamps,
}, t => [
  uniqueIndex('reminders_kind_load_unique').on(t.kind, t.loadId),
  index('reminders_due_idx').on(t.dueAt),
])

/** Messages received by the local fake SMTP server (development, demo and tests only). */
export const mailOutbox = pgTable('mail_outbox', {
  id: uuid('id').primaryKey().defaultRandom(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
  envelopeFrom: text('envelope_from').notNull().default(''),
  envelopeTo: jsonb('envelope_to').$type<string[]>().notNull(),
  subject: text('subject').notNull().default(''),
  text: text('text').notNull().default(''),
  html: text('html'),
  raw: text('raw').notNull(),
}, t => [index('mail_outbox_received_idx').on(t.receivedAt)])

export const canningLoadsRelations = relations(canningLoads, ({ one, many }) => ({
  household: one(households, { fields: [canningLoads.householdId], references: [households.id] }),
  lines: many(loadLines),
  photos: many(loadPhotos),
}))
export const loadLinesRelations = relations(loadLines, ({ one }) => ({
  load: one(canningLoads, { fields: [loadLines.loadId], references: [canningLoads.id] }),
}))
export const loadPhotosRelations = relations(loadPhotos, ({ one }) => ({
  load: one(canningLoads, { fields: [loadPhotos.loadId], references: [canningLoads.id] }),
}))

export type CanningLoadRow = typeof canningLoads.$inferSelect
export type LoadLineRow = typeof loadLines.$inferSelect
export type ShelfLotRow = typeof shelfLots.$inferSelect
export type ShelfMovementRow = typeof shelfMovements.$inferSelect
export type ReminderRow = typeof reminders.$inferSelect
