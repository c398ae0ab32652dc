/**
 * Hostile input to every write route, read from the route files like the authorization matrix:
 * thousands of generated bodies, path params and queries (control characters, huge strings,
 * wrong types, deep nesting, year 0000 and 9999, huge and negative numbers, prototype keys).
 * Never a 5xx; every 4xx in the error envelope, a 400 naming its field; and the household's
 * stored data (its list routes) unchanged by a 4xx. Then the limits one by one: oversized and
 * lying bodies, uploads, NULs in the fields the issue names, implausible dates.
 */
import fc from 'fast-check'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { routesFromFiles } from '../support/routes'
import { ago } from '../support/household'
import { libraryRecipe } from '../support/recipes'
import { CHUNKED_END, chunkedBody, rawRequest, residentBytes } from '../support/raw-http'

const OWNER = 'owner@demo.shelfstead.test'
const ZOD_DEFAULT = /^(Required|Expected |Invalid|String must|Number must|Array must|Too small|Too big|Unrecognized key)/

let server: RunningServer
let owner: ApiClient
let H: string
const ids = {} as Record<string, string>
const port = () => Number(new URL(server.url).port)
const tally = { sent: 0, refused: 0, accepted: 0 }

const planRequest = () => ({ cannerId: ids.canner, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9 }] })
const houseRecipe = { name: 'Dry-packed pintos', basedOnRecipeId: 'usda-dried-beans-hot-pack', ingredientId: 'pinto-beans', packStyle: 'dry', headspaceMm: 25.4, solidsFillFraction: 0.75, steps: 'Measure no more than the fill cap.', note: 'Ours.', jars: [{ sizeKey: 'pint', saltTsp: 0.25 }] }
const cannerBody = { name: 'Another canner', innerDiameterMm: 300, usableHeightMm: 220, rackThicknessMm: 6, gaugeType: 'dial', maxLayers: 1, waterDepthMm: 76, lastGaugeTestAt: '2026-06-01' }
const csv = (row: string) => ({ csv: `product,recipe_id,jar_size,jars,canned_on,best_by,load_code\n${row}` })

/**
 * A plausible body for each route that reads one (hostile values replace its leaves), and who
 * sends: the signed-in owner (also the site admin here), or no one for the sign-in routes.
 * Routes not listed read no body: only their path params are made hostile.
 */
