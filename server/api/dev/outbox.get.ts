import { desc, sql } from 'drizzle-orm'

/**
 * Messages the local fake SMTP server received, newest first. Development, demo and tests only:
 * a 404 unless the fake is running. A person sees only mail addressed to them (invitation and
 * reset links are in it); a site admin sees all of it.
 */
export default defineEventHandler(async (event) => {
  if (!fakeMailRunning()) notFound('Not found.')
  const { user } = await requireSession(event)
  const db = await useDB()
  const query = db.select({
    id: tables.mailOutbox.id,
    receivedAt: tables.mailOutbox.receivedAt,
    from: tables.mailOutbox.envelopeFrom,
    to: tables.mailOutbox.envelopeTo,
    subject: tables.mailOutbox.subject,
    text: tables.mailOutbox.text,
    html: tables.mailOutbox.html,
    raw: tables.mailOutbox.raw,
  }).from(tables.mailOutbox)
  const mine = user.isAdmin
    ? query
    : query.where(sql`exists (select 1 from jsonb_array_elements_text(${tables.mailOutbox.envelopeTo}) as rcpt where lower(rcpt) = ${user.email.toLowerCase()})`)
  return mine.orderBy(desc(tables.mailOutbox.receivedAt)).limit(200)
})
