/**
 * State that several app servers on one PostgreSQL server must share, held in the database
 * rather than in one process's memory.
 */
import { bigint, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core'

/** rate-limiter-flexible's RateLimiterDrizzle store: points used per key until `expire`. */
export const rateLimits = pgTable('rate_limits', {
  key: text('key').primaryKey(),
  points: integer('points').notNull(),
  expire: timestamp('expire', { withTimezone: true }),
})

/** The test clock's offset (SHELFSTEAD_TEST_CLOCK=1 or development only): one row, read by every server. */
export const testClock = pgTable('test_clock', {
  name: text('name').primaryKey(),
  offsetMs: bigint('offset_ms', { mode: 'number' }).notNull(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
})