const bodies: Record<string, () => unknown> = {
  'POST /api/auth/login': () => ({ email: 'nobody@example.org', password: 'not the password' }),
  'POST /api/auth/register': () => ({ email: 'new@example.org', password: 'a-long-password', name: 'New', householdName: 'New kitchen' }),
  'POST /api/auth/household': () => ({ householdId: H }),
  'POST /api/auth/reset-request': () => ({ email: 'nobody@example.org' }),
  'POST /api/auth/reset': () => ({ token: 'x'.repeat(43), password: 'a-new-long-password' }),
  'POST /api/invitations/:token/accept': () => ({ mode: 'sign-in', password: 'whatever-it-is' }),
  'POST /api/dev/clock': () => ({ offsetMs: 0 }),
  'POST /api/recipes': () => libraryRecipe(),
  'PUT /api/recipes/:id': () => libraryRecipe({ reason: 'Summary shortened.' }),
  'POST /api/recipes/:id/retire': () => ({ reason: 'A duplicate entry.' }),
  'POST /api/recipes/:id/restore': () => ({ reason: 'Retired by mistake.' }),
  'PATCH /api/households/:id': () => ({ name: 'Quillfeather Hollow', altitudeFt: 2500, storeCanPriceCents: 119 }),
  'POST /api/households/:id/canners': () => cannerBody,
  'PATCH /api/households/:id/canners/:cannerId': () => cannerBody,
  'PUT /api/households/:id/jar-stock': () => ({ jarSizeId: 'quart-regular', count: 12 }),
  'PUT /api/households/:id/dry-goods': () => ({ ingredientId: 'pinto-beans', grams: 907 }),
  'PATCH /api/households/:id/members/:userId': () => ({ role: 'canner' }),
  'POST /api/households/:id/invitations': () => ({ email: 'invitee@example.org', role: 'helper' }),
  'POST /api/households/:id/loads': () => ({ cannerId: ids.canner, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 1, product: 'Pintos' }], pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1), notes: 'Calm run.' }),
  'PATCH /api/households/:id/loads/:loadId': () => ({ pressurePsi: 15, processMinutes: 75, startedAt: ago(22), endedAt: ago(20), notes: 'Corrected.' }),
  'POST /api/households/:id/loads/:loadId/decision': () => ({ action: 'refrigerate' }),
  'POST /api/households/:id/loads/:loadId/photos': () => ({ photo: 'not a file' }),
  'POST /api/households/:id/plans': () => ({ name: 'Another plan', request: planRequest() }),
  'POST /api/households/:id/plans/preview': () => planRequest(),
  'PATCH /api/households/:id/plans/:planId': () => ({ name: 'Renamed plan' }),
  'POST /api/households/:id/plans/:planId/day/events': () => ({ clientId: 'abcdefgh-1', target: 'load:1', kind: 'start-heat', at: ago(1) }),
  'PUT /api/households/:id/plans/:planId/market': () => ({ itemKey: 'salt', checked: true }),
  'POST /api/households/:id/plans/:planId/send-market-list': () => ({ userId: ids.ownerUser }),
  'POST /api/households/:id/prices': () => ({ kind: 'lid', label: 'Lids, 12', packCount: 12, priceCents: 399, mouth: 'regular' }),
  'PATCH /api/households/:id/prices/:priceId': () => ({ kind: 'salt', label: 'Canning salt', packageGrams: 737, priceCents: 219 }),
  'POST /api/households/:id/recipes': () => houseRecipe,
  'PATCH /api/households/:id/recipes/:recipeId': () => houseRecipe,
  'POST /api/households/:id/seal-checks': () => ({ loadId: ids.load, lines: [{ loadLineId: ids.loadLine, sealed: 1, unsealed: 0 }], notes: 'All sealed.' }),
  'POST /api/households/:id/shelf/import': () => csv('Navy beans,,pint-regular,2,2026-10-01,,'),
  'POST /api/households/:id/shelf/take-off': () => ({ items: [{ lotId: ids.lot, jars: 1 }] }),
  'POST /api/households/:id/shelf/undo': () => ({ batchId: ids.load }),
  'POST /api/households/:id/shelf/lots/:lotId/correction': () => ({ jarsLeft: 4, cause: 'broken' }),
}
const anonymous = new Set(['POST /api/auth/login', 'POST /api/auth/register', 'POST /api/auth/reset-request', 'POST /api/auth/reset', 'POST /api/invitations/:token/accept', 'POST /api/auth/logout', 'POST /api/auth/logout-everywhere'])
/** Read routes whose query is validated, and the keys they read. */
const queries: Record<string, string[]> = {
  'GET /api/households/:id/loads': ['page', 'pageSize', 'sort', 'recipeId', 'cannerId', 'from', 'to'],
  'GET /api/households/:id/loads/export.csv': ['from', 'to', 'sort'],
  'GET /api/households/:id/activity': ['page'],
  'GET /api/households/:id/shelf/labels': ['lots', 'layout', 'lotId'],
  'GET /api/recipes': ['householdId'],
  'GET /api/recipes/:id': ['householdId'],
  'POST /api/households/:id/plans/preview': ['planId'],
}
/** A real id for each path param, so validation, not a 404, is what a hostile value meets. */
const paramValue = (route: string, name: string) => name === 'id' && route.includes(' /api/recipes/') ? ids.libraryRecipe! : ({ id: H, token: 'x'.repeat(43) } as Record<string, string>)[name] ?? ids[name]!

// ---------------------------------------------------------------------------------------------
// What is sent

const specials = [
  '\u0000', 'Pinto\u0000beans', 'a\u0001\u0002\u001B[31mred', '\u007F', 'beans\u0085', '\u009B', '\u202Eevil', '\uD800', '',
  ' \t ', '__proto__', 'constructor', 'x'.repeat(70_000), '0000-01-01', '9999-12-31', '0000-01-01T00:00:00Z',
  '9999-12-31T23:59:59Z', '+275760-09-13T00:00:00Z', '2026-02-30', '\'; DROP TABLE loads; --', '%00', '=HYPERLINK("x")', 'NaN', '1e309',
]
const controlString = fc.array(fc.integer({ min: 0, max: 0x9F }), { minLength: 1, maxLength: 12 })
  .map(codes => `jar ${String.fromCharCode(...codes)}`)
