import { mailMode, parseMessage, startFakeSmtp, stopFakeSmtp } from '../utils/mail'
import { useDB } from '../utils/database'
import { serverSettings } from '../utils/settings'
import { sendDueReminders } from '../utils/reminders'
import { deliverDueMail } from '../utils/mailQueue'
import { serverNow, syncClock } from '../utils/clock'

/**
 * Mail at start-up: the local fake SMTP server when mail is in `fake` mode (development, demo,
 * tests), and the mail tick, which every SHELFSTEAD_REMINDER_INTERVAL_MS (60 s by default) and
 * once as soon as the database is ready queues the seal-check reminders that are due and sends
 * the queued mail whose next attempt has come, so nothing waiting is lost to a restart or to a
 * mail server that was down.
 */
export default defineNitroPlugin((nitroApp) => {
  serverNow() // reads SHELFSTEAD_NOW_OFFSET_MS once, and says so when it is ignored
  const mode = mailMode()
  if (mode === 'fake') {
    startFakeSmtp(async ({ from, to, raw }) => {
      const db = await useDB()
      const parsed = await parseMessage(raw)
      await db.insert(tables.mailOutbox).values({ envelopeFrom: from, envelopeTo: to, raw, ...parsed })
    }).then(
      port => console.info(`[shelfstead] Mail goes to the local fake SMTP server on 127.0.0.1:${port}; read it at /dev/outbox.`),
      error => console.error('[shelfstead] The local mail fake could not start:', error),
    )
  }
  else if (mode === 'off') {
    console.info('[shelfstead] E-mail is off (no SMTP_URL or SMTP_HOST): reminders wait in the database until it is set up.')
  }

  const interval = serverSettings().reminderIntervalMs
  let timer: ReturnType<typeof setInterval> | undefined
  const tick = () => useDB()
    .then(async (db) => {
      await syncClock(db)
      await sendDueReminders(db)
      await deliverDueMail(db)
    })
    .catch(error => console.error('[shelfstead] Mail tick failed:', error))
  if (mode !== 'off') {
    useDB().then(() => {
      tick()
      timer = setInterval(tick, interval)
      timer.unref?.()
    }, () => {})
  }

  nitroApp.hooks.hook('close', async () => {
    if (timer) clearInterval(timer)
    await stopFakeSmtp()
  })
})
