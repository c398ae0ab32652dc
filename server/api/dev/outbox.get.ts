import { desc } from 'drizzle-orm'

/**
 * Messages the local fake SMTP server received, newest first. Development, demo and tests only:
 * a 404 unless the fake is running (SHELFSTEAD_MAIL=fake or its default). Needs a signed-in user.
 */
export default defineEventHandler(async (event) => {
  if (!fakeMailRunning()) notFound('Not found.')
  await requireSession(event)
  const db = await useDB()
  return db.select({
    id: tables.mailOutbox.id,
    receivedAt: tables.mailOutbox.receivedAt,
    from: tables.mailOutbox.envelopeFrom,
    to: tables.mailOutbox.envelopeTo,
    subject: tables.mailOutbox.subject,
    text: tables.mailOutbox.text,
    html: tables.mailOutbox.html,
    raw: tables.mailOutbox.raw,
  }).from(tables.mailOutbox).orderBy(desc(tables.mailOutbox.receivedAt)).limit(200)
})