const hostileString = fc.oneof(fc.constantFrom(...specials), controlString, fc.string({ maxLength: 40 }))
const hostileNumber = fc.constantFrom(-1, -0, 1.5, -1e308, 1e308, 2 ** 31, 2 ** 53 + 2, -(2 ** 63), 5e-324, 1e21)
const deep = (depth: number, leaf: unknown) => Array.from({ length: depth }).reduce<unknown>(inner => ({ a: [inner] }), leaf)
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: hostileString },
  { weight: 2, arbitrary: hostileNumber },
  { weight: 2, arbitrary: fc.constantFrom(null, true, false, [], {}, [null], [[[]]], { $gt: '' }, ['\u0000']) },
  { weight: 1, arbitrary: fc.integer({ min: 20, max: 400 }).map(n => deep(n, '\u0000')) },
)
const protoKeys = ['"__proto__":{"isAdmin":true,"role":"owner"}', '"constructor":{"prototype":{"isAdmin":true}}', '"__proto__":null', '"prototype":[1]']

/** Every path to a leaf of a plausible body: ["lines", 0, "jars"] … */
function leaves(value: unknown, path: Array<string | number> = []): Array<Array<string | number>> {
  if (Array.isArray(value)) return value.length ? value.flatMap((v, i) => leaves(v, [...path, i])) : [path]
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => leaves(v, [...path, k]))
  return [path]
}
function replaced(body: unknown, path: Array<string | number>, value: unknown): unknown {
  if (!path.length) return value
  const copy = (Array.isArray(body) ? [...body] : { ...(body as object) }) as Record<string | number, unknown>
  copy[path[0]!] = replaced(copy[path[0]!], path.slice(1), value)
  return copy
}

interface Hostile { path: string, body?: string, what: string }
const routePath = (route: string, params: Record<string, string> = {}) =>
  route.split(' ')[1]!.replace(/:(\w+)/g, (_, name: string) => params[name] ?? paramValue(route, name))
/** Short enough for a URL (Node refuses request heads over 16 KB with its own 431, before the app). */
const urlText = hostileString.filter(s => s.length < 2000)
/** Safe in a path segment: not empty and not "." or "..", which the URL would resolve away. */
const segment = urlText.filter(s => s.length > 0 && s.trim() !== '.' && s.trim() !== '..' && !/[\uD800-\uDFFF]/.test(s))

function hostileFor(route: string): fc.Arbitrary<Hostile> {
  const params = [...route.matchAll(/:(\w+)/g)].map(m => m[1]!)
  const base = bodies[route]
  const inParams: fc.Arbitrary<Hostile> | null = params.length
    ? fc.tuple(fc.constantFrom(...params), segment).map(([name, value]) => ({
        path: routePath(route, { [name]: encodeURIComponent(value) }),
        body: base ? JSON.stringify(base()) : undefined,
        what: `param ${name}=${JSON.stringify(value).slice(0, 60)}`,
      }))
    : null
  if (!base) return inParams ?? fc.constant({ path: routePath(route), what: 'no params' })
  const paths = leaves(base())
  const inBody = fc.oneof(
    { weight: 5, arbitrary: fc.tuple(fc.constantFrom(...paths), hostileValue).map(([at, value]) => ({ path: routePath(route), body: JSON.stringify(replaced(base(), at, value)), what: `${at.join('.')}=${JSON.stringify(value)?.slice(0, 60)}` })) },
    { weight: 2, arbitrary: hostileValue.map(value => ({ path: routePath(route), body: JSON.stringify(value) ?? 'null', what: `body=${JSON.stringify(value)?.slice(0, 60)}` })) },
    { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...protoKeys), fc.constantFrom(...paths), hostileValue).map(([key, at, value]) => ({ path: routePath(route), body: JSON.stringify(replaced(base(), at, value)).replace(/^\{/, `{${key},`), what: `${key} and ${at.join('.')}` })) },
    { weight: 1, arbitrary: fc.constantFrom('{"a":', '[[[[', '{"email":"x"}}', '\u0000', '{"a":1,"a":2}', '"just a string"', `[${'1,'.repeat(30_000)}1]`).map(text => ({ path: routePath(route), body: text, what: `raw ${text.slice(0, 20)}` })) },
  )
  return inParams ? fc.oneof({ weight: 4, arbitrary: inBody }, { weight: 1, arbitrary: inParams }) : inBody
}

