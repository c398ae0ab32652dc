/** Saved batch plans and their Market list check-offs. */
import { index, jsonb, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import type { PlanRequestBody } from '../../../utils/schemas/plan'
import { marketCheckStates, planStatuses } from '../../../utils/vocabulary'
import { timestamps } from './columns'
import { users, households } from './people'

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
  state: text('state', { enum: marketCheckStates }).notNull().default('bought'),
  checkedBy: uuid('checked_by').references(() => users.id, { onDelete: 'set null' }),
  checkedAt: timestamp('checked_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [primaryKey({ columns: [t.planId, t.itemKey] })])
