import { and, asc, eq, isNull, lte } from 'drizzle-orm'
import type { QueuedMailKind } from '~~/utils/vocabulary'
import type { Db, Database } from './database'
import { sendMail, type OutgoingMail } from './mail'
import { mailClaimMs, mailRetryMaxMs, serverSettings } from './settings'

/**
 * Outgoing mail that must not be lost when the mail server is down: it is written to
 * `mail_queue` first (in the caller's transaction when there is one), tried at once, and retried
 * with bounded exponential backoff (SHELFSTEAD_MAIL_RETRY_MS, doubling, at most an hour apart)
 * until the mail server takes it. Attempts and the last error are kept for the Outbox.
 */

/** The wait after `attempts` failed tries: first, 2 × first, 4 × first … at most an hour. */
export function retryDelayMs(attempts: number, firstMs = serverSettings().mailRetryMs): number {
  return Math.min(mailRetryMaxMs, firstMs * 2 ** Math.max(0, attempts - 1))
}

export interface QueuedMail extends OutgoingMail {
  kind: QueuedMailKind
  householdId?: string
  reminderId?: string
}

/** Keep a message to send; it is due at once. */
export async function queueMail(db: Db, mail: QueuedMail): Promise<string> {
  const [row] = await db.insert(tables.mailQueue).values({
    kind: mail.kind,
    householdId: mail.householdId,
    reminderId: mail.reminderId,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    nextAttemptAt: serverNow(),
  }).returning({ id: tables.mailQueue.id })
  return row!.id
}

export type Delivery = { sent: true, messageId: string } | { sent: false, error: string | null }

/**
 * Try one queued message if it is due and nobody else holds it. The claim moves its next attempt
 * past the send; a failure counts the attempt and sets the next one by the backoff.
 */
export async function deliverQueued(db: Database, id: string): Promise<Delivery> {
  const now = serverNow()
  const [claimed] = await db.update(tables.mailQueue)
    .set({ nextAttemptAt: new Date(now.getTime() + mailClaimMs), lastAttemptAt: now })
    .where(and(eq(tables.mailQueue.id, id), isNull(tables.mailQueue.sentAt), isNull(tables.mailQueue.cancelledAt), lte(tables.mailQueue.nextAttemptAt, now)))
    .returning()
  if (!claimed) return { sent: false, error: null }
  if (claimed.reminderId) {
    const [reminder] = await db.select({ cancelledAt: tables.reminders.cancelledAt }).from(tables.reminders).where(eq(tables.reminders.id, claimed.reminderId))
    if (!reminder || reminder.cancelledAt) {
      await db.update(tables.mailQueue).set({ cancelledAt: now }).where(eq(tables.mailQueue.id, id))
      return { sent: false, error: 'The seal check was recorded first.' }
    }
  }
  const attempts = claimed.attempts + 1
  try {
    const { messageId } = await sendMail({ to: claimed.to, subject: claimed.subject, text: claimed.text, html: claimed.html ?? undefined })
    await db.update(tables.mailQueue).set({ attempts, sentAt: serverNow(), messageId, lastError: null }).where(eq(tables.mailQueue.id, id))
    return { sent: true, messageId }
  }
  catch (error) {
    const message = (error as Error).message || String(error)
    const next = new Date(serverNow().getTime() + retryDelayMs(attempts))
    await db.update(tables.mailQueue).set({ attempts, lastError: message, nextAttemptAt: next }).where(eq(tables.mailQueue.id, id))
    console.error(`[shelfstead] Mail to ${claimed.to.join(', ')} not sent (attempt ${attempts}, next ${next.toISOString()}): ${message}`)
    return { sent: false, error: message }
  }
}

let delivering = false

/** Send every queued message that is due, oldest first. Returns how many went out. */
export async function deliverDueMail(db: Database): Promise<number> {
  if (delivering) return 0
  delivering = true
  try {
    const due = await db.select({ id: tables.mailQueue.id }).from(tables.mailQueue)
      .where(and(isNull(tables.mailQueue.sentAt), isNull(tables.mailQueue.cancelledAt), lte(tables.mailQueue.nextAttemptAt, serverNow())))
      .orderBy(asc(tables.mailQueue.createdAt)).limit(100)
    let sent = 0
    for (const { id } of due) {
      if ((await deliverQueued(db, id)).sent) sent++
    }
    return sent
  }
  finally {
    delivering = false
  }
}