function hostileQueryFor(route: string): fc.Arbitrary<Hostile> {
  const keys = queries[route]!
  return fc.array(fc.tuple(fc.constantFrom(...keys, '__proto__', 'constructor', 'x\u0000'), urlText), { minLength: 1, maxLength: 3 })
    .map((pairs) => {
      const query = new URLSearchParams(pairs)
      const base = route === 'POST /api/households/:id/plans/preview' ? JSON.stringify(planRequest()) : undefined
      return { path: `${routePath(route)}?${query}`, body: base, what: `query ${query.toString().slice(0, 80)}` }
    })
}

// ---------------------------------------------------------------------------------------------
// How it is judged

async function send(method: string, req: Hostile, client: ApiClient | null): Promise<{ status: number, body: any }> { // eslint-disable-line @typescript-eslint/no-explicit-any -- test JSON
  const res = await fetch(server.url + req.path, {
    method,
    headers: { ...(req.body !== undefined ? { 'content-type': 'application/json' } : {}), ...(client ? { cookie: client.cookieHeader } : {}) },
    body: req.body,
  })
  const text = await res.text()
  tally.sent++
  if (res.status >= 400) tally.refused++
  else tally.accepted++
  try { return { status: res.status, body: JSON.parse(text) } }
  catch { return { status: res.status, body: text } }
}

/** What a refusal must look like: the envelope, a message for a person, and a 400 names its field. */
function envelopeProblem(res: { status: number, body: any }): string | null { // eslint-disable-line @typescript-eslint/no-explicit-any -- test JSON
  if (res.status >= 500) return 'a server error'
  if (res.status < 400) return null
  const { message, data } = res.body ?? {}
  if (typeof message !== 'string' || message.length < 6) return 'no message'
  if (ZOD_DEFAULT.test(message)) return 'zod\'s own words'
  if (!data || !Array.isArray(data.issues)) return 'not in the error envelope'
  if (res.status === 400 && (typeof data.field !== 'string' || !data.field)) return 'a 400 that names no field'
  if (res.status === 400 && message.startsWith(`${data.field}:`)) return 'a field path in the message'
  return null
}

const snapshotRoutes = ['', '/canners', '/loads?pageSize=100', '/plans', '/prices', '/shelf', '/jar-stock', '/dry-goods', '/members', '/invitations', '/seal-checks', '/activity']
/** The household's stored data as its list routes show it, without the server's clock. */
async function snapshot(): Promise<string[]> {
  const out: string[] = []
  for (const path of snapshotRoutes) {
    const res = await owner.get(`/api/households/${H}${path}`)
    out.push(`${path} ${res.status} ${JSON.stringify(res.body, (key, value) => (key === 'now' ? undefined : value))}`)
  }
  return out
}

/** Send `runs` hostile requests to one route; every answer judged, the data compared across 4xx answers. */
async function attack(route: string, arbitrary: fc.Arbitrary<Hostile>, runs: number) {
  const [method] = route.split(' ')
  const client = anonymous.has(route) ? null : owner
  let before = await snapshot()
  let refusedSince = 0
  const wrong: string[] = []
  await fc.assert(fc.asyncProperty(arbitrary, async (req) => {
    const started = Date.now()
    const res = await send(method!, req, client)
    const problem = Date.now() - started > 5000 ? `an answer after ${Date.now() - started} ms` : envelopeProblem(res)
    if (problem && wrong.length < 10) wrong.push(`${route} ${req.what}: ${res.status} ${problem} ${JSON.stringify(res.body).slice(0, 200)}`)
    if (res.status < 400) {
      // A hostile value that happened to be valid: it may change data, so start comparing from here.
      before = await snapshot()
      refusedSince = 0
    }
    else refusedSince++
  }), { numRuns: runs })
  expect(wrong).toEqual([])
  if (refusedSince) expect(await snapshot(), `stored data changed after ${refusedSince} refusals of ${route}`).toEqual(before)
}

