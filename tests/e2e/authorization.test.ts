/**
 * The authorization matrix: every API route × every kind of caller, with the answer each must
 * get. The routes are read from server/api, so a new route without an expectation here fails.
 * Role rules are the table in DEVELOPERS.md ("Roles"), from the product brief's role table.
 *
 * Callers: no session, a helper, a canner and an owner of household H, the owner of another
 * household, and a site admin (who is no member of H). Write routes get plausible bodies, so
 * the role check, not validation, is what refuses; refused callers must never get a 2xx, and
 * another household's rows answer 404.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { routesFromFiles } from '../support/routes'
import { ago, joinByInvitation, newHousehold, type TestHousehold } from '../support/household'
import { libraryRecipe } from '../support/recipes'

type Identity = 'anonymous' | 'helper' | 'canner' | 'owner' | 'stranger' | 'admin'
const identities: Identity[] = ['anonymous', 'helper', 'canner', 'owner', 'stranger', 'admin']
const rank: Record<Identity, number> = { anonymous: 0, stranger: 0, admin: 0, helper: 1, canner: 2, owner: 3 }

/** Who may call a route: anyone, anyone signed in, a member of at least a role, or a site admin. */
type Access = 'public' | 'session' | 'helper' | 'canner' | 'owner' | 'admin'

interface Call {
  path: string
  body?: unknown
  /** Send as this instead of JSON (photo upload, CSV). */
  form?: () => FormData
}
interface Expectation {
  access: Access
  /** The request, built fresh for each caller (ids made for the call when it uses them up). */
  call: (who: Identity) => Promise<Call> | Call
  /** A route whose own answer is the same for everyone (hidden dev tools, a wrong password). */
  everyone?: number
  /** The call ends the caller's session: make it with a second session of the same person. */
  ownSession?: boolean
  /** It ends every session of the person: the caller signs in again afterwards. */
  endsAll?: boolean
}

let server: RunningServer
let H: TestHousehold
const clients = {} as Record<Identity, ApiClient>
const people = {} as Record<Exclude<Identity, 'anonymous'>, { email: string, password: string }>
const ids = {} as Record<string, string>
const hh = (path: string) => `/api/households/${H.id}${path}`

