/**
 * Backup and restore (README "Backup and restore"): an owner's household file restored into an
 * empty PGlite and an empty PostgreSQL site, compared table by table with the original; the
 * refusals and the one exact merge on a site that is not empty; the site-level backup of a
 * stopped PGlite data directory and a pg_dump round trip.
 */
import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { REFERENCE_VERSION } from '~~/server/database/seed/reference'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { startPostgres } from '../support/postgres'

const PASSWORD = 'put-up-2026'
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64')
const journal = JSON.parse(readFileSync('server/database/migrations/meta/_journal.json', 'utf8')) as { entries: Array<{ tag: string }> }
const houseRecipeRows = 'where recipe_id in (select id from recipes where household_id is not null)'
const tmp = (name: string) => mkdtempSync(join(tmpdir(), `shelfstead-backup-${name}-`))

type Backup = { format: string, formatVersion: number, migration: { tag: string, when: number }, referenceVersion: number, household: { id: string, name: string }, tables: Record<string, Array<Record<string, unknown>>>, photos: Array<{ storageKey: string, base64: string }> }

/** Run one of the project's commands with a database of its own (DATABASE_URL '' is PGlite in dataDir). */
function command(script: string, args: string[], env: { dataDir: string, databaseUrl: string }) {
  const run = spawnSync(process.execPath, [script, ...args], { env: { ...process.env, NUXT_DATA_DIR: env.dataDir, DATABASE_URL: env.databaseUrl }, encoding: 'utf8', timeout: 120_000 })
  return { status: run.status, out: `${run.stdout}${run.stderr}` }
}
const restoreHousehold = (file: string, env: { dataDir: string, databaseUrl: string }) => command('scripts/restore-household.mjs', [file], env)
const site = (mode: 'backup' | 'restore', file: string, env: { dataDir: string, databaseUrl: string }) => command('scripts/site-backup.mjs', [mode, file], env)

async function signIn(server: RunningServer, email: string, password = PASSWORD) {
  const client = new ApiClient(server.url)
  const me = await client.login(email, password)
  return { client, me }
}

async function download(server: RunningServer, email: string, householdId: string, password = PASSWORD): Promise<Backup> {
  const { client } = await signIn(server, email, password)
  expect((await client.post('/api/auth/household', { householdId })).status).toBe(200)
  const res = await client.get(`/api/households/${householdId}/backup`)
  expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200)
  return res.body as Backup
}

/** Every table, row by row, with the same ids: the restored household is the one backed up. */
function expectSameHousehold(restored: Backup, original: Backup) {
  expect(Object.keys(restored.tables).sort()).toEqual(Object.keys(original.tables).sort())
  for (const [table, rows] of Object.entries(original.tables)) {
    expect(restored.tables[table], `table ${table}`).toEqual(rows)
  }
  expect(restored.photos).toEqual(original.photos)
}

let source: RunningServer
let householdId: string
let original: Backup
let file: string
let jo: { email: string, password: string, id: string, ownHouseholdId: string }
let formerMemberId: string
let planId: string
/** The data directory (photos) of the PostgreSQL site the household is restored into. */
let pgDataDir: string
let postgres: Awaited<ReturnType<typeof startPostgres>>
const servers: RunningServer[] = []

/** A second person who joins by invitation, with a household of their own. */
async function joinAsHelper(owner: ApiClient, email: string, password: string) {
  const person = new ApiClient(source.url)
  const reg = await person.post('/api/auth/register', { email, password, name: email.split('@')[0], householdName: `${email.split('@')[0]}'s kitchen` })
  expect(reg.status, JSON.stringify(reg.body)).toBe(201)
  expect((await owner.post(`/api/households/${householdId}/invitations`, { email, role: 'helper' })).status).toBe(201)
  const box = (await person.get('/api/dev/outbox')).body as Array<{ to: string[], text: string }>
  const token = box.find(m => m.to.includes(email) && m.text.includes('/invite/'))!.text.match(/\/invite\/([A-Za-z0-9_-]+)/)![1]
  const accepted = await person.post(`/api/invitations/${token}/accept`, { mode: 'signed-in' })
  expect(accepted.status, JSON.stringify(accepted.body)).toBe(200)
  return { id: accepted.body.user.id as string, ownHouseholdId: reg.body.households[0].id as string }
}