// ---------------------------------------------------------------------------------------------

const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64')
async function upload(bytes: Buffer, type: string, name = 'jars.png') {
  const form = new FormData()
  form.append('photo', new Blob([new Uint8Array(bytes)], { type }), name)
  const res = await fetch(`${server.url}/api/households/${H}/loads/${ids.load}/photos`, { method: 'POST', headers: { cookie: owner.cookieHeader }, body: form })
  return { status: res.status, body: await res.json() }
}

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_ADMIN_EMAIL: OWNER } })
  owner = new ApiClient(server.url)
  const me = await owner.login(OWNER)
  H = me.households[0]!.id
  ids.ownerUser = me.user.id
  ids.canner = (await owner.get(`/api/households/${H}/canners`)).body[0].id
  const loads = (await owner.get(`/api/households/${H}/loads`)).body.rows
  ids.load = loads[0].id
  ids.loadLine = (await owner.get(`/api/households/${H}/loads/${ids.load}`)).body.lines[0].id
  ids.price = (await owner.get(`/api/households/${H}/prices`)).body[0].id
  const shelf = (await owner.get(`/api/households/${H}/shelf`)).body
  ids.lot = shelf.lots[0].id
  ids.itemId = shelf.fridge[0]?.id ?? crypto.randomUUID()
  ids.lotId = ids.lot!
  ids.userId = (await owner.get(`/api/households/${H}/members`)).body.find((m: { role: string }) => m.role !== 'owner').userId
  const plan = await owner.post(`/api/households/${H}/plans`, { name: 'Plan under attack', request: planRequest() })
  expect(plan.status, JSON.stringify(plan.body)).toBe(201)
  ids.planId = plan.body.plan.id
  const recipe = await owner.post(`/api/households/${H}/recipes`, houseRecipe)
  expect(recipe.status, JSON.stringify(recipe.body)).toBe(201)
  ids.recipeId = recipe.body.id
  const invitation = await owner.post(`/api/households/${H}/invitations`, { email: 'kept-waiting@example.org', role: 'helper' })
  expect(invitation.status).toBe(201)
  ids.invitationId = invitation.body[0].id
  const photo = await upload(PNG, 'image/png')
  expect(photo.status).toBe(201)
  ids.photoId = photo.body.id
  const library = await owner.post('/api/recipes', libraryRecipe({ name: 'Black-eyed peas for the hostile run' }))
  expect(library.status, JSON.stringify(library.body)).toBe(201)
  Object.assign(ids, { cannerId: ids.canner, loadId: ids.load, priceId: ids.price, libraryRecipe: library.body.id })
})
afterAll(async () => {
  console.log(`hostile requests: ${tally.sent} sent, ${tally.refused} refused, ${tally.accepted} accepted`)
  await server?.stop()
})

describe('hostile input to every write route', () => {
  const writes = routesFromFiles().filter(r => !r.startsWith('GET '))

  it('finds the write routes, and a body for each route that reads one', () => {
    expect(writes.length).toBeGreaterThan(45)
    expect(Object.keys(bodies).filter(r => !writes.includes(r))).toEqual([])
    expect(Object.keys(queries).filter(r => !routesFromFiles().includes(r))).toEqual([])
  })

  it('can fail: a server error, a bare message and a 400 without a field are each caught', () => {
    expect(envelopeProblem({ status: 500, body: {} })).toBe('a server error')
    expect(envelopeProblem({ status: 400, body: { message: 'Check this value.', data: { issues: [] } } })).toBe('a 400 that names no field')
    expect(envelopeProblem({ status: 404, body: { message: 'Page not found: /api/x', data: { path: '/api/x' } } })).toBe('not in the error envelope')
    expect(envelopeProblem({ status: 400, body: { message: 'Give a date between the years 1970 and 2200.', data: { field: 'from', issues: [] } } })).toBeNull()
  })

  // Sign-in last: hostile sign-ins use up the per-client attempts.
  const order = [...writes.filter(r => r !== 'POST /api/auth/login'), 'POST /api/auth/login']
  it.each(order)('%s', async (route) => {
    await attack(route, hostileFor(route), bodies[route] ? 50 : 15)
  }, 120_000)

  it.each(Object.keys(queries))('%s with hostile queries', async (route) => {
    await attack(route, hostileQueryFor(route), 40)
  }, 120_000)
})

