/** The local mail fake's store. */
import { index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'

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