beforeAll(async () => {
  source = await startServer({ env: { DATABASE_URL: '' } })
  const { client: owner, me } = await signIn(source, 'owner@demo.shelfstead.test')
  householdId = me.households[0]!.id
  const hh = (path: string) => `/api/households/${householdId}${path}`
  // What the demo season lacks: a photo, a house recipe, a plan with its Canning day started, members who came and went.
  const loads = (await owner.get(hh('/loads'))).body.rows as Array<{ id: string }>
  const form = new FormData()
  form.append('photo', new Blob([PNG], { type: 'image/png' }), 'jars.png')
  const photo = await fetch(source.url + hh(`/loads/${loads[0]!.id}/photos`), { method: 'POST', headers: { cookie: owner.cookieHeader, origin: source.url }, body: form })
  expect(photo.status).toBe(201)
  const recipe = await owner.post(hh('/recipes'), { name: 'Dry-packed pintos', basedOnRecipeId: 'usda-dried-beans-hot-pack', ingredientId: 'pinto-beans', packStyle: 'dry', headspaceMm: 25.4, solidsFillFraction: 0.75, steps: 'Measure no more than the fill cap, top with boiling water.', note: 'Ours.', jars: [{ sizeKey: 'pint', saltTsp: 0.25 }] })
  expect(recipe.status, JSON.stringify(recipe.body)).toBe(201)
  const canners = (await owner.get(hh('/canners'))).body as Array<{ id: string }>
  const plan = await owner.post(hh('/plans'), { name: 'Pintos for winter', request: { cannerId: canners[0]!.id, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 7 }] } })
  expect(plan.status, JSON.stringify(plan.body)).toBe(201)
  planId = plan.body.plan.id
  expect((await owner.post(hh(`/plans/${planId}/day`))).status).toBe(200)
  const heat = await owner.post(hh(`/plans/${planId}/day/events`), { clientId: crypto.randomUUID(), target: 'load:1', kind: 'start-heat' })
  expect(heat.status, JSON.stringify(heat.body)).toBeLessThan(300)
  jo = { email: 'jo@example.org', password: 'jo-long-password-2026', ...(await joinAsHelper(owner, 'jo@example.org', 'jo-long-password-2026')) }
  formerMemberId = (await joinAsHelper(owner, 'pat@example.org', 'pat-long-password-2026')).id
  expect((await owner.delete(hh(`/members/${formerMemberId}`))).status).toBeLessThan(300)

  original = await download(source, 'owner@demo.shelfstead.test', householdId)
  file = join(tmp('file'), 'household.json')
  writeFileSync(file, JSON.stringify(original))
  postgres = await startPostgres()
}, 240_000)

afterAll(async () => {
  for (const s of [source, ...servers]) await s?.stop()
  await postgres?.stop()
})

describe('the household backup file', () => {
  it('holds the format, the migration, the reference version and every household table', () => {
    expect(original.format).toBe('shelfstead-household-backup')
    expect(original.formatVersion).toBe(1)
    expect(original.migration.tag).toBe(journal.entries.at(-1)!.tag)
    expect(original.referenceVersion).toBe(REFERENCE_VERSION)
    for (const table of ['households', 'users', 'memberships', 'canners', 'price_items', 'jar_stock', 'plans', 'canning_days', 'day_events', 'canning_loads', 'load_lines', 'seal_checks', 'load_photos', 'shelf_lots', 'shelf_movements', 'fridge_items', 'recipes', 'recipe_jar_specs', 'activity', 'invitations']) {
      expect(original.tables[table]?.length, table).toBeGreaterThan(0)
    }
    expect(original.tables.recipes!.every(r => r.household_id === householdId)).toBe(true)
    expect(Buffer.from(original.photos[0]!.base64, 'base64')).toEqual(PNG)
  })

  it('carries the members with their password hashes, never a site admin\'s rights, and not a person who left', () => {
    const emails = original.tables.users!.map(u => u.email).sort()
    expect(emails).toEqual(['canner@demo.shelfstead.test', 'helper@demo.shelfstead.test', 'jo@example.org', 'owner@demo.shelfstead.test'])
    expect(original.tables.users!.every(u => typeof u.password_hash === 'string' && (u.password_hash as string).length > 20 && u.is_admin === false)).toBe(true)
    expect(original.tables.invitations!.some(i => i.accepted_by === formerMemberId)).toBe(false)
  })

  it('is an attachment for owners only', async () => {
    const { client: canner } = await signIn(source, 'canner@demo.shelfstead.test')
    expect((await canner.get(`/api/households/${householdId}/backup`)).status).toBe(403)
    const { client: owner } = await signIn(source, 'owner@demo.shelfstead.test')
    const res = await fetch(`${source.url}/api/households/${householdId}/backup`, { headers: { cookie: owner.cookieHeader } })
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="shelfstead-backup-[a-z0-9-]+-\d{4}-\d\d-\d\d\.json"$/)
  })
})

