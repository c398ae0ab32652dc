/**
 * Past one machine: two app servers behind one address (a round-robin balancer), on one
 * PostgreSQL server and one S3-compatible store (s3rver, the local fake), behave as one.
 * Sessions sealed with one shared secret work on either; writes sent through both are all kept,
 * and none twice; the sign-in rate limit and the test clock are shared through the database;
 * a seal-check reminder goes out exactly once although both servers look for due reminders;
 * a photo stored through one is read through the other.
 *
 * Seal-check timing: USDA Complete Guide to Home Canning, "Testing jar seals" — test the seals
 * 12–24 hours after the jars come out, so a load that came out 13 hours ago is due now.
 */
import { randomBytes } from 'node:crypto'
import { mkdtempSync, readdirSync, statSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import S3rver from 's3rver'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { startPostgres } from '../support/postgres'
import { startBalancer } from '../support/balancer'
import { freePort } from '../support/ports'
import { queryDatabase } from '../support/databases'
import { ago, H, newHousehold, type TestHousehold } from '../support/household'

const BUCKET = 'shelfstead-photos'
// The smallest valid PNG (1 × 1 pixel), checked by its content on upload.
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64')

let postgres: Awaited<ReturnType<typeof startPostgres>>
let s3: S3rver
let s3Dir: string
let balancer: Awaited<ReturnType<typeof startBalancer>>
const servers: RunningServer[] = []
let household: TestHousehold

const pause = (ms: number) => new Promise(r => setTimeout(r, ms))

/** Every file under a folder, recursively (s3rver keeps each object as files on disk). */
function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    return statSync(path).isDirectory() ? filesUnder(path) : [path]
  })
}

beforeAll(async () => {
  postgres = await startPostgres()
  s3Dir = mkdtempSync(join(tmpdir(), 'shelfstead-s3-'))
  const s3Port = await freePort()
  s3 = new S3rver({ address: '127.0.0.1', port: s3Port, silent: true, directory: s3Dir, configureBuckets: [{ name: BUCKET, configs: [] }] })
  await s3.run()
  const env = {
    DATABASE_URL: postgres.url,
    NUXT_SESSION_PASSWORD: randomBytes(32).toString('hex'),
    SHELFSTEAD_STORAGE: 's3',
    S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
    S3_BUCKET: BUCKET,
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    SHELFSTEAD_TEST_CLOCK: '1',
    SHELFSTEAD_REMINDER_INTERVAL_MS: '200',
    SHELFSTEAD_ADMIN_EMAIL: 'keeper@example.org',
  }
  // Both at once on an empty database: migrations and seeding must run once, not race.
  servers.push(...await Promise.all([startServer({ env }), startServer({ env })]))
  balancer = await startBalancer(servers.map(s => s.url))
  household = await newHousehold({ ...servers[0]!, url: balancer.url }, { email: 'wren@example.org', password: 'adzuki-2026-spring', name: 'Wren Okafor', householdName: 'Okafor cellar' })
}, 180_000)

afterAll(async () => {
  await balancer?.stop()
  await Promise.all(servers.map(s => s.stop()))
  await new Promise<void>(done => (s3 ? s3.close(() => done()) : done()))
  await postgres?.stop()
})

