/**
 * The mail server and the photo store being down loses nothing. Mail is kept in the database's
 * queue, its attempts counted and retried with bounded exponential backoff (across a restart),
 * and delivered exactly once when the mail server answers again; a photo the store cannot take
 * is refused with a 503 naming the photo, and no row points at a missing file.
 */
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { simpleParser } from 'mailparser'
import { SMTPServer } from 'smtp-server'
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, freePort, startServer, type RunningServer } from '../support/server'
import { ago, cookieFor, newHousehold } from '../support/household'

const running: RunningServer[] = []
let smtp: SMTPServer | undefined
afterAll(async () => {
  await Promise.all(running.map(s => s.stop()))
  await new Promise<void>(done => (smtp ? smtp.close(() => done()) : done()))
})

const pause = (ms: number) => new Promise(r => setTimeout(r, ms))
async function waitFor<T>(probe: () => Promise<T | undefined | false>, ms = 30_000): Promise<T> {
  const until = Date.now() + ms
  while (Date.now() < until) {
    const found = await probe()
    if (found) return found
    await pause(200)
  }
  throw new Error('waited in vain')
}

interface Queued { id: string, subject: string, to: string[], attempts: number, lastAttemptAt: string | null, nextAttemptAt: string, lastError: string | null, sentAt: string | null, cancelledAt: string | null }
const FIRST_RETRY_MS = 400
/** The backoff the README promises: the first retry after SHELFSTEAD_MAIL_RETRY_MS, then doubling, at most an hour. */
const expectedDelay = (attempts: number) => Math.min(3_600_000, FIRST_RETRY_MS * 2 ** (attempts - 1))

