/** The Shelf: lots of sealed jars, every move on or off it, and unsealed jars sent to the refrigerator. */
import { date, index, integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { shelfMoveKinds, shelfSources } from '../../../utils/vocabulary'
import { timestamps } from './columns'
import { canningLoads, loadLines } from './logbook'
import { users, households } from './people'
import { jarSizes, recipes } from './reference'

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
 * and undo marks the household's latest take-off undone and puts its jars back. A correction is
 * a batch of its own and is never undone.
 */
export const shelfMovements = pgTable('shelf_movements', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  batchId: uuid('batch_id').notNull(),
  lotId: uuid('lot_id').notNull().references(() => shelfLots.id, { onDelete: 'cascade' }),
  /** Jars that left the lot; a correction that found more jars than recorded is negative. */
  jars: integer('jars').notNull(),
  /** 'taken': eaten (counts as use on the Pantry board); 'correction': the count was wrong or the lot removed. */
  kind: text('kind', { enum: shelfMoveKinds }).notNull().default('taken'),
  /** Why a correction was made, in the household's words. */
  reason: text('reason').notNull().default(''),
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

export type ShelfLotRow = typeof shelfLots.$inferSelect
export type ShelfMovementRow = typeof shelfMovements.$inferSelect