describe('two app servers on one PostgreSQL server', () => {
  it('started at once, migrate and seed the database exactly once', async () => {
    const journal = await queryDatabase({ dataDir: '', databaseUrl: postgres.url }, 'select count(*)::int as n from drizzle.__drizzle_migrations')
    const files = readdirSync('server/database/migrations').filter(f => f.endsWith('.sql'))
    expect((journal[0] as { n: number }).n).toBe(files.length)
    // The demo seed ran once: one demo owner account, one demo household.
    const owners = await queryDatabase({ dataDir: '', databaseUrl: postgres.url }, `select count(*)::int as n from users where email = 'owner@demo.shelfstead.test'`)
    expect((owners[0] as { n: number }).n).toBe(1)
  })

  it('keep a session sealed on one working on the other, and a sign-out everywhere ends it on both', async () => {
    const client = new ApiClient(balancer.url)
    await client.login('canner@demo.shelfstead.test')
    const before = [...balancer.served]
    for (let i = 0; i < 6; i++) expect((await client.get('/api/auth/me')).status).toBe(200)
    // the six reads were shared between the two servers
    expect(balancer.served.map((n, i) => n - before[i]!)).toEqual([3, 3])
    expect((await client.post('/api/auth/logout-everywhere')).status).toBe(200)
    const stale = new ApiClient(servers[1]!.url)
    await stale.login('canner@demo.shelfstead.test')
    const other = new ApiClient(servers[0]!.url)
    await other.login('canner@demo.shelfstead.test')
    expect((await stale.post('/api/auth/logout-everywhere')).status).toBe(200)
    expect((await other.get('/api/auth/me')).status).toBe(401)
  })

  it('keep every one of sixty interleaved writes, and take jars off a lot exactly as often as they answer yes', async () => {
    const { owner, api } = household
    const writes = await Promise.all(Array.from({ length: 60 }, (_, i) =>
      owner.post(api('/prices'), { kind: 'lid', label: `Lids, box ${i + 1}`, packCount: 12, priceCents: 300 + i, mouth: 'regular' })))
    expect(writes.map(w => w.status)).toEqual(writes.map(() => 201))
    const prices = (await owner.get(api('/prices'))).body as Array<{ label: string }>
    const labels = prices.map(p => p.label).filter(l => l.startsWith('Lids, box '))
    expect(new Set(labels).size).toBe(60)
    expect(labels).toHaveLength(60)

    // A load of 9 pints goes onto the Shelf; twelve one-jar take-offs race through both servers.
    const load = await owner.post(api('/loads'), {
      cannerId: household.cannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9, product: 'Adzuki beans' }],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(30), endedAt: ago(28),
    })
    expect(load.status, JSON.stringify(load.body)).toBe(201)
    // the sealed jars go onto the Shelf at the seal check
    const check = await owner.post(api('/seal-checks'), { loadId: load.body.id, lines: [{ loadLineId: load.body.lines[0].id, sealed: 9, unsealed: 0 }] })
    expect(check.status, JSON.stringify(check.body)).toBe(201)
    const shelf = (await owner.get(api('/shelf'))).body as { lots: Array<{ id: string, product: string, jarsLeft: number }> }
    const lot = shelf.lots.find(l => l.product === 'Adzuki beans')!
    expect(lot.jarsLeft).toBe(9)
    const takes = await Promise.all(Array.from({ length: 12 }, () => owner.post(api('/shelf/take-off'), { items: [{ lotId: lot.id, jars: 1 }] })))
    const taken = takes.filter(t => t.status === 200).length
    // the rest are refused (400 none left, 409 taken meanwhile), never a server error
    expect(takes.every(t => t.status === 200 || t.status === 400 || t.status === 409), JSON.stringify(takes.map(t => t.status))).toBe(true)
    expect(taken).toBe(9)
    const after = (await owner.get(api('/shelf'))).body as { lots: Array<{ id: string, jarsLeft: number }> }
    // a lot with no jars left is off the list
    expect(after.lots.find(l => l.id === lot.id)).toBeUndefined()
  })

  it('share the sign-in rate limit: five wrong passwords through both servers, and the sixth is refused on either', async () => {
    const guesser = new ApiClient(balancer.url)
    for (let i = 0; i < 5; i++) {
      expect((await guesser.post('/api/auth/login', { email: 'owner@demo.shelfstead.test', password: `wrong-${i}-guess-here` })).status).toBe(401)
    }
    for (const server of servers) {
      const res = await new ApiClient(server.url).post('/api/auth/login', { email: 'owner@demo.shelfstead.test', password: 'another-wrong-guess' })
      expect(res.status).toBe(429)
    }
  })

  it('send a due seal-check reminder exactly once, and share a clock moved on one of them', async () => {
    const { owner, api } = household
    const due = await owner.post(api('/loads'), {
      cannerId: household.cannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 6, product: 'Black-eyed peas' }],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(15), endedAt: ago(13),
    })
    expect(due.status).toBe(201)
    const cooling = await owner.post(api('/loads'), {
      cannerId: household.cannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 5, product: 'Lima beans' }],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1),
    })
    expect(cooling.status).toBe(201)
    const reminders = async (code: string) => ((await owner.get('/api/dev/outbox')).body as Array<{ subject: string }>)
      .filter(m => m.subject.startsWith(`Seal check due: load ${code}`)).length
    // both servers look every 200 ms; after two seconds of racing, one message
    await pause(2_000)
    expect(await reminders(due.body.code)).toBe(1)
    expect(await reminders(cooling.body.code)).toBe(0)

    // Move the clock 12 hours on the first server; the second sees it and the cooling load falls due.
    expect((await new ApiClient(servers[0]!.url).post('/api/dev/clock', { offsetMs: 12 * H })).status).toBe(200)
    const seen = await new ApiClient(servers[1]!.url).get('/api/dev/clock')
    expect(seen.body.offsetMs).toBe(12 * H)
    await pause(2_000)
    expect(await reminders(cooling.body.code)).toBe(1)
    expect(await reminders(due.body.code)).toBe(1)
  })

  it('see a site admin\'s change to the shared library on the very next preview, whichever server made it', async () => {
    const { api } = household
    const admin = new ApiClient(servers[0]!.url)
    expect((await admin.post('/api/auth/register', { email: 'keeper@example.org', password: 'library-keeper-2026', name: 'Ines Keeper', householdName: 'Keeper pantry' })).status).toBe(201)
    // Each server has read the library (and keeps it in memory) before the change.
    const asOwner = async (server: RunningServer) => {
      const c = new ApiClient(server.url)
      await c.login(household.email, household.password)
      return c.request('POST', api('/plans/preview'), { cannerIds: [household.cannerId], lines: [{ recipeId: 'usda-baked-beans', jarSizeId: 'pint-regular', jars: 9 }] })
    }
    for (const server of servers) expect((await asOwner(server)).status).toBe(200)
    expect((await admin.post('/api/recipes/usda-baked-beans/retire', { reason: 'Checking that every server hears of it' })).status).toBe(200)
    const refused = await asOwner(servers[1]!)
    expect(refused.status).toBe(422)
    expect(refused.body.message).toMatch(/retired from the shared library/)
    const restorer = new ApiClient(servers[1]!.url)
    await restorer.login('keeper@example.org', 'library-keeper-2026')
    expect((await restorer.post('/api/recipes/usda-baked-beans/restore', { reason: 'Back in the library' })).status).toBe(200)
    expect((await asOwner(servers[0]!)).status).toBe(200)
  })

  it('store a photo in the S3 bucket through one server and serve the same bytes through the other', async () => {
    const { owner, api } = household
    const loads = (await owner.get(api('/loads'))).body as { rows: Array<{ id: string }> }
    const loadId = loads.rows[0]!.id
    const form = new FormData()
    form.append('photo', new Blob([PNG], { type: 'image/png' }), 'jars.png')
    const up = await fetch(servers[0]!.url + api(`/loads/${loadId}/photos`), { method: 'POST', headers: { cookie: owner.cookieHeader, origin: servers[0]!.url }, body: form })
    expect(up.status).toBe(201)
    const photo = await up.json() as { id: string }
    const down = await fetch(servers[1]!.url + api(`/photos/${photo.id}`), { headers: { cookie: owner.cookieHeader } })
    expect(down.status).toBe(200)
    expect(Buffer.from(await down.arrayBuffer()).equals(PNG)).toBe(true)
    // the bytes are in the bucket, not in either server's data directory
    const stored = filesUnder(join(s3Dir, BUCKET)).filter(f => statSync(f).size === PNG.length)
    expect(stored.length).toBeGreaterThanOrEqual(1)
    for (const server of servers) expect(() => readdirSync(join(server.dataDir, 'photos'))).toThrow()
  })
})