describe('limits on the body, before it is read', () => {
  it('refuses a 64 MB JSON sign-in with 413 unread, and the server does not grow', async () => {
    const rss = residentBytes(server.process.pid!)
    const declared = await rawRequest(port(), `POST /api/auth/login HTTP/1.1\r\nHost: x\r\nContent-Type: application/json\r\nContent-Length: ${64 * 1024 * 1024}`, chunkedBody(0))
    expect(declared.status).toBe(413)
    expect(declared.body.data.field).toBe('body')
    expect(declared.body.message).toMatch(/256 KB/)
    // The same body chunked: counted while it streams, refused at the limit.
    const chunked = await rawRequest(port(), 'POST /api/auth/login HTTP/1.1\r\nHost: x\r\nContent-Type: application/json\r\nTransfer-Encoding: chunked', chunkedBody(64 * 1024 * 1024, Buffer.alloc(64 * 1024, ' '), Buffer.from('{"email":"')), { end: CHUNKED_END })
    expect(chunked.status).toBe(413)
    expect(chunked.sent).toBeLessThan(32 * 1024 * 1024)
    expect(residentBytes(server.process.pid!) - rss).toBeLessThan(16 * 1024 * 1024)
  })

  it('cuts off a body that promises more than it sends, within bounded time', async () => {
    let sentOnce = false
    const res = await rawRequest(port(), `POST /api/auth/login HTTP/1.1\r\nHost: x\r\nContent-Type: application/json\r\nContent-Length: 1000`, () => {
      if (sentOnce) return null
      sentOnce = true
      return Buffer.from('{"email":"')
    }, { waitMs: 30_000 })
    expect(res.status).toBe(408)
    expect(res.ms).toBeLessThan(20_000)
    expect(res.body.message).toMatch(/stopped arriving/)
    // The server still answers.
    expect((await fetch(`${server.url}/api/health`)).status).toBe(200)
  }, 40_000)

  it('refuses a 20 MB chunked photo upload with 413 before it has arrived, without buffering it', async () => {
    const rss = residentBytes(server.process.pid!)
    const boundary = 'hostileboundary'
    const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="photo"; filename="big.jpg"\r\nContent-Type: image/jpeg\r\n\r\n\xFF\xD8\xFF`, 'latin1')
    const res = await rawRequest(port(), `POST /api/households/${H}/loads/${ids.load}/photos HTTP/1.1\r\nHost: x\r\nCookie: ${owner.cookieHeader}\r\nContent-Type: multipart/form-data; boundary=${boundary}\r\nTransfer-Encoding: chunked`,
      chunkedBody(20 * 1024 * 1024, Buffer.alloc(64 * 1024, 7), head), { end: CHUNKED_END })
    expect(res.status).toBe(413)
    expect(res.body.data.field).toBe('photo')
    expect(res.body.message).toMatch(/8 MB/)
    expect(res.sent).toBeLessThan(16 * 1024 * 1024)
    expect(residentBytes(server.process.pid!) - rss).toBeLessThan(32 * 1024 * 1024)
  })

  it('refuses a file that is not a picture though it says image/png, and keeps a real one', async () => {
    const before = (await owner.get(`/api/households/${H}/loads/${ids.load}`)).body.photos.length
    expect(before).toBeGreaterThan(0)
    for (const bytes of [Buffer.from('%PDF-1.7\n1 0 obj'), Buffer.from('GIF89a\x01\x00\x01\x00', 'latin1'), Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"/>'), Buffer.alloc(0)]) {
      const res = await upload(bytes, 'image/png')
      expect(res.status, JSON.stringify(res.body)).toBe(400)
      expect(res.body.data.field).toBe('photo')
    }
    expect((await owner.get(`/api/households/${H}/loads/${ids.load}`)).body.photos).toHaveLength(before)
    expect((await upload(PNG, 'application/octet-stream', 'jars')).status).toBe(201)
  })
})

describe('text and dates the database could not hold', () => {
  it('refuses a NUL in a register name, household name, canner name, recipe summary and CSV cell, naming the field', async () => {
    const stranger = new ApiClient(server.url)
    const cases: Array<[() => Promise<{ status: number, body: any }>, string]> = [ // eslint-disable-line @typescript-eslint/no-explicit-any -- test JSON
      [() => stranger.post('/api/auth/register', { email: 'nul@example.org', password: 'a-long-password', name: 'Nu\u0000l', householdName: 'Kitchen' }), 'name'],
      [() => stranger.post('/api/auth/register', { email: 'nul@example.org', password: 'a-long-password', name: 'Nul', householdName: 'Kit\u0000chen' }), 'householdName'],
      [() => owner.patch(`/api/households/${H}/canners/${ids.canner}`, { ...cannerBody, name: 'Big\u0000canner' }), 'name'],
      [() => owner.post(`/api/households/${H}/recipes`, { ...houseRecipe, summary: 'Beans\u0000' }), 'summary'],
      [() => owner.post(`/api/households/${H}/shelf/import`, csv('Navy\u0000beans,,pint-regular,2,2026-10-01,,')), 'product'],
      [() => owner.patch(`/api/households/${H}`, { name: 'Hollow\u0085' }), 'name'],
    ]
    const before = await snapshot()
    for (const [call, field] of cases) {
      const res = await call()
      expect(res.status, JSON.stringify(res.body)).toBe(400)
      expect(res.body.data.field).toBe(field)
      expect(res.body.message).toMatch(/control character/)
    }
    expect(await snapshot()).toEqual(before)
    // No account was made by the refused sign-ups: the address is still free.
    expect((await stranger.post('/api/auth/register', { email: 'nul@example.org', password: 'a-long-password', name: 'Nul', householdName: 'Kitchen' })).status).toBe(201)
  })

  it('keeps tabs and line breaks in multi-line notes', async () => {
    const res = await owner.patch(`/api/households/${H}/loads/${ids.load}`, { notes: 'Vented 10 min.\n\tRack in.\r\nAll sealed.' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect((await owner.get(`/api/households/${H}/loads/${ids.load}`)).body.notes).toBe('Vented 10 min.\n\tRack in.\r\nAll sealed.')
  })

  it('refuses year 0000 in the Logbook range and a CSV canned date, naming the field', async () => {
    for (const key of ['from', 'to']) {
      const res = await owner.get(`/api/households/${H}/loads?${key}=0000-01-01`)
      expect(res.status, JSON.stringify(res.body)).toBe(400)
      expect(res.body.data.field).toBe(key)
      expect(res.body.message).toMatch(/between the years 1970 and 2200/)
    }
    for (const [row, field] of [['Navy beans,,pint-regular,2,0000-01-01,,', 'canned_on'], ['Navy beans,,pint-regular,2,2026-10-01,9999-12-31,', 'best_by']]) {
      const res = await owner.post(`/api/households/${H}/shelf/import`, csv(row!))
      expect(res.status, JSON.stringify(res.body)).toBe(400)
      expect(res.body.data.field).toBe(field)
      expect(res.body.data.issues[0].line).toBe(2)
    }
  })

  it('refuses a load in the year 9999 (its seal reminder would land in 10000)', async () => {
    const body = bodies['POST /api/households/:id/loads']!() as Record<string, unknown>
    const before = await snapshot()
    const res = await owner.post(`/api/households/${H}/loads`, { ...body, startedAt: '9999-12-31T20:00:00Z', endedAt: '9999-12-31T22:00:00Z' })
    expect(res.status, JSON.stringify(res.body)).toBe(400)
    expect(res.body.data.field).toBe('startedAt')
    expect(res.body.message).toMatch(/between the years 1970 and 2200/)
    expect(await snapshot()).toEqual(before)
  })
})
