import { and, eq, isNull, lte, sql } from 'drizzle-orm'
import { loadCode, sealWindow } from '~~/utils/after'
import { countOf } from '~~/utils/planning'
import { formatDateTimeLong } from '~~/utils/time'
import type { Database } from './database'
import { queueMail } from './mailQueue'

/** Who hears about a seal check: every member, helpers included (anyone may record it). */
async function recipientsOf(db: Database, householdId: string): Promise<string[]> {
  const rows = await db.select({ email: tables.users.email }).from(tables.memberships)
    .innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
    .where(eq(tables.memberships.householdId, householdId))
  return [...new Set(rows.map(r => r.email))]
}

async function sealReminderMessage(db: Database, loadId: string) {
  const [load] = await db.select().from(tables.canningLoads).where(eq(tables.canningLoads.id, loadId))
  if (!load?.endedAt) return null
  const lines = await db.select({ jars: tables.loadLines.jars, product: tables.loadLines.product, jarName: tables.jarSizes.name })
    .from(tables.loadLines).innerJoin(tables.jarSizes, eq(tables.jarSizes.id, tables.loadLines.jarSizeId))
    .where(eq(tables.loadLines.loadId, loadId)).orderBy(tables.loadLines.lineIndex)
  // Times in the mail are the household's own, with the zone's abbreviation ("7:30 PM MST").
  const zone = await householdTimeZone(db, load.householdId)
  const when = (d: Date) => formatDateTimeLong(d, zone)
  const window = sealWindow(load.endedAt, load.endedAt)
  const code = loadCode(load.number)
  const jars = lines.map(l => `${l.jars} × ${l.product} (${l.jarName})`)
  const link = `${publicUrl()}/logbook/${load.id}`
  const text = [
    `Load ${code} came out of ${load.cannerName} on ${when(load.endedAt)}:`,
    ...jars.map(j => `  - ${j}`),
    '',
    `Its seal check is due now. Test the seals 12–24 hours after a load comes out: between ${when(window.dueAt)} and ${when(window.byAt)}.`,
    'Remove the bands and press the middle of each lid; a lid that springs back has not sealed (USDA Complete Guide to Home Canning, "Testing jar seals").',
    '',
    `Unsealed jars: reprocess within 24 hours of unloading (by ${when(window.reprocessBy)}) with a new lid and the same process time, or refrigerate them and eat within several days.`,
    '',
    `Record the seal check: ${link}`,
  ].join('\n')
  const html = `<p>Load <strong>${escapeHtml(code)}</strong> came out of ${escapeHtml(load.cannerName)} on ${escapeHtml(when(load.endedAt))}:</p>`
    + `<ul>${jars.map(j => `<li>${escapeHtml(j)}</li>`).join('')}</ul>`
    + `<p>Its seal check is due now. Test the seals 12–24 hours after a load comes out: between ${escapeHtml(when(window.dueAt))} and ${escapeHtml(when(window.byAt))}. Remove the bands and press the middle of each lid; a lid that springs back has not sealed (USDA Complete Guide to Home Canning, “Testing jar seals”).</p>`
    + `<p>Unsealed jars: reprocess within 24 hours of unloading (by ${escapeHtml(when(window.reprocessBy))}) with a new lid and the same process time, or refrigerate them and eat within several days.</p>`
    + `<p><a href="${escapeHtml(link)}">Record the seal check</a></p>`
  return { subject: `Seal check due: load ${code} (${countOf(lines.reduce((s, l) => s + l.jars, 0), 'jar')})`, text, html, householdId: load.householdId }
}

let running = false

/**
 * Hand every reminder that is due to the mail queue (server/utils/mailQueue.ts), which sends
 * it and retries while the mail server is down. Each row is claimed with a conditional update
 * (sent_at set only where it is still null) in the same transaction as its queued message, so
 * two ticks, or a server restarted mid-way, never queue one twice.
 */
export async function sendDueReminders(db: Database): Promise<number> {
  if (running) return 0
  running = true
  try {
    const now = serverNow()
    const due = await db.select({ id: tables.reminders.id, loadId: tables.reminders.loadId })
      .from(tables.reminders)
      .where(and(isNull(tables.reminders.sentAt), isNull(tables.reminders.cancelledAt), lte(tables.reminders.dueAt, now)))
    let queued = 0
    for (const reminder of due) {
      const [checked] = await db.select({ id: tables.sealChecks.id }).from(tables.sealChecks).where(eq(tables.sealChecks.loadId, reminder.loadId))
      if (checked) {
        await db.update(tables.reminders).set({ cancelledAt: now }).where(eq(tables.reminders.id, reminder.id))
        continue
      }
      const message = await sealReminderMessage(db, reminder.loadId)
      const to = message ? await recipientsOf(db, message.householdId) : []
      await db.transaction(async (tx) => {
        const [claimed] = await tx.update(tables.reminders)
          .set({ sentAt: now, attempts: sql`${tables.reminders.attempts} + 1`, updatedAt: now, ...(message && to.length ? { recipients: to } : { cancelledAt: now, lastError: 'Nobody to tell.' }) })
          .where(and(eq(tables.reminders.id, reminder.id), isNull(tables.reminders.sentAt)))
          .returning()
        if (!claimed || !message || !to.length) return
        await queueMail(tx, { kind: 'seal-check', householdId: message.householdId, reminderId: reminder.id, to, subject: message.subject, text: message.text, html: message.html })
        queued++
      })
    }
    return queued
  }
  finally {
    running = false
  }
}
