import { timestamp } from 'drizzle-orm/pg-core'

/** created_at and updated_at, on every table a person edits. */
export const timestamps = {
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
}
