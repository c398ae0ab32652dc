/** People, households and who belongs to which. */
import { sql } from 'drizzle-orm'
import { boolean, doublePrecision, index, integer, pgTable, primaryKey, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { DEFAULT_BEST_BY_MONTHS } from '../../../utils/defaults'
import { DEFAULT_COOL_DOWN } from '../../../utils/planning/schedule'
import { currencies, roles, storeCanBases, unitSystems } from '../../../utils/vocabulary'
import { timestamps } from './columns'

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
  /** Null until someone enters it: the planner gives no pressure without it. */
  altitudeFt: integer('altitude_ft'),
  unitSystem: text('unit_system', { enum: unitSystems }).notNull().default('us'),
  /** What the household pays for one store-bought can of cooked beans, in cents. */
  storeCanPriceCents: integer('store_can_price_cents').notNull().default(129),
  /** The store can's size: net grams ('net') or drained mL ('drained'); a 15-oz can by default. */
  storeCanBasis: text('store_can_basis', { enum: storeCanBases }).notNull().default('net'),
  storeCanAmount: doublePrecision('store_can_amount').notNull().default(425.243),
  /** ISO 4217 currency the household's prices are in. */
  currency: text('currency', { enum: currencies }).notNull().default('USD'),
  /** How many canning seasons a jar is expected to serve; jar cost is spread over them. */
  jarUses: integer('jar_uses').notNull().default(10),
  coolDownPintMinutes: integer('cool_down_pint_minutes').notNull().default(DEFAULT_COOL_DOWN.pint),
  coolDownQuartMinutes: integer('cool_down_quart_minutes').notNull().default(DEFAULT_COOL_DOWN.quart),
  bestByMonths: integer('best_by_months').notNull().default(DEFAULT_BEST_BY_MONTHS),
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