describe('restoring a household', () => {
  it('into an empty PGlite site gives the same household, table by table, and the members sign in as before', async () => {
    const dataDir = tmp('pglite')
    const run = restoreHousehold(file, { dataDir, databaseUrl: '' })
    expect(run.status, run.out).toBe(0)
    expect(run.out).toMatch(/Restored the household/)
    const server = await startServer({ dataDir, env: { DATABASE_URL: '', SHELFSTEAD_DEMO: '0' } })
    servers.push(server)
    expectSameHousehold(await download(server, 'owner@demo.shelfstead.test', householdId), original)
    expect((await signIn(server, jo.email, jo.password)).me.households.map(h => h.id)).toEqual([householdId])
    const { client } = await signIn(server, 'owner@demo.shelfstead.test')
    const photo = await fetch(`${server.url}/api/households/${householdId}/photos/${original.tables.load_photos![0]!.id}`, { headers: { cookie: client.cookieHeader } })
    expect(Buffer.from(await photo.arrayBuffer())).toEqual(PNG)
    // The server holds the directory now: the command refuses rather than write beside it.
    const locked = restoreHousehold(file, { dataDir, databaseUrl: '' })
    expect(locked.status).toBe(1)
    expect(locked.out).toMatch(/in use by another Shelfstead server \(pid \d+\)/)
    // The Canning day goes on where it stopped: a new action is stored after the restored ones.
    expect((await client.post('/api/auth/household', { householdId })).status).toBe(200)
    const next = await client.post(`/api/households/${householdId}/plans/${planId}/day/events`, { clientId: crypto.randomUUID(), target: 'load:1', kind: 'start-vent' })
    expect(next.status, JSON.stringify(next.body)).toBeLessThan(300)
    const events = (await download(server, 'owner@demo.shelfstead.test', householdId)).tables.day_events!
    const restoredSeq = Math.max(...original.tables.day_events!.map(e => Number(e.seq)))
    expect(events.find(e => e.kind === 'start-vent')!.seq as number).toBeGreaterThan(restoredSeq)
  })

  it('into an empty PostgreSQL database gives the same household, table by table', async () => {
    pgDataDir = tmp('pg')
    const dataDir = pgDataDir
    const run = restoreHousehold(file, { dataDir, databaseUrl: postgres.url })
    expect(run.status, run.out).toBe(0)
    // Counted in the database itself, not through the app: the shared recipe library is the site's own.
    const onlyHouse: Record<string, string> = { recipes: 'where household_id is not null', recipe_jar_specs: houseRecipeRows, recipe_pressure_bands: houseRecipeRows }
    const client = new pg.Client({ connectionString: postgres.url })
    await client.connect()
    try {
      for (const [table, rows] of Object.entries(original.tables)) {
        const { rows: [count] } = await client.query(`select count(*)::int as n from "${table}" ${onlyHouse[table] ?? ''}`)
        expect(count.n, table).toBe(rows.length)
      }
    }
    finally {
      await client.end()
    }
    const server = await startServer({ dataDir, env: { DATABASE_URL: postgres.url, SHELFSTEAD_DEMO: '0' } })
    servers.push(server)
    expectSameHousehold(await download(server, 'owner@demo.shelfstead.test', householdId), original)
    await server.stop()
  })

  it('into a site that has the household refuses, names it, and changes nothing', async () => {
    const client = new pg.Client({ connectionString: postgres.url })
    await client.connect()
    const count = async () => (await client.query('select (select count(*) from households)::int as h, (select count(*) from shelf_movements)::int as m')).rows[0]
    const before = await count()
    const run = restoreHousehold(file, { dataDir: tmp('again'), databaseUrl: postgres.url })
    const after = await count().finally(() => client.end())
    expect(run.status).toBe(1)
    expect(run.out).toContain(`This site already has the household “${original.household.name}”`)
    expect(run.out).toContain('nothing was changed')
    expect(after).toEqual(before)
  })

  it('refuses a file from a newer Shelfstead, naming the format or the migration', () => {
    const newer = join(tmp('newer'), 'newer.json')
    writeFileSync(newer, JSON.stringify({ ...original, formatVersion: 2 }))
    const format = restoreHousehold(newer, { dataDir: tmp('n1'), databaseUrl: postgres.url })
    expect(format.status).toBe(1)
    expect(format.out).toMatch(/format 2, made by a newer Shelfstead; this site reads format 1/)
    writeFileSync(newer, JSON.stringify({ ...original, migration: { tag: '0099_from-the-future', when: original.migration.when + 1 } }))
    const migration = restoreHousehold(newer, { dataDir: tmp('n2'), databaseUrl: postgres.url })
    expect(migration.status).toBe(1)
    expect(migration.out).toMatch(/migration 0099_from-the-future, newer than this site's/)
  })

  it('joins an account the site already has (the same person) and says so: Jo\'s own kitchen joins her restored account', async () => {
    const own = await download(source, jo.email, jo.ownHouseholdId, jo.password)
    const ownFile = join(tmp('jo'), 'jo.json')
    writeFileSync(ownFile, JSON.stringify(own))
    const run = restoreHousehold(ownFile, { dataDir: tmp('jo-pg'), databaseUrl: postgres.url })
    expect(run.status, run.out).toBe(0)
    expect(run.out).toContain('already here (the same people): kept as they were, with their passwords: jo@example.org')
    const client = new pg.Client({ connectionString: postgres.url })
    await client.connect()
    const { rows } = await client.query('select household_id from memberships where user_id = $1 order by household_id', [jo.id]).finally(() => client.end())
    expect(rows.map(r => r.household_id).sort()).toEqual([householdId, jo.ownHouseholdId].sort())
  })

  it('refuses when another account has a member\'s e-mail, naming it', async () => {
    const dataDir = tmp('clash')
    const server = await startServer({ dataDir, env: { DATABASE_URL: '', SHELFSTEAD_DEMO: '0' } })
    const someone = new ApiClient(server.url)
    expect((await someone.post('/api/auth/register', { email: 'Jo@Example.org', password: 'another-long-password', name: 'Another Jo', householdName: 'Elsewhere' })).status).toBe(201)
    await server.stop()
    const run = restoreHousehold(file, { dataDir, databaseUrl: '' })
    expect(run.status).toBe(1)
    expect(run.out).toContain('a different account with the e-mail jo@example.org')
  })
})

describe('the site backup', () => {
  it('of a PGlite data directory refuses while the server runs, and once stopped restores into a new directory that serves the same data', async () => {
    const archive = join(tmp('site'), 'site.tar.gz')
    const running = site('backup', archive, { dataDir: source.dataDir, databaseUrl: '' })
    expect(running.status).toBe(1)
    expect(running.out).toMatch(/in use by another Shelfstead server/)
    await source.stop()
    const made = site('backup', archive, { dataDir: source.dataDir, databaseUrl: '' })
    expect(made.status, made.out).toBe(0)
    const dataDir = tmp('site-restored')
    const restored = site('restore', archive, { dataDir, databaseUrl: '' })
    expect(restored.status, restored.out).toBe(0)
    expect(site('restore', archive, { dataDir, databaseUrl: '' }).out).toMatch(/already holds a database/)
    const server = await startServer({ dataDir, env: { DATABASE_URL: '', SHELFSTEAD_DEMO: '0' } })
    servers.push(server)
    expectSameHousehold(await download(server, 'owner@demo.shelfstead.test', householdId), original)
  })

  it('of PostgreSQL (pg_dump) restores into an empty database that serves the same data, and refuses a database that is not empty', async () => {
    const archive = join(tmp('pgsite'), 'site.tar.gz')
    const made = site('backup', archive, { dataDir: pgDataDir, databaseUrl: postgres.url })
    expect(made.status, made.out).toBe(0)
    const admin = new pg.Client({ connectionString: postgres.url })
    await admin.connect()
    await admin.query('create database restored')
    await admin.end()
    const restoredUrl = postgres.url.replace(/\/shelfstead$/, '/restored')
    const dataDir = tmp('pgsite-restored')
    const restored = site('restore', archive, { dataDir, databaseUrl: restoredUrl })
    expect(restored.status, restored.out).toBe(0)
    expect(site('restore', archive, { dataDir, databaseUrl: restoredUrl }).out).toMatch(/is not empty/)
    const server = await startServer({ dataDir, env: { DATABASE_URL: restoredUrl, SHELFSTEAD_DEMO: '0' } })
    servers.push(server)
    expectSameHousehold(await download(server, 'owner@demo.shelfstead.test', householdId), original)
  })
})