/** A load of H that came out 20 h ago, so its seal check is due (run for fewer minutes than 75: under-processed). */
async function freshLoad(processMinutes = 75): Promise<{ id: string, lines: Array<{ id: string }> }> {
  const res = await clients.owner.post(hh('/loads'), {
    cannerId: H.cannerId,
    lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 2, product: 'Pinto beans' }],
    pressurePsi: 15, processMinutes, startedAt: ago(22), endedAt: ago(20),
  })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body
}
/** A shared recipe the site admin adds for the call (and retires, for a restore), so no other row depends on it. */
async function freshLibraryRecipe(retired = false): Promise<string> {
  const res = await clients.admin.post('/api/recipes', libraryRecipe())
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  if (retired) expect((await clients.admin.post(`/api/recipes/${res.body.id}/retire`, { reason: 'Set up for the matrix.' })).status).toBe(200)
  return res.body.id
}
async function freshFridgeItem(): Promise<string> {
  const load = await freshLoad()
  const check = await clients.owner.post(hh('/seal-checks'), { loadId: load.id, lines: [{ loadLineId: load.lines[0]!.id, sealed: 1, unsealed: 1, action: 'refrigerate' }] })
  expect(check.status).toBe(201)
  const shelf = (await clients.owner.get(hh('/shelf'))).body
  return shelf.fridge.find((f: { loadId?: string, id: string }) => f.id)!.id
}
/** A lot of its own for a call that changes it (a correction). */
async function freshLot(): Promise<string> {
  const product = `Matrix navy beans ${Math.random().toString(36).slice(2)}`
  const res = await clients.owner.post(hh('/shelf/import'), { csv: `product,recipe_id,jar_size,jars,canned_on,best_by,load_code\n${product},,pint-regular,6,2026-09-01,,` })
  expect(res.status).toBe(201)
  return ((await clients.owner.get(hh('/shelf'))).body.lots as Array<{ id: string, product: string }>).find(l => l.product === product)!.id
}
const planRequest = () => ({ cannerId: H.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9 }] })
async function freshPlan() {
  const res = await clients.owner.post(hh('/plans'), { name: 'Pintos for the matrix', request: planRequest() })
  expect(res.status).toBe(201)
  return res.body.plan.id as string
}
/** A saved plan whose Canning day has started. */
async function freshDay() {
  const planId = await freshPlan()
  expect((await clients.owner.post(hh(`/plans/${planId}/day`))).status).toBe(200)
  return planId
}
async function freshCanner() {
  const res = await clients.owner.post(hh('/canners'), { name: 'Spare canner', innerDiameterMm: 300, usableHeightMm: 220, rackThicknessMm: 6, gaugeType: 'weighted', maxLayers: 1, waterDepthMm: 76 })
  expect(res.status).toBe(201)
  return res.body.id as string
}
async function freshPrice() {
  const res = await clients.owner.post(hh('/prices'), { kind: 'salt', label: 'Canning salt', packageGrams: 737, priceCents: 199 })
  expect(res.status).toBe(201)
  return res.body.id as string
}
const houseRecipe = { name: 'Dry-packed pintos', basedOnRecipeId: 'usda-dried-beans-hot-pack', ingredientId: 'pinto-beans', packStyle: 'dry', headspaceMm: 25.4, solidsFillFraction: 0.75, steps: 'Measure no more than the fill cap, top with boiling water.', note: 'Ours.', jars: [{ sizeKey: 'pint', saltTsp: 0.25 }] }
async function freshRecipe() {
  const res = await clients.owner.post(hh('/recipes'), houseRecipe)
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body.id as string
}
function photoForm() {
  const form = new FormData()
  form.append('photo', new Blob([PNG], { type: 'image/png' }), 'jars.png')
  return form
}
async function freshPhoto() {
  const res = await fetch(server.url + hh(`/loads/${ids.load}/photos`), { method: 'POST', headers: { cookie: clients.owner.cookieHeader, origin: server.url }, body: photoForm() })
  expect(res.status).toBe(201)
  return (await res.json()).id as string
}
async function freshInvitation() {
  const res = await clients.owner.post(hh('/invitations'), { email: `invitee-${Math.random().toString(36).slice(2)}@example.org`, role: 'helper' })
  expect(res.status).toBe(201)
  return res.body[0].id as string
}
const PNG = Uint8Array.from(Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64'))
const UNKNOWN_TOKEN = 'x'.repeat(43)
/** Each caller's own household, for the routes that take one in the body or query. */
const ownHousehold = (who: Identity) => (who === 'stranger' || who === 'admin' ? ids[`${who}Household`]! : H.id)

const expectations: Record<string, Expectation> = {
  'GET /api/health': { access: 'public', call: () => ({ path: '/api/health' }) },
  'GET /api/:...path': { access: 'public', everyone: 404, call: () => ({ path: '/api/no-such-request' }) },
  'POST /api/auth/login': { access: 'public', everyone: 401, call: who => ({ path: '/api/auth/login', body: { email: `nobody-${who}@example.org`, password: 'not the password' } }) },
  'POST /api/auth/register': { access: 'public', everyone: 409, call: () => ({ path: '/api/auth/register', body: { email: people.owner.email, password: 'another-long-password', name: 'Again', householdName: 'Again' } }) },
  'POST /api/auth/logout': { access: 'public', ownSession: true, call: () => ({ path: '/api/auth/logout' }) },
  'POST /api/auth/logout-everywhere': { access: 'session', ownSession: true, endsAll: true, call: () => ({ path: '/api/auth/logout-everywhere' }) },
  'GET /api/auth/me': { access: 'session', call: () => ({ path: '/api/auth/me' }) },
  'POST /api/auth/household': { access: 'session', call: who => ({ path: '/api/auth/household', body: { householdId: ownHousehold(who) } }) },
  'POST /api/auth/reset-request': { access: 'public', call: who => ({ path: '/api/auth/reset-request', body: { email: `nobody-${who}@example.org` } }) },
  'POST /api/auth/reset': { access: 'public', everyone: 400, call: () => ({ path: '/api/auth/reset', body: { token: UNKNOWN_TOKEN, password: 'a-new-long-password' } }) },
  'GET /api/auth/reset/:token': { access: 'public', call: () => ({ path: `/api/auth/reset/${UNKNOWN_TOKEN}` }) },
  'GET /api/invitations/:token': { access: 'public', everyone: 404, call: () => ({ path: `/api/invitations/${UNKNOWN_TOKEN}` }) },
  'POST /api/invitations/:token/accept': { access: 'public', everyone: 404, call: () => ({ path: `/api/invitations/${UNKNOWN_TOKEN}/accept`, body: { mode: 'sign-in', password: 'whatever-it-is' } }) },
  'GET /api/dev/clock': { access: 'public', everyone: 404, call: () => ({ path: '/api/dev/clock' }) },
  'POST /api/dev/clock': { access: 'public', everyone: 404, call: () => ({ path: '/api/dev/clock', body: { offsetMs: 0 } }) },
  'GET /api/dev/outbox': { access: 'session', call: () => ({ path: '/api/dev/outbox' }) },
  'GET /api/dev/mail-queue': { access: 'session', call: () => ({ path: '/api/dev/mail-queue' }) },
  'GET /api/ingredients': { access: 'session', call: () => ({ path: '/api/ingredients' }) },
  'GET /api/jar-sizes': { access: 'session', call: () => ({ path: '/api/jar-sizes' }) },
  'GET /api/recipes': { access: 'helper', call: () => ({ path: `/api/recipes?householdId=${H.id}` }) },
  'GET /api/recipes/:id': { access: 'helper', call: () => ({ path: `/api/recipes/usda-dried-beans-hot-pack?householdId=${H.id}` }) },
  'POST /api/recipes': { access: 'admin', call: () => ({ path: '/api/recipes', body: libraryRecipe() }) },
  'PUT /api/recipes/:id': { access: 'admin', call: async () => ({ path: `/api/recipes/${await freshLibraryRecipe()}`, body: libraryRecipe({ summary: 'Dried peas, pints and quarts.', reason: 'Summary shortened for the Recipe book.' }) }) },
  'POST /api/recipes/:id/retire': { access: 'admin', call: async () => ({ path: `/api/recipes/${await freshLibraryRecipe()}/retire`, body: { reason: 'A duplicate of the dried beans entry.' } }) },
  'POST /api/recipes/:id/restore': { access: 'admin', call: async () => ({ path: `/api/recipes/${await freshLibraryRecipe(true)}/restore`, body: { reason: 'Retired by mistake; it is published.' } }) },

  'GET /api/households/:id': { access: 'helper', call: () => ({ path: hh('') }) },
  'PATCH /api/households/:id': { access: 'owner', call: () => ({ path: hh(''), body: { altitudeFt: 2500 } }) },
  'GET /api/households/:id/board': { access: 'helper', call: () => ({ path: hh('/board') }) },
  'GET /api/households/:id/activity': { access: 'owner', call: () => ({ path: hh('/activity') }) },
  'GET /api/households/:id/backup': { access: 'owner', call: () => ({ path: hh('/backup') }) },
  'GET /api/households/:id/canners': { access: 'helper', call: () => ({ path: hh('/canners') }) },
  'POST /api/households/:id/canners': { access: 'owner', call: () => ({ path: hh('/canners'), body: { name: 'Another canner', innerDiameterMm: 300, usableHeightMm: 220, rackThicknessMm: 6, gaugeType: 'weighted', maxLayers: 1, waterDepthMm: 76 } }) },
  'PATCH /api/households/:id/canners/:cannerId': { access: 'owner', call: () => ({ path: hh(`/canners/${H.cannerId}`), body: { name: 'Big weighted canner' } }) },
  'DELETE /api/households/:id/canners/:cannerId': { access: 'owner', call: async () => ({ path: hh(`/canners/${await freshCanner()}`) }) },
  'GET /api/households/:id/jar-stock': { access: 'helper', call: () => ({ path: hh('/jar-stock') }) },
  'PUT /api/households/:id/jar-stock': { access: 'owner', call: () => ({ path: hh('/jar-stock'), body: { jarSizeId: 'quart-regular', count: 12 } }) },
  'GET /api/households/:id/dry-goods': { access: 'helper', call: () => ({ path: hh('/dry-goods') }) },
  'PUT /api/households/:id/dry-goods': { access: 'canner', call: () => ({ path: hh('/dry-goods'), body: { ingredientId: 'pinto-beans', grams: 907 } }) },
  'GET /api/households/:id/members': { access: 'helper', call: () => ({ path: hh('/members') }) },
  'PATCH /api/households/:id/members/:userId': { access: 'owner', call: () => ({ path: hh(`/members/${ids.cannerUser}`), body: { role: 'canner' } }) },
  // Removing someone else: owners only (leaving is anyone's, tested elsewhere). The owner
  // "removes" itself, the last owner: 409, nothing changes.
  'DELETE /api/households/:id/members/:userId': { access: 'owner', call: who => ({ path: hh(`/members/${who === 'owner' ? ids.ownerUser : who === 'canner' ? ids.helperUser : ids.cannerUser}`) }) },
  'GET /api/households/:id/invitations': { access: 'owner', call: () => ({ path: hh('/invitations') }) },
  'POST /api/households/:id/invitations': { access: 'owner', call: who => ({ path: hh('/invitations'), body: { email: `new-${who}@example.org`, role: 'helper' } }) },
  'POST /api/households/:id/invitations/:invitationId/resend': { access: 'owner', call: async () => ({ path: hh(`/invitations/${await freshInvitation()}/resend`) }) },
  'DELETE /api/households/:id/invitations/:invitationId': { access: 'owner', call: async () => ({ path: hh(`/invitations/${await freshInvitation()}`) }) },
  'GET /api/households/:id/loads': { access: 'helper', call: () => ({ path: hh('/loads') }) },
  'POST /api/households/:id/loads': { access: 'canner', call: () => ({ path: hh('/loads'), body: { cannerId: H.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 1 }], pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1) } }) },
  'GET /api/households/:id/loads/export.csv': { access: 'helper', call: () => ({ path: hh('/loads/export.csv') }) },
  'GET /api/households/:id/loads/:loadId': { access: 'helper', call: () => ({ path: hh(`/loads/${ids.load}`) }) },
  'PATCH /api/households/:id/loads/:loadId': { access: 'canner', call: () => ({ path: hh(`/loads/${ids.load}`), body: { pressurePsi: 15, processMinutes: 75, startedAt: ago(22), endedAt: ago(20) } }) },
  'DELETE /api/households/:id/loads/:loadId': { access: 'canner', call: async () => ({ path: hh(`/loads/${(await freshLoad()).id}`) }) },
  'POST /api/households/:id/loads/:loadId/photos': { access: 'canner', call: () => ({ path: hh(`/loads/${ids.load}/photos`), form: photoForm }) },
  'GET /api/households/:id/photos/:photoId': { access: 'helper', call: () => ({ path: hh(`/photos/${ids.photo}`) }) },
  'DELETE /api/households/:id/photos/:photoId': { access: 'canner', call: async () => ({ path: hh(`/photos/${await freshPhoto()}`) }) },
  'GET /api/households/:id/plans': { access: 'helper', call: () => ({ path: hh('/plans') }) },
  'POST /api/households/:id/plans': { access: 'canner', call: () => ({ path: hh('/plans'), body: { name: 'Another plan', request: planRequest() } }) },
  'POST /api/households/:id/plans/preview': { access: 'helper', call: () => ({ path: hh('/plans/preview'), body: planRequest() }) },
  'GET /api/households/:id/plans/:planId': { access: 'helper', call: () => ({ path: hh(`/plans/${ids.plan}`) }) },
  'GET /api/households/:id/plans/:planId/calendar.ics': { access: 'helper', call: () => ({ path: hh(`/plans/${ids.plan}/calendar.ics`) }) },
  'GET /api/households/:id/plans/:planId/day': { access: 'helper', call: () => ({ path: hh(`/plans/${ids.plan}/day`) }) },
  'POST /api/households/:id/plans/:planId/day': { access: 'helper', call: async () => ({ path: hh(`/plans/${await freshPlan()}/day`) }) },
  'POST /api/households/:id/plans/:planId/day/events': { access: 'helper', call: async () => ({ path: hh(`/plans/${await freshDay()}/day/events`), body: { clientId: crypto.randomUUID(), target: 'load:1', kind: 'start-heat' } }) },
  'POST /api/households/:id/loads/:loadId/decision': { access: 'helper', call: async () => ({ path: hh(`/loads/${(await freshLoad(60)).id}/decision`), body: { action: 'refrigerate' } }) },
  'PATCH /api/households/:id/plans/:planId': { access: 'canner', call: () => ({ path: hh(`/plans/${ids.plan}`), body: { name: 'Pintos for the matrix' } }) },
  'DELETE /api/households/:id/plans/:planId': { access: 'canner', call: async () => ({ path: hh(`/plans/${await freshPlan()}`) }) },
  'POST /api/households/:id/plans/:planId/copy': { access: 'canner', call: () => ({ path: hh(`/plans/${ids.plan}/copy`) }) },
  'GET /api/households/:id/plans/:planId/market': { access: 'helper', call: () => ({ path: hh(`/plans/${ids.plan}/market`) }) },
  'PUT /api/households/:id/plans/:planId/market': { access: 'helper', call: () => ({ path: hh(`/plans/${ids.plan}/market`), body: { itemKey: 'salt', checked: true } }) },
  'POST /api/households/:id/plans/:planId/send-market-list': { access: 'helper', call: () => ({ path: hh(`/plans/${ids.plan}/send-market-list`), body: { userId: ids.ownerUser } }) },
  'GET /api/households/:id/prices': { access: 'helper', call: () => ({ path: hh('/prices') }) },
  'POST /api/households/:id/prices': { access: 'owner', call: () => ({ path: hh('/prices'), body: { kind: 'lid', label: 'Lids, 12', packCount: 12, priceCents: 399, mouth: 'regular' } }) },
  'PATCH /api/households/:id/prices/:priceId': { access: 'owner', call: async () => ({ path: hh(`/prices/${ids.price}`), body: { kind: 'salt', label: 'Canning salt', packageGrams: 737, priceCents: 219 } }) },
  'DELETE /api/households/:id/prices/:priceId': { access: 'owner', call: async () => ({ path: hh(`/prices/${await freshPrice()}`) }) },
  'POST /api/households/:id/recipes': { access: 'canner', call: () => ({ path: hh('/recipes'), body: houseRecipe }) },
  'PATCH /api/households/:id/recipes/:recipeId': { access: 'canner', call: () => ({ path: hh(`/recipes/${ids.recipe}`), body: houseRecipe }) },
  'DELETE /api/households/:id/recipes/:recipeId': { access: 'canner', call: async () => ({ path: hh(`/recipes/${await freshRecipe()}`) }) },
  'GET /api/households/:id/seal-checks': { access: 'helper', call: () => ({ path: hh('/seal-checks') }) },
  'POST /api/households/:id/seal-checks': { access: 'helper', call: async () => { const load = await freshLoad(); return { path: hh('/seal-checks'), body: { loadId: load.id, lines: [{ loadLineId: load.lines[0]!.id, sealed: 2, unsealed: 0 }] } } } },
  'GET /api/households/:id/shelf': { access: 'helper', call: () => ({ path: hh('/shelf') }) },
  'GET /api/households/:id/shelf/export.csv': { access: 'helper', call: () => ({ path: hh('/shelf/export.csv') }) },
  'GET /api/households/:id/shelf/labels': { access: 'helper', call: () => ({ path: hh('/shelf/labels') }) },
  'POST /api/households/:id/shelf/import': { access: 'canner', call: () => ({ path: hh('/shelf/import'), body: { csv: 'product,recipe_id,jar_size,jars,canned_on,best_by,load_code\nNavy beans,,pint-regular,2,2026-10-01,,' } }) },
  'POST /api/households/:id/shelf/take-off': { access: 'helper', call: () => ({ path: hh('/shelf/take-off'), body: { items: [{ lotId: ids.lot, jars: 1 }] } }) },
  'POST /api/households/:id/shelf/undo': { access: 'helper', call: () => ({ path: hh('/shelf/undo') }) },
  'GET /api/households/:id/shelf/lots/:lotId': { access: 'helper', call: () => ({ path: hh(`/shelf/lots/${ids.lot}`) }) },
  'POST /api/households/:id/shelf/lots/:lotId/correction': { access: 'canner', call: async () => ({ path: hh(`/shelf/lots/${await freshLot()}/correction`), body: { jarsLeft: 4, cause: 'broken' } }) },
  'POST /api/households/:id/shelf/fridge/:itemId/clear': { access: 'helper', call: async () => ({ path: hh(`/shelf/fridge/${await freshFridgeItem()}/clear`) }) },
}

