/**
 * Crash safety: the server is killed with SIGKILL in the middle of a stream of writes, five
 * times, and restarted on the same data directory. Every write that was acknowledged (2xx) is
 * there afterwards, and no write is half there: a logged load has all its lines, the empty-jar
 * stock is down by exactly the jars of the loads that exist, load numbers have no gap, and each
 * load and price has its one activity row. PGlite only (DATABASE_URL is cleared): this is about
 * the data directory surviving a crash.
 */
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { ago, newHousehold } from '../support/household'

const dataDir = mkdtempSync(join(tmpdir(), 'shelfstead-crash-'))
const env = { DATABASE_URL: '', SHELFSTEAD_REMINDER_INTERVAL_MS: '600000' }
const who = { email: 'crash@example.org', password: 'crash-safety-1', name: 'Crash', householdName: 'Crash test' }
const JARS = 5000
/** Each load: two lines, 3 + 2 pints, so a half-written load shows as a line count or a stock count off. */
const LINE_JARS = [3, 2]
const ROUNDS = 5

let server: RunningServer | undefined
afterAll(async () => { await server?.stop() })

interface Ledger { loads: Set<string>, prices: Set<string>, sent: number }

async function signIn(s: RunningServer) {
  const client = new ApiClient(s.url)
  const me = await client.login(who.email, who.password)
  return { client, hid: me.households[0]!.id }
}

/** Write loads and prices from three workers until the server dies; note every acknowledged id. */
async function writeUntilKilled(s: RunningServer, client: ApiClient, api: (p: string) => string, cannerId: string, round: number, ledger: Ledger) {
  let stopped = false
  let killSent = false
  const worker = async (w: number) => {
    for (let i = 0; !stopped; i++) {
      ledger.sent++
      try {
        if (i % 3 === 2) {
          const res = await client.post(api('/prices'), { kind: 'salt', label: `Salt r${round} w${w} #${i}`, packageGrams: 737, priceCents: 199 })
          if (res.status === 201) ledger.prices.add(res.body.id)
          else expect(res.status, JSON.stringify(res.body)).toBe(201)
        }
        else {
          const res = await client.post(api('/loads'), {
            cannerId,
            lines: LINE_JARS.map((jars, n) => ({ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars, product: n ? 'Kidney beans' : 'Pinto beans' })),
            pressurePsi: 15, processMinutes: 75, startedAt: ago(4), endedAt: ago(3),
          })
          if (res.status === 201) ledger.loads.add(res.body.id)
          else expect(res.status, JSON.stringify(res.body)).toBe(201)
        }
      }
      catch (error) {
        // a broken connection is expected only once the kill is sent
        if (!killSent) throw error
        stopped = true
      }
    }
  }
  const killAfter = 800 + Math.floor(Math.random() * 2200)
  const killed = new Promise<void>(done => s.process.once('exit', () => {
    stopped = true
    done()
  }))
  setTimeout(() => {
    killSent = true
    s.process.kill('SIGKILL')
  }, killAfter)
  await Promise.all([worker(0), worker(1), worker(2), killed])
  expect(s.process.signalCode).toBe('SIGKILL')
}

async function allLoads(client: ApiClient, api: (p: string) => string) {
  const rows: Array<{ id: string, number: number, code: string, lines: Array<{ jars: number, jarsFromStock: number }> }> = []
  for (let page = 1; ; page++) {
    const res = await client.get(api(`/loads?pageSize=100&page=${page}&sort=code`))
    expect(res.status).toBe(200)
    rows.push(...res.body.rows)
    if (rows.length >= res.body.total) return rows
  }
}

async function allActivity(client: ApiClient, api: (p: string) => string) {
  const items: Array<{ summary: string }> = []
  for (let page = 1; ; page++) {
    const res = await client.get(api(`/activity?page=${page}`))
    expect(res.status).toBe(200)
    items.push(...res.body.items)
    if (page >= res.body.pages) return items
  }
}

/** Everything acknowledged is there, and everything there is whole. */
async function expectIntact(client: ApiClient, api: (p: string) => string, ledger: Ledger, baselineActivity: number) {
  const loads = await allLoads(client, api)
  const ids = new Set(loads.map(l => l.id))
  const lost = [...ledger.loads].filter(id => !ids.has(id))
  expect(lost, 'acknowledged loads missing after the crash').toEqual([])
  for (const load of loads) expect(load.lines.map(l => l.jars), `load ${load.code} is whole`).toEqual(LINE_JARS)
  expect(loads.map(l => l.number).sort((a, b) => a - b), 'load numbers without a gap').toEqual(loads.map((_, i) => i + 1))

  const stock = (await client.get(api('/jar-stock'))).body.find((r: { jarSizeId: string }) => r.jarSizeId === 'pint-regular').count
  const perLoad = LINE_JARS.reduce((a, b) => a + b, 0)
  expect(stock, 'empty jars down by exactly the jars of the loads that exist').toBe(JARS - perLoad * loads.length)

  const prices = (await client.get(api('/prices'))).body as Array<{ id: string }>
  const priceIds = new Set(prices.map(p => p.id))
  expect([...ledger.prices].filter(id => !priceIds.has(id)), 'acknowledged prices missing after the crash').toEqual([])

  const activity = await allActivity(client, api)
  const logged = activity.filter(a => a.summary.startsWith('Logged load ')).map(a => a.summary.slice('Logged load '.length)).sort()
  expect(logged, 'one activity row per load').toEqual(loads.map(l => l.code).sort())
  expect(activity.filter(a => a.summary === 'Added a salt price').length, 'one activity row per price').toBe(prices.length)
  expect(activity.length).toBe(baselineActivity + loads.length + prices.length)
  return { loads: loads.length, prices: prices.length }
}

describe('crash safety', () => {
  it('keeps every acknowledged write, and none half-written, over five SIGKILLs mid-stream', { timeout: 180_000 }, async () => {
    server = await startServer({ dataDir, env })
    const household = await newHousehold(server, who)
    expect((await household.owner.request('PUT', household.api('/jar-stock'), { jarSizeId: 'pint-regular', count: JARS })).status).toBe(200)
    const api = household.api
    const baselineActivity = (await allActivity(household.owner, api)).length
    const ledger: Ledger = { loads: new Set(), prices: new Set(), sent: 0 }

    for (let round = 1; round <= ROUNDS; round++) {
      const { client } = await signIn(server)
      const before = ledger.loads.size + ledger.prices.size
      await writeUntilKilled(server, client, api, household.cannerId, round, ledger)
      expect(ledger.loads.size + ledger.prices.size, `round ${round} acknowledged some writes before the kill`).toBeGreaterThan(before)
      // the killed server's lock is left behind; the restart takes it over
      server = await startServer({ dataDir, env })
      const again = await signIn(server)
      expect(again.hid).toBe(household.id)
      await expectIntact(again.client, api, ledger, baselineActivity)
    }
    const { client } = await signIn(server)
    const final = await expectIntact(client, api, ledger, baselineActivity)
    expect(ledger.loads.size + ledger.prices.size).toBeGreaterThan(50)
    expect(final.loads).toBeGreaterThanOrEqual(ledger.loads.size)
  })
})
