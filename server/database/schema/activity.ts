/** The household's record of who did what, newest first on the Household page. */
import { index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { activityKinds } from '../../../utils/vocabulary'
import { households, users } from './people'

export const activity = pgTable('activity', {
  id: uuid('id').primaryKey().defaultRandom(),
  householdId: uuid('household_id').notNull().references(() => households.id, { onDelete: 'cascade' }),
  /** Null once the person's account is gone, or for what the server did by itself. */
  userId: uuid('user_id').references(() => users.id, { onDelete: 'set null' }),
  kind: text('kind', { enum: activityKinds }).notNull(),
  /** One line for a person: "Saved plan “Pintos for winter”". Names in it are shown as text. */
  summary: text('summary').notNull(),
  detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('activity_household_at_idx').on(t.householdId, t.at)])