/** What a caller must get from a route: a status, or "allowed" (anything but a refusal or a 5xx). */
function expected(e: Expectation, who: Identity): number | 'allowed' {
  if (e.everyone) return e.everyone
  if (e.access === 'public') return 'allowed'
  if (who === 'anonymous') return 401
  if (e.access === 'session') return 'allowed'
  if (e.access === 'admin') return who === 'admin' ? 'allowed' : 403
  if (who === 'stranger' || who === 'admin') return 404
  return rank[who] >= rank[e.access] ? 'allowed' : 403
}

async function send(client: ApiClient | null, method: string, call: Call) {
  if (!call.form) return (client ?? new ApiClient(server.url)).request(method, call.path, call.body ?? (method === 'GET' || method === 'DELETE' ? undefined : {}))
  const cookie = client?.cookieHeader ?? ''
  const res = await fetch(server.url + call.path, { method, headers: { ...(cookie ? { cookie } : {}), origin: server.url }, body: call.form() })
  return { status: res.status, body: await res.json().catch(() => null) }
}

/** A second session of the same person, working in the same household, for calls that end it. */
async function secondSession(who: Identity): Promise<ApiClient | null> {
  if (who === 'anonymous') return null
  const client = new ApiClient(server.url)
  await client.login(people[who].email, people[who].password)
  const switched = await client.post('/api/auth/household', { householdId: ownHousehold(who) })
  expect(switched.status).toBe(200)
  return client
}

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_ADMIN_EMAIL: 'site-admin@example.org' } })
  people.owner = { email: 'matrix-owner@example.org', password: 'owner-pass-2026' }
  H = await newHousehold(server, { ...people.owner, name: 'Mara Quill', householdName: 'Quill pantry' })
  clients.owner = H.owner
  clients.anonymous = new ApiClient(server.url)
  ids.ownerUser = (await H.owner.get('/api/auth/me')).body.user.id
  for (const [who, role] of [['helper', 'helper'], ['canner', 'canner']] as const) {
    people[who] = { email: `matrix-${who}@example.org`, password: `${who}-pass-2026` }
    const joined = await joinByInvitation(server, H, { ...people[who], name: `Matrix ${who}` }, role)
    clients[who] = joined.client
    ids[`${who}User`] = joined.userId
  }
  for (const who of ['stranger', 'admin'] as const) {
    people[who] = { email: who === 'admin' ? 'site-admin@example.org' : 'matrix-stranger@example.org', password: `${who}-pass-2026` }
    const client = new ApiClient(server.url)
    const reg = await client.post('/api/auth/register', { ...people[who], name: `Matrix ${who}`, householdName: `${who} kitchen` })
    expect(reg.status).toBe(201)
    clients[who] = client
    ids[`${who}Household`] = reg.body.households[0].id
  }
  expect((await clients.admin.get('/api/auth/me')).body.user.isAdmin).toBe(true)
  const load = await freshLoad()
  ids.load = load.id
  ids.plan = await freshPlan()
  ids.price = await freshPrice()
  ids.recipe = await freshRecipe()
  ids.photo = await freshPhoto()
  const imported = await H.owner.post(hh('/shelf/import'), { csv: 'product,recipe_id,jar_size,jars,canned_on,best_by,load_code\nPinto beans,,pint-regular,40,2026-09-01,,' })
  expect(imported.status).toBe(201)
  ids.lot = (await H.owner.get(hh('/shelf'))).body.lots.find((l: { product: string }) => l.product === 'Pinto beans').id
})
afterAll(async () => { await server?.stop() })

