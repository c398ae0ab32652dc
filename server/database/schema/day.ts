/**
 * The canning day of a saved plan, shared by the household's devices: the day as planned
 * (frozen when it starts) and every action taken on it, in order. The state of each load and
 * timer is worked out from the actions (utils/day/state.ts), so two devices never disagree.
 */
import { bigint, index, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import type { DaySnapshot } from '../../../utils/day/state'
import { dayEventKinds } from '../../../utils/vocabulary'
import { canningLoads } from './logbook'
import { households, users } from './people'
import { plans } from './plans'

export const canningDays = pgTable('canning_days', {
  planId: uuid('plan_id').primaryKey().references(() => plans.id, { onDelete: 'cascade' }),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  snapshot: jsonb('snapshot').$type<DaySnapshot>().notNull(),
  startedAt: timestamp('started_at', { withTimezone: true }).notNull(),
  startedBy: uuid('started_by').references(() => users.id, { onDelete: 'set null' }),
}, t => [index('canning_days_household_idx').on(t.householdId)])

export const dayEvents = pgTable('day_events', {
  id: uuid('id').primaryKey().defaultRandom(),
  planId: uuid('plan_id').notNull().references(() => canningDays.planId, { onDelete: 'cascade' }),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  /** Order of storing; the state is replayed in this order. */
  seq: bigint('seq', { mode: 'number' }).generatedAlwaysAsIdentity(),
  target: text('target').notNull(),
  kind: text('kind', { enum: dayEventKinds }).notNull(),
  at: timestamp('at', { withTimezone: true }).notNull(),
  /** For an undo: the event it takes back. */
  undoes: uuid('undoes'),
  /** The device's own id for the action, so an action sent twice (offline, then again) is stored once. */
  clientId: text('client_id').notNull(),
  byUser: uuid('by_user').references(() => users.id, { onDelete: 'set null' }),
  /** The Logbook entry an "out" wrote. */
  loadId: uuid('load_id').references(() => canningLoads.id, { onDelete: 'set null' }),
  recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  uniqueIndex('day_events_client_unique').on(t.planId, t.clientId),
  index('day_events_plan_seq_idx').on(t.planId, t.seq),
])
