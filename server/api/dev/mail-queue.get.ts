import { desc, sql } from 'drizzle-orm'

/**
 * The outgoing mail queue, newest first: each message's attempts, its last error and when it is
 * tried next, or when it went out. Shown on the Outbox page in every mail mode, since it tells
 * why mail has not arrived. A person sees only mail addressed to them; a site admin sees all.
 */
export default defineEventHandler(async (event) => {
  const { user } = await requireSession(event)
  const db = await useDB()
  const q = tables.mailQueue
  const query = db.select({
    id: q.id, kind: q.kind, to: q.to, subject: q.subject, createdAt: q.createdAt, attempts: q.attempts,
    nextAttemptAt: q.nextAttemptAt, lastAttemptAt: q.lastAttemptAt, lastError: q.lastError, sentAt: q.sentAt, cancelledAt: q.cancelledAt,
  }).from(q)
  const mine = user.isAdmin
    ? query
    : query.where(sql`exists (select 1 from jsonb_array_elements_text(${q.to}) as rcpt where lower(rcpt) = ${user.email.toLowerCase()})`)
  return mine.orderBy(desc(q.createdAt)).limit(200)
})