describe('the authorization matrix', () => {
  const routes = routesFromFiles()

  it('has an expectation for every route file, and a route for every expectation', () => {
    expect(routes.length).toBeGreaterThan(60)
    expect(routes.filter(r => !expectations[r]).sort()).toEqual([])
    expect(Object.keys(expectations).filter(r => !routes.includes(r)).sort()).toEqual([])
  })

  it('can fail: a refused caller is told apart from an allowed one', () => {
    expect(expected(expectations['PATCH /api/households/:id']!, 'canner')).toBe(403)
    expect(expected(expectations['PATCH /api/households/:id']!, 'stranger')).toBe(404)
    expect(expected(expectations['PATCH /api/households/:id']!, 'owner')).toBe('allowed')
  })

  // Refused callers first (they must change nothing), then the allowed ones.
  for (const phase of ['refused', 'allowed'] as const) {
    it.each(identities)(`every route answers %s as the role table says (${phase} calls)`, async (who) => {
      const wrong: string[] = []
      for (const route of routes) {
        const e = expectations[route]!
        const want = expected(e, who)
        if ((want === 'allowed') !== (phase === 'allowed')) continue
        const [method] = route.split(' ')
        const call = await e.call(who)
        const client = who === 'anonymous' ? null : e.ownSession ? await secondSession(who) : clients[who]
        const res = await send(client, method!, call)
        if (e.endsAll && who !== 'anonymous' && res.status === 200) clients[who] = (await secondSession(who))!
        const ok = want === 'allowed'
          ? res.status < 500 && ![401, 403, 404].includes(res.status)
          : res.status === want
        if (!ok) wrong.push(`${route} as ${who}: ${res.status} (want ${want}) ${JSON.stringify(res.body).slice(0, 160)}`)
      }
      expect(wrong).toEqual([])
    })
  }
})
