/** Outgoing mail waiting for the mail server, and the local mail fake's store. */
import { index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { queuedMailKinds } from '../../../utils/vocabulary'
import { households } from './people'
import { reminders } from './logbook'

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

/**
 * Outgoing mail, kept until the mail server takes it: attempts are counted and the next one is
 * due at `next_attempt_at` (bounded exponential backoff, server/utils/mailQueue.ts). A row is
 * claimed by moving `next_attempt_at` past the send, so a crash mid-send retries it later.
 */
export const mailQueue = pgTable('mail_queue', {
  id: uuid('id').primaryKey().defaultRandom(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  kind: text('kind', { enum: queuedMailKinds }).notNull(),
  householdId: uuid('household_id').references(() => households.id, { onDelete: 'cascade' }),
  /** The seal-check reminder this mail tells of: not sent once the check is recorded. */
  reminderId: uuid('reminder_id').references(() => reminders.id, { onDelete: 'cascade' }),
  to: jsonb('to').$type<string[]>().notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html'),
  attempts: integer('attempts').notNull().default(0),
  nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull(),
  lastAttemptAt: timestamp('last_attempt_at', { withTimezone: true }),
  lastError: text('last_error'),
  sentAt: timestamp('sent_at', { withTimezone: true }),
  cancelledAt: timestamp('cancelled_at', { withTimezone: true }),
  messageId: text('message_id'),
}, t => [index('mail_queue_due_idx').on(t.sentAt, t.nextAttemptAt)])
