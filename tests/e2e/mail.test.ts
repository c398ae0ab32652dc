/**
 * E-mail through the local fake SMTP server: a seal-check reminder goes out once when the
 * check falls due — 12 h after the load comes out (USDA Complete Guide, "Cooling jars" and
 * "Testing jar seals": test seals after 12–24 h) — and never twice, even across restarts on the
 * same data directory; a plan's Market list goes to a chosen member.
 */
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { simpleParser } from 'mailparser'
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'

const H = 3_600_000
const EMAIL = 'ansel@example.org'
const PASSWORD = 'navy-beans-2026'
const dataDir = mkdtempSync(join(tmpdir(), 'shelfstead-mail-'))
const env = (offsetHours: number) => ({ SHELFSTEAD_TEST_CLOCK: '1', SHELFSTEAD_REMINDER_INTERVAL_MS: '250', SHELFSTEAD_NOW_OFFSET_MS: String(offsetHours * H) })
const running: RunningServer[] = []

async function start(offsetHours: number, extra: Record<string, string> = {}) {
  const server = await startServer({ dataDir, env: { ...env(offsetHours), ...extra } })
  running.push(server)
  const client = new ApiClient(server.url)
  return { server, client }
}

interface OutboxMessage { to: string[], subject: string, text: string, raw: string }
const remindersTo = (box: OutboxMessage[], email: string) => box.filter(m => m.to.includes(email) && m.subject.startsWith('Seal check due'))
const pause = (ms: number) => new Promise(r => setTimeout(r, ms))

async function waitFor<T>(probe: () => Promise<T | undefined>, ms = 15_000): Promise<T | undefined> {
  const until = Date.now() + ms
  while (Date.now() < until) {
    const found = await probe()
    if (found) return found
    await pause(200)
  }
  return undefined
}

afterAll(async () => {
  for (const s of running) await s.stop()
})

let householdId: string
let loadId: string

describe('seal-check reminders', () => {
  it('sends nothing while the jars cool, then exactly one reminder once the check is due, across restarts', async () => {
    const first = await start(0)
    const reg = await first.client.post('/api/auth/register', { email: EMAIL, password: PASSWORD, name: 'Ansel Drummond', householdName: 'Drummond root cellar' })
    expect(reg.status).toBe(201)
    householdId = reg.body.households[0].id
    // A new household has no altitude; at 600 ft a weighted gauge needs 10 psi (USDA CG Guide 4, Table 2).
    expect((await first.client.patch(`/api/households/${householdId}`, { altitudeFt: 600 })).status).toBe(200)
    const canner = await first.client.post(`/api/households/${householdId}/canners`, { name: 'Old weighted canner', innerDiameterMm: 310, usableHeightMm: 330, rackThicknessMm: 6, gaugeType: 'weighted', maxLayers: 2, waterDepthMm: 76 })
    const now = Date.now()
    const load = await first.client.post(`/api/households/${householdId}/loads`, {
      cannerId: canner.body.id,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9, product: 'Navy beans, hot pack' }],
      pressurePsi: 11, processMinutes: 75, startedAt: new Date(now - 2 * H).toISOString(), endedAt: new Date(now).toISOString(),
    })
    expect(load.status).toBe(201)
    loadId = load.body.id
    await pause(1200) // several reminder ticks
    const early = (await first.client.get('/api/dev/outbox')).body as OutboxMessage[]
    expect(remindersTo(early, EMAIL)).toHaveLength(0)
    await first.server.stop()

    // 13 h later: the check is due (12–24 h after unloading)
    const second = await start(13)
    await second.client.login(EMAIL, PASSWORD)
    const sent = await waitFor(async () => {
      const box = (await second.client.get('/api/dev/outbox')).body as OutboxMessage[]
      return remindersTo(box, EMAIL)[0]
    })
    expect(sent).toBeDefined()
    await pause(1200)
    expect(remindersTo((await second.client.get('/api/dev/outbox')).body, EMAIL)).toHaveLength(1)
    await second.server.stop()

    const third = await start(14)
    await third.client.login(EMAIL, PASSWORD)
    await pause(1500)
    const box = (await third.client.get('/api/dev/outbox')).body as OutboxMessage[]
    expect(remindersTo(box, EMAIL)).toHaveLength(1)

    const mail = await simpleParser(remindersTo(box, EMAIL)[0]!.raw)
    expect(mail.subject).toBe('Seal check due: load L-001 (9 jars)')
    const to = Array.isArray(mail.to) ? mail.to : [mail.to!]
    expect(to.flatMap(a => a.value.map(v => v.address))).toEqual([EMAIL])
    expect(mail.text).toContain('Load L-001 came out of Old weighted canner')
    expect(mail.text).toContain('9 × Navy beans, hot pack')
    expect(mail.text).toMatch(/12–24 hours after a load comes out/)
    expect(mail.text).toMatch(/reprocess within 24 hours .* new lid and the same process time, or refrigerate them and eat within several days/)
    expect(mail.text).toContain(`/logbook/${loadId}`)
    expect(mail.html).toContain('<strong>L-001</strong>')
  })

  it('sends no reminder for a load whose seal check was recorded before the sender looked', async () => {
    for (const s of running) await s.stop()
    // a sender that looks only at start-up, so the check is surely recorded before it looks again
    const quiet = await start(14, { SHELFSTEAD_REMINDER_INTERVAL_MS: '600000' })
    await quiet.client.login(EMAIL, PASSWORD)
    const canners = (await quiet.client.get(`/api/households/${householdId}/canners`)).body
    const clockNow = Date.parse((await quiet.client.get('/api/dev/clock')).body.now)
    const load = await quiet.client.post(`/api/households/${householdId}/loads`, {
      cannerId: canners[0].id, lines: [{ recipeId: 'usda-baked-beans', jarSizeId: 'pint-regular', jars: 4 }],
      pressurePsi: 15, processMinutes: 65, startedAt: new Date(clockNow - 15 * H).toISOString(), endedAt: new Date(clockNow - 13 * H).toISOString(),
    })
    expect(load.body.code).toBe('L-002')
    expect(load.body.sealCheck.status).toBe('due')
    const check = await quiet.client.post(`/api/households/${householdId}/seal-checks`, { loadId: load.body.id, lines: [{ loadLineId: load.body.lines[0].id, sealed: 4, unsealed: 0 }] })
    expect(check.status).toBe(201)
    await quiet.server.stop()

    const again = await start(15)
    await again.client.login(EMAIL, PASSWORD)
    await pause(1500)
    const box = (await again.client.get('/api/dev/outbox')).body as OutboxMessage[]
    expect(remindersTo(box, EMAIL).map(m => m.subject)).toEqual(['Seal check due: load L-001 (9 jars)'])
  })
})

