/**
 * The Logbook and the seal check against the built server (the Shelf: shelf.test.ts), in a fresh household of
 * its own (the demo household stands in as "another household").
 *
 * Published values checked here (shared/reference/canning-reference.md):
 * - USDA Complete Guide (CG) Guide 4, Table 2: weighted gauge above 1,000 ft → 15 psi;
 *   Table 1: dial gauge 2,001–4,000 ft → 12 psi; dried beans hot pack pints 75 min, quarts 90 min;
 *   baked beans pints 65 min.
 * - CG "Cooling jars" / "Testing jar seals" (MSU-PFS 01600951): test seals after 12–24 h.
 * - CG "Reprocessing unsealed jars" (MSU-PFS 01600593): reprocess within 24 h, new lid, same time;
 *   or refrigerate and eat within several days.
 * - OSU EM 9435: use within a year → best-by 12 months after canning.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'
import { H, ago, cookieFor as cookieOf, jarStock, monthsFromToday, newHousehold } from '../support/household'

let server: RunningServer
let owner: ApiClient
let other: ApiClient
let demoHelper: ApiClient
let hid: string
let demoHid: string
let cannerId: string
let dialCannerId: string
let api: (path: string) => string
const cookieFor = (email: string, password: string) => cookieOf(server, email, password)

async function upload(cookie: string, path: string, bytes: Uint8Array, name: string, type: string) {
  const form = new FormData()
  form.append('photo', new Blob([new Uint8Array(bytes)], { type }), name)
  const res = await fetch(server.url + path, { method: 'POST', headers: { cookie }, body: form })
  return { status: res.status, body: await res.json().catch(() => null) as any } // eslint-disable-line @typescript-eslint/no-explicit-any -- test JSON
}

const PNG_1PX = Uint8Array.from(Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64'))

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_TEST_CLOCK: '1' } })
  const household = await newHousehold(server, { email: 'tamsin@example.org', password: 'split-peas-2026', name: 'Tamsin Veldkamp', householdName: 'Veldkamp cellar' })
  ;({ owner, cannerId, dialCannerId, api } = household)
  hid = household.id
  other = new ApiClient(server.url)
  demoHid = (await other.login('canner@demo.shelfstead.test')).households[0]!.id
  demoHelper = new ApiClient(server.url)
  await demoHelper.login('helper@demo.shelfstead.test')
})
afterAll(async () => { await server?.stop() })

let firstLoad: { id: string, lines: Array<{ id: string, product: string, jars: number }> }
let reprocessId: string

describe('logging loads', () => {
  it('logs a mixed load at the published pressure and time, unflagged, and takes its jars out of empty-jar stock', async () => {
    const res = await owner.post(api('/loads'), {
      cannerId,
      lines: [
        { recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9, product: 'Pinto beans, hot pack' },
        { recipeId: 'usda-baked-beans', jarSizeId: 'pint-regular', jars: 9 },
      ],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(22), endedAt: ago(20), notes: 'Steady rock the whole time.',
    })
    expect(res.status).toBe(201)
    // CG Guide 4 Table 2: weighted gauge above 1,000 ft → 15 psi; a mixed load runs for its longest time (pints 75 > baked 65)
    expect(res.body).toMatchObject({ code: 'L-001', requiredPsi: 15, requiredMinutes: 75, shortfall: null, status: 'done' })
    expect(res.body.lines.map((l: { product: string }) => l.product)).toEqual(['Pinto beans, hot pack', 'Baked beans'])
    // CG "Testing jar seals": 12–24 h after unloading; 20 h have passed
    expect(res.body.sealCheck.status).toBe('due')
    expect(await jarStock(owner, hid, 'pint-regular')).toBe(30 - 18)
    firstLoad = res.body
  })

  it('flags a load run at less pressure than the table, with what to do', async () => {
    const res = await owner.post(api('/loads'), {
      cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'quart-regular', jars: 7 }],
      pressurePsi: 10, processMinutes: 90, startedAt: ago(21), endedAt: ago(19),
    })
    expect(res.status).toBe(201)
    // quarts 90 min (CG Guide 4) were kept; 10 psi is short of 15 psi
    expect(res.body.requiredMinutes).toBe(90)
    expect(res.body.shortfall.kind).toBe('under-processed')
    expect(res.body.shortfall.message).toMatch(/10 psi instead of 15 psi/)
    expect(res.body.shortfall.message).toMatch(/reprocess within 24 hours .*new lid.*full time/i)
    expect(res.body.shortfall.message).toMatch(/refrigerate and eat within several days/i)
  })

  it('flags a load timed shorter than the table on a dial gauge (CG Table 1: 2,001–4,000 ft → 12 psi)', async () => {
    const res = await owner.post(api('/loads'), {
      cannerId: dialCannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 8 }],
      pressurePsi: 12, processMinutes: 60, startedAt: ago(32), endedAt: ago(30),
    })
    expect(res.status).toBe(201)
    expect(res.body.requiredPsi).toBe(12)
    expect(res.body.shortfall.message).toMatch(/60 min instead of 75 min/)
  })

  it('answers bad input with 400 naming the field and logs nothing', async () => {
    const before = (await owner.get(api('/loads'))).body.total
    const backwards = await owner.post(api('/loads'), { cannerId, lines: [{ recipeId: 'usda-baked-beans', jarSizeId: 'pint-regular', jars: 4 }], pressurePsi: 15, processMinutes: 75, startedAt: ago(1), endedAt: ago(3) })
    expect(backwards.status).toBe(400)
    expectField(backwards, 'endedAt')
    const unknown = await owner.post(api('/loads'), { cannerId, lines: [{ recipeId: 'no-such-recipe', jarSizeId: 'pint-regular', jars: 4 }], pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1) })
    expect(unknown.status).toBe(400)
    expectField(unknown, 'lines.0.recipeId')
    const theirCanner = (await other.get(`/api/households/${demoHid}/canners`)).body[0].id
    const foreign = await owner.post(api('/loads'), { cannerId: theirCanner, lines: [{ recipeId: 'usda-baked-beans', jarSizeId: 'pint-regular', jars: 4 }], pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1) })
    expect(foreign.status).toBe(400)
    expectField(foreign, 'cannerId')
    expect((await owner.get(api('/loads'))).body.total).toBe(before)
  })

  it('lets a helper read the Logbook but not log a load', async () => {
    expect((await demoHelper.get(`/api/households/${demoHid}/loads`)).status).toBe(200)
    const res = await demoHelper.post(`/api/households/${demoHid}/loads`, { cannerId, lines: [{ recipeId: 'usda-baked-beans', jarSizeId: 'pint-regular', jars: 4 }], pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1) })
    expect(res.status).toBe(403)
    expect((await owner.get(`/api/households/${demoHid}/loads`)).status).toBe(404)
  })
})

describe('the seal check', () => {
  it('refuses a check before the jars have cooled 12 h (CG "Cooling jars")', async () => {
    const load = await owner.post(api('/loads'), { cannerId, lines: [{ recipeId: 'usda-baked-beans', jarSizeId: 'pint-regular', jars: 4 }], pressurePsi: 15, processMinutes: 65, startedAt: ago(3), endedAt: ago(1) })
    expect(load.body.sealCheck.status).toBe('cooling')
    const res = await owner.post(api('/seal-checks'), { loadId: load.body.id, lines: [{ loadLineId: load.body.lines[0].id, sealed: 4, unsealed: 0 }] })
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/12 hours/)
  })

  it('answers a miscount with 400 naming the line and changes nothing', async () => {
    const [a, b] = firstLoad.lines
    const res = await owner.post(api('/seal-checks'), { loadId: firstLoad.id, lines: [{ loadLineId: a!.id, sealed: 8, unsealed: 0 }, { loadLineId: b!.id, sealed: 7, unsealed: 2, action: 'reprocess' }] })
    expect(res.status).toBe(400)
    expectField(res, 'lines.0.unsealed', /9 jars/)
    const noAction = await owner.post(api('/seal-checks'), { loadId: firstLoad.id, lines: [{ loadLineId: a!.id, sealed: 8, unsealed: 1 }, { loadLineId: b!.id, sealed: 9, unsealed: 0 }] })
    expect(noAction.status).toBe(400)
    expectField(noAction, 'lines.0.action')
    expect((await owner.get(api('/shelf'))).body.lots).toHaveLength(0)
  })

  it('puts sealed jars on the Shelf with a best-by 12 months on, unsealed ones in the refrigerator or into a reprocessing load', async () => {
    const [a, b] = firstLoad.lines
    const res = await owner.post(api('/seal-checks'), {
      loadId: firstLoad.id,
      lines: [{ loadLineId: a!.id, sealed: 8, unsealed: 1, action: 'refrigerate' }, { loadLineId: b!.id, sealed: 7, unsealed: 2, action: 'reprocess' }],
    })
    expect(res.status).toBe(201)
    expect(res.body.check).not.toBeNull()
    const shelf = (await owner.get(api('/shelf'))).body
    const pinto = shelf.lots.find((l: { product: string }) => l.product === 'Pinto beans, hot pack')
    const baked = shelf.lots.find((l: { product: string }) => l.product === 'Baked beans')
    expect(pinto).toMatchObject({ jarsLeft: 8, loadCode: 'L-001', jarSizeId: 'pint-regular' })
    expect(baked.jarsLeft).toBe(7)
    // OSU EM 9435 "use within a year": best-by = canned date + 12 months (the household default)
    const canned = new Date(pinto.cannedOn)
    const expected = new Date(Date.UTC(canned.getUTCFullYear() + 1, canned.getUTCMonth(), canned.getUTCDate())).toISOString().slice(0, 10)
    expect(pinto.bestBy).toBe(expected)
    // CG: refrigerate unsealed jars and eat within several days
    expect(shelf.fridge).toEqual([expect.objectContaining({ product: 'Pinto beans, hot pack', jars: 1, loadCode: 'L-001' })])
    // CG: reprocess within 24 h with a new lid and the SAME process time
    expect(res.body.reprocessedIn).toHaveLength(1)
    const again = (await owner.get(api(`/loads/${res.body.reprocessedIn[0].id}`))).body
    expect(again).toMatchObject({ status: 'pending', requiredMinutes: 75, requiredPsi: 15, pressurePsi: null })
    expect(again.reprocessOf.id).toBe(firstLoad.id)
    expect(again.lines).toEqual([expect.objectContaining({ product: 'Baked beans', jars: 2 })])
    const firstEnd = Date.parse((await owner.get(api(`/loads/${firstLoad.id}`))).body.endedAt)
    expect(Date.parse(again.deadlineAt) - firstEnd).toBe(24 * H)
    reprocessId = again.id
    expect((await owner.post(api('/seal-checks'), { loadId: firstLoad.id, lines: [{ loadLineId: a!.id, sealed: 9, unsealed: 0 }, { loadLineId: b!.id, sealed: 9, unsealed: 0 }] })).status).toBe(409)
  })

  it('records the reprocessing run, flags one short of the same process time, and a mistyped run can be corrected until its jars are decided', async () => {
    const short = await owner.patch(api(`/loads/${reprocessId}`), { pressurePsi: 15, processMinutes: 50, startedAt: ago(2), endedAt: ago(0.5) })
    expect(short.status).toBe(200)
    expect(short.body.shortfall.message).toMatch(/50 min instead of 75 min/)
    expect(short.body.status).toBe('done')
    // Typed 50 for 75: the correction clears the flag (no jars have been decided on yet).
    const corrected = await owner.patch(api(`/loads/${reprocessId}`), { processMinutes: 75 })
    expect(corrected.status).toBe(200)
    expect(corrected.body.shortfall).toBeNull()
    // Back to 50, and the jars refrigerated as an under-processed load must be: that stands.
    expect((await owner.patch(api(`/loads/${reprocessId}`), { processMinutes: 50 })).body.shortfall.kind).toBe('under-processed')
    expect((await owner.post(api(`/loads/${reprocessId}/decision`), { action: 'refrigerate' })).status).toBe(200)
    const undo = await owner.patch(api(`/loads/${reprocessId}`), { processMinutes: 75 })
    expect(undo.status).toBe(422)
    expect(undo.body.message).toMatch(/decision stands/)
  })

  it('keeps every jar of an under-processed load off the Shelf, sealed or not', async () => {
    const loads = (await owner.get(api('/loads?sort=code'))).body.rows
    const under = loads.find((l: { code: string }) => l.code === 'L-002')
    const res = await owner.post(api('/seal-checks'), { loadId: under.id, lines: [{ loadLineId: under.lines[0].id, sealed: 7, unsealed: 0 }] })
    expect(res.status).toBe(400)
    expectField(res, 'lines.0.action', /under-processed/)
    const ok = await owner.post(api('/seal-checks'), { loadId: under.id, lines: [{ loadLineId: under.lines[0].id, sealed: 7, unsealed: 0, action: 'refrigerate' }] })
    expect(ok.status).toBe(201)
    const shelf = (await owner.get(api('/shelf'))).body
    expect(shelf.lots.some((l: { loadCode: string }) => l.loadCode === 'L-002')).toBe(false)
    expect(shelf.fridge.find((f: { loadCode: string }) => f.loadCode === 'L-002').jars).toBe(7)
  })

  it('refuses reprocessing more than 24 h after unloading (CG "Reprocessing unsealed jars")', async () => {
    const loads = (await owner.get(api('/loads?sort=code'))).body.rows
    const late = loads.find((l: { code: string }) => l.code === 'L-003')
    const res = await owner.post(api('/seal-checks'), { loadId: late.id, lines: [{ loadLineId: late.lines[0].id, sealed: 6, unsealed: 2, action: 'reprocess' }] })
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/more than 24 hours/)
  })

  it('computes seal rates per recipe, per canner and for the household', async () => {
    const { rates } = (await owner.get(api('/seal-checks'))).body
    // L-001: pinto 8 of 9, baked 7 of 9; L-002 (weighted canner): 7 of 7 dried beans quarts
    expect(rates.household).toEqual({ sealed: 22, unsealed: 3, rate: 22 / 25 })
    const dried = rates.byRecipe.find((r: { id: string }) => r.id === 'usda-dried-beans-hot-pack')
    expect(dried).toMatchObject({ sealed: 15, unsealed: 1, rate: 15 / 16 })
    expect(rates.byRecipe.find((r: { id: string }) => r.id === 'usda-baked-beans')).toMatchObject({ sealed: 7, unsealed: 2, rate: 7 / 9 })
    expect(rates.byCanner).toEqual([expect.objectContaining({ id: cannerId, sealed: 22, unsealed: 3 })])
  })
})

describe('the Logbook list', () => {
  it('pages, sorts and filters on the server', async () => {
    const all = (await owner.get(api('/loads?pageSize=100&sort=code'))).body
    expect(all.rows.map((r: { code: string }) => r.code)).toEqual(['L-001', 'L-002', 'L-003', 'L-004', 'L-005'])
    const page = (await owner.get(api('/loads?page=2&pageSize=2&sort=-code'))).body
    expect(page.total).toBe(5)
    expect(page.rows.map((r: { code: string }) => r.code)).toEqual(['L-003', 'L-002'])
    const baked = (await owner.get(api('/loads?recipeId=usda-baked-beans&sort=code'))).body
    expect(baked.rows.map((r: { code: string }) => r.code)).toEqual(['L-001', 'L-004', 'L-005'])
    const dial = (await owner.get(api(`/loads?cannerId=${dialCannerId}`))).body
    expect(dial.rows.map((r: { code: string }) => r.code)).toEqual(['L-003'])
    const future = (await owner.get(api(`/loads?from=${monthsFromToday(1, 1)}`))).body
    expect(future.total).toBe(0)
    const byJars = (await owner.get(api('/loads?sort=-jars'))).body.rows.map((r: { jars: number }) => r.jars)
    expect(byJars).toEqual([...byJars].sort((a, b) => b - a))
    expect(byJars[0]).toBe(18)
    for (const key of ['startedAt', 'canner', 'pressurePsi', 'processMinutes']) expect((await owner.get(api(`/loads?sort=${key}`))).status).toBe(200)
    const bad = await owner.get(api('/loads?sort=colour'))
    expect(bad.status).toBe(400)
    expectField(bad, 'sort')
    const csv = await fetch(server.url + api('/loads/export.csv?recipeId=usda-baked-beans'), { headers: { cookie: await cookieFor('tamsin@example.org', 'split-peas-2026') } })
    expect(csv.headers.get('content-type')).toMatch(/text\/csv/)
    const lines = (await csv.text()).trim().split('\n')
    expect(lines[0]).toMatch(/^load_code,status,started_at/)
    expect(lines.filter(l => l.includes('Baked beans'))).toHaveLength(3)
  })
})

describe('photos', () => {
  let photoId: string

  it('stores a PNG for a load and serves it back to members with its type', async () => {
    const cookie = await cookieFor('tamsin@example.org', 'split-peas-2026')
    const res = await upload(cookie, api(`/loads/${firstLoad.id}/photos`), PNG_1PX, 'jars-on-towel.png', 'image/png')
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ contentType: 'image/png', bytes: PNG_1PX.byteLength })
    photoId = res.body.id
    const back = await fetch(server.url + api(`/photos/${photoId}`), { headers: { cookie } })
    expect(back.status).toBe(200)
    expect(back.headers.get('content-type')).toBe('image/png')
    expect(Buffer.from(await back.arrayBuffer()).equals(Buffer.from(PNG_1PX))).toBe(true)
    expect((await owner.get(api(`/loads/${firstLoad.id}`))).body.photos).toHaveLength(1)
  })

  it('refuses a text file dressed up as a JPEG, and a photo over 8 MB', async () => {
    const cookie = await cookieFor('tamsin@example.org', 'split-peas-2026')
    const fake = await upload(cookie, api(`/loads/${firstLoad.id}/photos`), new TextEncoder().encode('these are not the jars you are looking for'), 'jars.jpg', 'image/jpeg')
    expect(fake.status).toBe(400)
    expect(fake.body.message).toMatch(/not a JPEG, PNG or WebP/)
    const big = new Uint8Array(9 * 1024 * 1024)
    big.set([0xFF, 0xD8, 0xFF, 0xE0])
    const tooBig = await upload(cookie, api(`/loads/${firstLoad.id}/photos`), big, 'big.jpg', 'image/jpeg')
    expect(tooBig.status).toBe(413)
    expect(tooBig.body.message).toMatch(/8 MB/)
    expect((await owner.get(api(`/loads/${firstLoad.id}`))).body.photos).toHaveLength(1)
  })

  it('answers 404 for the photo to anyone outside the household', async () => {
    const demoCookie = await cookieFor('canner@demo.shelfstead.test', 'put-up-2026')
    expect((await fetch(`${server.url}/api/households/${demoHid}/photos/${photoId}`, { headers: { cookie: demoCookie } })).status).toBe(404)
    expect((await fetch(server.url + api(`/photos/${photoId}`), { headers: { cookie: demoCookie } })).status).toBe(404)
    expect((await fetch(server.url + api(`/photos/${photoId}`))).status).toBe(401)
  })
})
