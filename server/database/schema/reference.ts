/**
 * Published reference data, shared by every household: jar sizes, ingredients, tested recipes with
 * their process tables, and the version row that brings corrections to an existing database.
 * Sources live in columns.
 */
import { doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uuid, type AnyPgColumn } from 'drizzle-orm/pg-core'
import type { RecipePrep } from '../../../utils/planning/types'
import { fillBases, gaugeTypes, ingredientForms, jarMouths, packStyles, recipeStatuses } from '../../../utils/vocabulary'
import { timestamps } from './columns'
import { users, households } from './people'

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
 * What changed in the published reference data of this database: one row per changed value, so
 * a saved plan computed before the change can say what changed when it is opened, and a shared
 * recipe shows its history. A row comes either from a reference version shipped with the code
 * (`version` set, `changedBy` null) or from a site admin's edit (`version` null, `changedBy`,
 * `reason` and the recipe's `source` citation at the time). `recipeId` is null for a change that
 * touches every recipe (a jar size, an ingredient).
 */
export const referenceChanges = pgTable('reference_changes', {
  id: uuid('id').primaryKey().defaultRandom(),
  version: integer('version'),
  recipeId: text('recipe_id'),
  what: text('what').notNull(),
  changedBy: uuid('changed_by').references(() => users.id, { onDelete: 'set null' }),
  reason: text('reason'),
  source: text('source'),
  appliedAt: timestamp('applied_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('reference_changes_applied_idx').on(t.appliedAt), index('reference_changes_recipe_idx').on(t.recipeId)])

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
  /** The preparation before filling (soak, cook), with its source; null: only filling. A house recipe's follows its pack. */
  prep: jsonb('prep').$type<RecipePrep>(),
  /** A house recipe's basis: the tested recipe whose process table it copies. */
  basedOnRecipeId: text('based_on_recipe_id').references((): AnyPgColumn => recipes.id),
  /** The canner's own words, appended to a house recipe's fixed untested caution. */
  cautionNote: text('caution_note'),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  /** A shared recipe a site admin took out of the library: kept for the plans that name it, never planned again. */
  retiredAt: timestamp('retired_at', { withTimezone: true }),
  retiredReason: text('retired_reason'),
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