describe('the Market list by e-mail', () => {
  it('sends a saved plan\'s Market list to the chosen member, with its items', async () => {
    const server = running.at(-1)!
    const client = new ApiClient(server.url)
    const me = await client.login(EMAIL, PASSWORD)
    const canners = (await client.get(`/api/households/${householdId}/canners`)).body
    const saved = await client.post(`/api/households/${householdId}/plans`, {
      name: 'Navy beans for winter',
      request: { cannerId: canners[0].id, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'navy-beans', jars: 18 }] },
    })
    expect(saved.status).toBe(201)
    const res = await client.post(`/api/households/${householdId}/plans/${saved.body.plan.id}/send-market-list`, { userId: me.user.id })
    expect(res.status).toBe(202)
    expect(res.body.sentTo).toBe(EMAIL)
    const message = await waitFor(async () => ((await client.get('/api/dev/outbox')).body as OutboxMessage[]).find(m => m.subject === 'Market list: Navy beans for winter'))
    expect(message).toBeDefined()
    const mail = await simpleParser(message!.raw)
    for (const item of saved.body.result.shopping as Array<{ item: string }>) expect(mail.text).toContain(item.item)
    expect(mail.text).toMatch(/18 jars in 1 loads?/)
    expect(mail.text).toMatch(/one new flat lid per jar/)

    const stranger = await client.post(`/api/households/${householdId}/plans/${saved.body.plan.id}/send-market-list`, { userId: '00000000-0000-4000-8000-000000000000' })
    expect(stranger.status).toBe(400)
    expectField(stranger, 'userId')
  })

  it('says what is still unchecked: items checked off or at home move to "Already checked off"', async () => {
    const server = running.at(-1)!
    const client = new ApiClient(server.url)
    const me = await client.login(EMAIL, PASSWORD)
    const canners = (await client.get(`/api/households/${householdId}/canners`)).body
    const saved = await client.post(`/api/households/${householdId}/plans`, {
      name: 'Black beans, half checked',
      request: { cannerId: canners[0].id, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'black-beans', jars: 18 }] },
    })
    const shopping = saved.body.result.shopping as Array<{ item: string, key: string, kind: string }>
    const salt = shopping.find(i => i.kind === 'salt')!
    const beans = shopping.find(i => i.kind === 'ingredient')!
    const market = `/api/households/${householdId}/plans/${saved.body.plan.id}/market`
    expect((await client.put(market, { itemKey: salt.key, checked: true, state: 'at-home' })).status).toBe(200)
    expect((await client.post(`/api/households/${householdId}/plans/${saved.body.plan.id}/send-market-list`, { userId: me.user.id })).status).toBe(202)
    const message = await waitFor(async () => ((await client.get('/api/dev/outbox')).body as OutboxMessage[]).find(m => m.subject === 'Market list: Black beans, half checked'))
    const mail = await simpleParser(message!.raw)
    expect(mail.text).toContain(`- ${beans.item}: need`)
    expect(mail.text).not.toContain(`- ${salt.item}: need`)
    expect(mail.text).toContain(`Already checked off: ${salt.item}.`)
  })
})

describe('development-only routes', () => {
  it('are 404 when the mail fake is off and the clock may not move', async () => {
    for (const s of running) await s.stop()
    const server = await startServer({ env: { SHELFSTEAD_MAIL: 'off', SHELFSTEAD_NOW_OFFSET_MS: String(48 * H) } })
    running.push(server)
    const client = new ApiClient(server.url)
    await client.login('owner@demo.shelfstead.test')
    expect((await client.get('/api/dev/outbox')).status).toBe(404)
    expect((await client.get('/api/dev/clock')).status).toBe(404)
    expect((await client.post('/api/dev/clock', { offsetMs: H })).status).toBe(404)
    expect(server.output()).toMatch(/SHELFSTEAD_NOW_OFFSET_MS is ignored/)
  })
})