describe('the mail server down', () => {
  it('keeps a Market list and a seal-check reminder queued with their attempts, across a restart, sends each once when it is back, and drops a reminder whose check was recorded meanwhile', async () => {
    const smtpPort = await freePort() // nothing listens here until the mail server "comes back"
    const dataDir = mkdtempSync(join(tmpdir(), 'shelfstead-mail-down-'))
    const env = { DATABASE_URL: '', SMTP_URL: `smtp://127.0.0.1:${smtpPort}`, SHELFSTEAD_MAIL_RETRY_MS: String(FIRST_RETRY_MS), SHELFSTEAD_REMINDER_INTERVAL_MS: '200' }
    let server = await startServer({ dataDir, env })
    running.push(server)
    const who = { email: 'ottilie@example.org', password: 'mail-down-2026', name: 'Ottilie', householdName: 'Ottilie pantry' }
    const H = await newHousehold(server, who)
    const me = (await H.owner.get('/api/auth/me')).body
    // a load out 20 h ago: its seal check is due, so its reminder is queued at the next tick
    const load = await H.owner.post(H.api('/loads'), {
      cannerId: H.cannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 4, product: 'Pinto beans' }],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(22), endedAt: ago(20),
    })
    expect(load.status).toBe(201)
    // a second load whose seal check is recorded while its reminder waits: that reminder never goes out
    const checkedLoad = await H.owner.post(H.api('/loads'), {
      cannerId: H.cannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 2, product: 'Navy beans' }],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(22), endedAt: ago(20),
    })
    expect(checkedLoad.status).toBe(201)
    const plan = await H.owner.post(H.api('/plans'), {
      name: 'Navy beans while the mail is down',
      request: { cannerId: H.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'navy-beans', jars: 9 }] },
    })
    expect(plan.status).toBe(201)
    const sent = await H.owner.post(H.api(`/plans/${plan.body.plan.id}/send-market-list`), { userId: me.user.id })
    expect(sent.status).toBe(202)
    expect(sent.body).toMatchObject({ sentTo: who.email, delivered: false })

    const queue = async () => (await H.owner.get('/api/dev/mail-queue')).body as Queued[]
    const market = (rows: Queued[]) => rows.find(r => r.subject === 'Market list: Navy beans while the mail is down')
    const reminder = (rows: Queued[]) => rows.find(r => r.subject.startsWith(`Seal check due: load ${load.body.code}`))
    const checkedReminder = (rows: Queued[]) => rows.find(r => r.subject.startsWith(`Seal check due: load ${checkedLoad.body.code}`))
    const failing = await waitFor(async () => {
      const rows = await queue()
      return Boolean((market(rows)?.attempts ?? 0) >= 3 && (reminder(rows)?.attempts ?? 0) >= 2 && checkedReminder(rows)) && rows
    })
    expect(checkedReminder(failing)?.sentAt).toBeNull()
    const check = await H.owner.post(H.api('/seal-checks'), { loadId: checkedLoad.body.id, lines: [{ loadLineId: checkedLoad.body.lines[0].id, sealed: 2, unsealed: 0 }] })
    expect(check.status, JSON.stringify(check.body)).toBe(201)
    for (const row of [market(failing)!, reminder(failing)!]) {
      expect(row.to).toEqual([who.email])
      expect(row.sentAt).toBeNull()
      expect(row.lastError).toMatch(/ECONNREFUSED/)
      const waited = Date.parse(row.nextAttemptAt) - Date.parse(row.lastAttemptAt!)
      expect(waited).toBeGreaterThanOrEqual(expectedDelay(row.attempts))
      expect(waited).toBeLessThan(expectedDelay(row.attempts) + 2_000)
    }

    // the Outbox page shows it too, on a server that sends real mail
    const page = await fetch(`${server.url}/dev/outbox`, { headers: { cookie: H.owner.cookieHeader } })
    expect(page.status).toBe(200)
    const html = await page.text()
    expect(html).toContain('Waiting for the mail server')
    expect(html).toContain('Market list: Navy beans while the mail is down')
    expect(html).toMatch(/[2-9]\d* attempts/)
    expect(html).toContain('Last error:')

    // a restart while the mail server is still down keeps the queue and its counts
    const before = market(await queue())!.attempts
    await server.stop()
    server = await startServer({ dataDir, env })
    running.push(server)
    const again = new ApiClient(server.url)
    await again.login(who.email, who.password)
    const afterRestart = (await again.get('/api/dev/mail-queue')).body as Queued[]
    expect(market(afterRestart)!.attempts).toBeGreaterThanOrEqual(before)
    expect(market(afterRestart)!.sentAt).toBeNull()
    expect(reminder(afterRestart)!.sentAt).toBeNull()

    // the mail server comes back
    const received: string[] = []
    smtp = new SMTPServer({
      disabledCommands: ['STARTTLS'], authOptional: true, logger: false,
      onData(stream, _session, callback) {
        simpleParser(stream).then((parsed) => {
          received.push(parsed.subject ?? '')
          callback()
        }, callback)
      },
    })
    await new Promise<void>(done => smtp!.listen(smtpPort, '127.0.0.1', done))
    const delivered = await waitFor(async () => {
      const rows = (await again.get('/api/dev/mail-queue')).body as Queued[]
      return Boolean(market(rows)?.sentAt && reminder(rows)?.sentAt) && rows
    })
    expect(market(delivered)!.lastError).toBeNull()
    const dropped = await waitFor(async () => checkedReminder((await again.get('/api/dev/mail-queue')).body as Queued[])?.cancelledAt)
    expect(dropped).toBeTruthy()
    await pause(2_000) // several more ticks: nothing goes out twice
    expect(received.filter(s => s === 'Market list: Navy beans while the mail is down')).toHaveLength(1)
    expect(received.filter(s => s.startsWith(`Seal check due: load ${load.body.code}`))).toHaveLength(1)
    expect(received.filter(s => s.startsWith(`Seal check due: load ${checkedLoad.body.code}`))).toEqual([])
  })
})

describe('the photo store down', () => {
  it('refuses the upload with a 503 naming the photo, and keeps no photo row', async () => {
    const s3Port = await freePort() // nothing listens: the store is down
    const server = await startServer({ env: { SHELFSTEAD_STORAGE: 's3', S3_ENDPOINT: `http://127.0.0.1:${s3Port}`, S3_BUCKET: 'photos', S3_ACCESS_KEY_ID: 'test', S3_SECRET_ACCESS_KEY: 'test-secret' } })
    running.push(server)
    const who = { email: 'bertil@example.org', password: 'store-down-2026', name: 'Bertil', householdName: 'Bertil pantry' }
    const H = await newHousehold(server, who)
    const load = await H.owner.post(H.api('/loads'), {
      cannerId: H.cannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 2, product: 'Pinto beans' }],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(6), endedAt: ago(5),
    })
    expect(load.status).toBe(201)
    const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64')
    const form = new FormData()
    form.append('photo', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'jars.png')
    const res = await fetch(server.url + H.api(`/loads/${load.body.id}/photos`), { method: 'POST', headers: { cookie: await cookieFor(server, who.email, who.password) }, body: form })
    const body = await res.json()
    expect(res.status).toBe(503)
    expectField({ body }, 'photo', /photo store did not answer/)
    expect((await H.owner.get(H.api(`/loads/${load.body.id}`))).body.photos).toEqual([])
  })
})
