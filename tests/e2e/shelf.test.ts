/**
 * The Shelf against the built server, in a fresh household whose first load has been logged and
 * seal-checked (the demo household stands in as "another household").
 *
 * Published values checked here (shared/reference/canning-reference.md):
 * - OSU EM 9435: use within a year → best-by 12 months after canning; our warning a month ahead.
 * - CG "Reprocessing unsealed jars": unsealed jars never go on the Shelf.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'
import { ago, cookieFor as cookieOf, jarStock, monthsFromToday, newHousehold } from '../support/household'

let server: RunningServer
let owner: ApiClient
let other: ApiClient
let demoHelper: ApiClient
let hid: string
let demoHid: string
let api: (path: string) => string
const cookieFor = (email: string, password: string) => cookieOf(server, email, password)

beforeAll(async () => {
  server = await startServer()
  const household = await newHousehold(server, { email: 'tamsin@example.org', password: 'split-peas-2026', name: 'Tamsin Veldkamp', householdName: 'Veldkamp cellar' })
  ;({ owner, api } = household)
  hid = household.id
  // One load of pinto and baked beans, checked 20 h after it came out: 15 of 18 jars sealed.
  const load = await owner.post(api('/loads'), {
    cannerId: household.cannerId,
    lines: [
      { recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9, product: 'Pinto beans, hot pack' },
      { recipeId: 'usda-baked-beans', jarSizeId: 'pint-regular', jars: 9 },
    ],
    pressurePsi: 15, processMinutes: 75, startedAt: ago(22), endedAt: ago(20),
  })
  expect(load.status).toBe(201)
  const [a, b] = load.body.lines as Array<{ id: string }>
  const check = await owner.post(api('/seal-checks'), {
    loadId: load.body.id,
    lines: [{ loadLineId: a!.id, sealed: 8, unsealed: 1, action: 'refrigerate' }, { loadLineId: b!.id, sealed: 7, unsealed: 2, action: 'refrigerate' }],
  })
  expect(check.status).toBe(201)
  other = new ApiClient(server.url)
  demoHid = (await other.login('canner@demo.shelfstead.test')).households[0]!.id
  demoHelper = new ApiClient(server.url)
  await demoHelper.login('helper@demo.shelfstead.test')
})
afterAll(async () => { await server?.stop() })

describe('the Shelf', () => {
  let exported = ''

  it('imports an inventory, lists oldest first and warns past and near best-by', async () => {
    const csv = [
      'product,recipe_id,jar_size,jars,canned_on,best_by,load_code',
      `Kidney beans,usda-dried-beans-hot-pack,pint-regular,3,${monthsFromToday(-14)},,2025-A`,
      `"Black beans, quarts",,quart-regular,4,${monthsFromToday(-12, 28)},${monthsFromToday(0, 28)},2025-B`,
      `Navy bean soup,usda-bean-soup,quart-regular,5,${monthsFromToday(-2)},,`,
    ].join('\n')
    const res = await fetch(server.url + api('/shelf/import'), { method: 'POST', headers: { 'content-type': 'text/csv', 'cookie': await cookieFor('tamsin@example.org', 'split-peas-2026') }, body: csv })
    expect(res.status).toBe(201)
    expect(await res.json()).toMatchObject({ imported: 3, jars: 12 })
    const shelf = (await owner.get(api('/shelf'))).body
    // oldest first; L-001's two lots share a date and code, so they follow by name
    expect(shelf.lots.map((l: { product: string }) => l.product)).toEqual(['Kidney beans', 'Black beans, quarts', 'Navy bean soup', 'Baked beans', 'Pinto beans, hot pack'])
    const kidney = shelf.lots[0]
    expect(kidney.bestBy).toBe(monthsFromToday(-2)) // canned 14 months ago + 12 months
    expect(kidney.bestByStatus).toBe('past')
    // best-by on the 28th of this month: within 30 days ahead → near (our warning a month ahead), after it → past
    expect(shelf.lots[1].bestByStatus).toBe(new Date().getDate() > 28 ? 'past' : 'near')
    expect(shelf.lots.find((l: { product: string }) => l.product === 'Navy bean soup').bestByStatus).toBe('ok')
  })

  it('rejects a CSV with bad rows, naming each line, and imports nothing', async () => {
    const before = (await owner.get(api('/shelf'))).body.totalJars
    const csv = [
      'product,recipe_id,jar_size,jars,canned_on,best_by,load_code',
      `Pinto beans,,pint-regular,6,${monthsFromToday(-3)},,`,
      `Chickpeas,,pint-jumbo,6,${monthsFromToday(-3)},,`,
      'Lentil soup,,quart-regular,twelve,2026-02-30,,',
    ].join('\n')
    const res = await owner.post(api('/shelf/import'), { csv })
    expect(res.status).toBe(400)
    expectField(res, 'jar_size', /^Nothing was imported\. Line 3: /)
    const issues = res.body.data.issues as Array<{ line: number, field: string }>
    expect(issues).toEqual(expect.arrayContaining([
      expect.objectContaining({ line: 3, field: 'jar_size' }),
      expect.objectContaining({ line: 4, field: 'jars' }),
      expect.objectContaining({ line: 4, field: 'canned_on' }),
    ]))
    expect(issues.some(i => i.line === 2)).toBe(false)
    expect((await owner.get(api('/shelf'))).body.totalJars).toBe(before)
  })

  it('exports CSV that imports into another household unchanged', async () => {
    const cookie = await cookieFor('tamsin@example.org', 'split-peas-2026')
    exported = await (await fetch(server.url + api('/shelf/export.csv'), { headers: { cookie } })).text()
    expect(exported.split('\n')[0]).toBe('product,recipe_id,jar_size,jars,canned_on,best_by,load_code')
    expect(exported).toContain('"Black beans, quarts"')
    const second = new ApiClient(server.url)
    const reg = await second.post('/api/auth/register', { email: 'odile@example.org', password: 'lima-beans-2026', name: 'Odile Marsh', householdName: 'Marsh pantry' })
    const secondId = reg.body.households[0].id
    const imported = await second.post(`/api/households/${secondId}/shelf/import`, { csv: exported })
    expect(imported.status).toBe(201)
    const again = await (await fetch(`${server.url}/api/households/${secondId}/shelf/export.csv`, { headers: { cookie: await cookieFor('odile@example.org', 'lima-beans-2026') } })).text()
    expect(again).toBe(exported)
  })

  it('takes jars off two lots and puts the empty jars back in stock; undo restores both', async () => {
    const shelf = (await owner.get(api('/shelf'))).body
    const pinto = shelf.lots.find((l: { product: string }) => l.product === 'Pinto beans, hot pack')
    const soup = shelf.lots.find((l: { product: string }) => l.product === 'Navy bean soup')
    const pints = await jarStock(owner, hid, 'pint-regular')
    const quarts = await jarStock(owner, hid, 'quart-regular')
    const res = await owner.post(api('/shelf/take-off'), { items: [{ lotId: pinto.id, jars: 2 }, { lotId: soup.id, jars: 1 }] })
    expect(res.status).toBe(200)
    expect(res.body.lots.find((l: { id: string }) => l.id === pinto.id).jarsLeft).toBe(pinto.jarsLeft - 2)
    expect(res.body.lastTakeOff.jars).toBe(3)
    expect(await jarStock(owner, hid, 'pint-regular')).toBe(pints + 2)
    expect(await jarStock(owner, hid, 'quart-regular')).toBe(quarts + 1)

    const tooMany = await owner.post(api('/shelf/take-off'), { items: [{ lotId: pinto.id, jars: 99 }] })
    expect(tooMany.status).toBe(400)
    expectField(tooMany, 'items.0.jars')

    const undo = await owner.post(api('/shelf/undo'))
    expect(undo.status).toBe(200)
    expect(undo.body.lots.find((l: { id: string }) => l.id === pinto.id).jarsLeft).toBe(pinto.jarsLeft)
    expect(undo.body.lots.find((l: { id: string }) => l.id === soup.id).jarsLeft).toBe(soup.jarsLeft)
    expect(await jarStock(owner, hid, 'pint-regular')).toBe(pints)
    expect(await jarStock(owner, hid, 'quart-regular')).toBe(quarts)
    expect((await owner.post(api('/shelf/undo'))).status).toBe(409)
  })

  it('a lot of another household is a 404; a helper may take jars off (eating the beans is everyone\'s job)', async () => {
    const mine = (await owner.get(api('/shelf'))).body.lots[0]
    expect((await other.post(`/api/households/${demoHid}/shelf/take-off`, { items: [{ lotId: mine.id, jars: 1 }] })).status).toBe(404)
    const theirs = (await demoHelper.get(`/api/households/${demoHid}/shelf`)).body.lots[0]
    const taken = await demoHelper.post(`/api/households/${demoHid}/shelf/take-off`, { items: [{ lotId: theirs.id, jars: 1 }] })
    expect(taken.status).toBe(200)
    expect(taken.body.lots.find((l: { id: string }) => l.id === theirs.id)?.jarsLeft ?? 0).toBe(theirs.jarsLeft - 1)
  })

  it('feeds the Pantry board: shelf by product and jars used per month for the planner', async () => {
    const shelf = (await owner.get(api('/shelf'))).body
    const pinto = shelf.lots.find((l: { product: string }) => l.product === 'Pinto beans, hot pack')
    await owner.post(api('/shelf/take-off'), { items: [{ lotId: pinto.id, jars: 3 }] })
    const board = (await owner.get(api('/board'))).body
    expect(board.shelf.byProduct.find((p: { product: string }) => p.product === 'Pinto beans, hot pack').jars).toBe(5)
    expect(board.jarsUsedPerMonth).toEqual([expect.objectContaining({ product: 'Pinto beans, hot pack', jarSizeId: 'pint-regular', jars: 3, months: 1, jarsPerMonth: 3 })])
    expect(board.usedPerMonth.at(-1).jars).toBe(3)
    expect(board.stockOverTime.at(-1).jars).toBe(shelf.totalJars - 3)
    expect(board.pastBestBy.map((l: { product: string }) => l.product)).toContain('Kidney beans')
    // one load checked: 8 + 7 of 18 jars sealed
    expect(board.sealRates.household.rate).toBeCloseTo(15 / 18, 10)
  })
})
