/** After the canning day: the loads as run, their lines and seal checks, photos and seal-check reminders. */
import { doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid, type AnyPgColumn } from 'drizzle-orm/pg-core'
import { gaugeTypes, imageTypes, loadStatuses, reminderKinds, unsealedActions } from '../../../utils/vocabulary'
import { timestamps } from './columns'
import { canners } from './equipment'
import { users, households } from './people'
import { plans } from './plans'
import { jarSizes, recipes } from './reference'

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
  /** Recorded by the Canning day as it happened (null for a load logged by hand). */
  ventStartedAt: timestamp('vent_started_at', { withTimezone: true }),
  pressureReachedAt: timestamp('pressure_reached_at', { withTimezone: true }),
  processStartedAt: timestamp('process_started_at', { withTimezone: true }),
  processEndedAt: timestamp('process_ended_at', { withTimezone: true }),
  pressureDrops: jsonb('pressure_drops').$type<string[]>().notNull().default([]),
  /** A load the Canning day wrote waits for the canner to confirm it; one logged by hand is confirmed. */
  confirmedAt: timestamp('confirmed_at', { withTimezone: true }),
  confirmedBy: uuid('confirmed_by').references(() => users.id, { onDelete: 'set null' }),
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
  /** What filling these jars took out of the household's stock, so a correction or a delete gives back exactly that. */
  jarsFromStock: integer('jars_from_stock').notNull().default(0),
  dryGramsFromStock: doublePrecision('dry_grams_from_stock').notNull().default(0),
  /** The bean those dry grams were of (a recipe for any variety names its bean only in the plan). */
  dryGoodsIngredientId: text('dry_goods_ingredient_id'),
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

export type CanningLoadRow = typeof canningLoads.$inferSelect
export type LoadLineRow = typeof loadLines.$inferSelect
export type ReminderRow = typeof reminders.$inferSelect
