/**
 * The Shelf against the built server, in a fresh household whose first load has been logged and
 * seal-checked (the demo household stands in as "another household").
 *
 * Published values checked here (shared/reference/canning-reference.md):
 * - OSU EM 9435: use within a year → best-by 12 months after canning; our warning a month ahead.
 * - CG "Reprocessing unsealed jars": unsealed jars never go on the Shelf.
 * - OWASP "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): exported cells that
 *   begin with =, +, -, @, tab or carriage return get a leading single quote.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { parse } from 'csv-parse/sync'
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
const HEADER = 'product,recipe_id,jar_size,jars,canned_on,best_by,load_code,lot_id'
type Lot = { id: string, product: string, jarsLeft: number, jarSizeId: string }

async function exportOf(householdId: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${server.url}/api/households/${householdId}/shelf/export.csv`, { headers: { cookie: await cookieFor(email, password) } })
  expect(res.status).toBe(200)
  return res.text()
}
/** The Shelf reduced to what must not drift: each lot's id, product and jars left. */
const shelfState = async (client: ApiClient, householdId: string) =>
  ((await client.get(`/api/households/${householdId}/shelf`)).body.lots as Lot[]).map(l => `${l.id} ${l.product} ${l.jarsLeft}`).sort()
/** The export with every lot_id cell emptied: the same jars as new lots. */
const withoutLotIds = (csv: string) => {
  const rows = parse(csv, { relax_column_count: true }) as string[][]
  const at = rows[0]!.indexOf('lot_id')
  return `${rows.map(r => r.map((c, i) => (i === at && r !== rows[0] ? '' : `"${c.replace(/"/g, '""')}"`)).join(',')).join('\n')}\n`
}

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

  it('exports every lot with its lot_id; importing the export twice leaves the Shelf unchanged', async () => {
    exported = await exportOf(hid, 'tamsin@example.org', 'split-peas-2026')
    const rows = parse(exported, { columns: true }) as Array<Record<string, string>>
    expect(exported.split('\n')[0]).toBe(HEADER)
    expect(exported).toContain('"Black beans, quarts"')
    const before = await shelfState(owner, hid)
    expect(rows.map(r => `${r.lot_id} ${r.product} ${r.jars}`).sort()).toEqual(before)
    const jarsBefore = (await owner.get(api('/shelf'))).body.totalJars
    for (const round of [1, 2]) {
      const again = await owner.post(api('/shelf/import'), { csv: exported })
      expect(again.status, `round ${round}`).toBe(200)
      expect(again.body).toMatchObject({ imported: 0, jars: 0, skipped: before.length })
      expect(again.body.message).toContain(`${before.length} rows are lots already on the Shelf`)
      expect(await shelfState(owner, hid)).toEqual(before)
      expect((await owner.get(api('/shelf'))).body.totalJars).toBe(jarsBefore)
    }
  })

  it('a file with new lots adds only those and says how many rows it skipped and why', async () => {
    const before = await shelfState(owner, hid)
    const csv = `${exported.trimEnd()}\nGarbanzo beans,,pint-regular,4,${monthsFromToday(-1)},,2026-G,\n"Great northern, quarts",,quart-regular,2,${monthsFromToday(-1)},,,\n`
    const res = await owner.post(api('/shelf/import'), { csv })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ imported: 2, jars: 6, skipped: before.length, skippedBecause: [{ reason: 'on-shelf', rows: before.length }] })
    expect(res.body.message).toBe(`Added 2 lots (6 jars). Skipped: ${before.length} rows are lots already on the Shelf (an import never changes a lot; correct it on the Shelf).`)
    const after = await shelfState(owner, hid)
    expect(after.length).toBe(before.length + 2)
    expect(after.filter(l => !before.includes(l)).map(l => l.replace(/^\S+ /, '')).sort()).toEqual(['Garbanzo beans 4', 'Great northern, quarts 2'])
    // the household's activity record says what the import did
    const activity = (await owner.get(api('/activity'))).body.items as Array<{ summary: string }>
    expect(activity[0]!.summary).toMatch(/^Imported an inventory onto the Shelf: Added 2 lots \(6 jars\)/)
  })

  it('refuses another household\'s lot ids, the same way as made-up ones, and imports their jars once the ids are emptied', async () => {
    const second = new ApiClient(server.url)
    const reg = await second.post('/api/auth/register', { email: 'odile@example.org', password: 'lima-beans-2026', name: 'Odile Marsh', householdName: 'Marsh pantry' })
    const secondId = reg.body.households[0].id
    const refused = await second.post(`/api/households/${secondId}/shelf/import`, { csv: exported })
    expect(refused.status).toBe(400)
    expectField(refused, 'lot_id', /^Nothing was imported\. Line 2: This lot_id is not a lot of this household's Shelf\. To add the row as a new lot, empty its lot_id cell\.$/)
    const lines = exported.trimEnd().split('\n').length
    expect(refused.body.data.issues.filter((i: { field: string }) => i.field === 'lot_id').map((i: { line: number }) => i.line)).toEqual(Array.from({ length: lines - 1 }, (_, i) => i + 2))
    // a lot id that exists nowhere gets the very same answer: nothing tells whose ids they were
    const madeUp = await second.post(`/api/households/${secondId}/shelf/import`, { csv: `${HEADER}\nPinto beans,,pint-regular,2,${monthsFromToday(-1)},,,00000000-0000-4000-8000-000000000000\n` })
    expect(madeUp.status).toBe(400)
    expect(madeUp.body.message).toBe(refused.body.message)
    expect((await second.get(`/api/households/${secondId}/shelf`)).body.lots).toEqual([])

    const moved = await second.post(`/api/households/${secondId}/shelf/import`, { csv: withoutLotIds(exported) })
    expect(moved.status).toBe(201)
    expect(moved.body.imported).toBe(lines - 1)
    const theirs = await exportOf(secondId, 'odile@example.org', 'lima-beans-2026')
    const strip = (csv: string) => (parse(csv, { columns: true }) as Array<Record<string, string>>).map(({ lot_id: _, ...rest }) => JSON.stringify(rest))
    expect(strip(theirs)).toEqual(strip(exported))
  })

  it('neutralises a formula in an exported cell (OWASP CSV Injection) and reads it back unchanged', async () => {
    const third = new ApiClient(server.url)
    const reg = await third.post('/api/auth/register', { email: 'wren@example.org', password: 'adzuki-beans-2026', name: 'Wren Talbot', householdName: 'Talbot larder' })
    const thirdId = reg.body.households[0].id
    const products = ['=HYPERLINK("http://x","y")', '-5 bean soup', '@home pintos', '+1 kidney']
    const csv = [HEADER, ...products.map(p => `"${p.replace(/"/g, '""')}",,pint-regular,2,${monthsFromToday(-1)},,,`)].join('\n')
    expect((await third.post(`/api/households/${thirdId}/shelf/import`, { csv })).status).toBe(201)
    const out = await exportOf(thirdId, 'wren@example.org', 'adzuki-beans-2026')
    // the raw cell, as a spreadsheet would open it: quoted, with a leading single quote
    expect(out.split('\n')).toContainEqual(expect.stringMatching(/^"'=HYPERLINK\(""http:\/\/x"",""y""\)",/))
    expect(out.split('\n')).toContainEqual(expect.stringMatching(/^"'-5 bean soup",/))
    for (const line of out.trimEnd().split('\n').slice(1)) expect(line).toMatch(/^"'[=+\-@]/)
    // read back: the export again changes nothing; its jars as new lots keep their names exactly
    const again = await third.post(`/api/households/${thirdId}/shelf/import`, { csv: out })
    expect(again.body).toMatchObject({ imported: 0, skipped: 4 })
    const fourth = new ApiClient(server.url)
    const fourthId = (await fourth.post('/api/auth/register', { email: 'ines@example.org', password: 'borlotti-2026', name: 'Ines Carr', householdName: 'Carr cupboard' })).body.households[0].id
    expect((await fourth.post(`/api/households/${fourthId}/shelf/import`, { csv: withoutLotIds(out) })).status).toBe(201)
    const names = ((await fourth.get(`/api/households/${fourthId}/shelf`)).body.lots as Lot[]).map(l => l.product).sort()
    expect(names).toEqual([...products].sort())
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

  it('corrects a miscounted lot and removes broken jars and a lot recorded by mistake, none of it counted as use', async () => {
    const board = (await owner.get(api('/board'))).body
    const shelf = (await owner.get(api('/shelf'))).body
    const byName = (name: string) => (shelf.lots as Lot[]).find(l => l.product === name)!
    const kidney = byName('Kidney beans')
    const soup = byName('Navy bean soup')
    const garbanzo = byName('Garbanzo beans')
    const pints = await jarStock(owner, hid, 'pint-regular')
    const quarts = await jarStock(owner, hid, 'quart-regular')

    // counted again: one more jar of kidney beans than the Shelf said
    const more = await owner.post(api(`/shelf/lots/${kidney.id}/correction`), { jarsLeft: kidney.jarsLeft + 1, cause: 'miscounted', note: 'one was behind the soup' })
    expect(more.status).toBe(200)
    expect((more.body.lots as Lot[]).find(l => l.id === kidney.id)!.jarsLeft).toBe(kidney.jarsLeft + 1)
    // two quarts of soup broke: off the Shelf, and no empty jars come back
    const broken = await owner.post(api(`/shelf/lots/${soup.id}/correction`), { jarsLeft: soup.jarsLeft - 2, cause: 'broken' })
    expect(broken.status).toBe(200)
    expect((broken.body.lots as Lot[]).find(l => l.id === soup.id)!.jarsLeft).toBe(soup.jarsLeft - 2)
    // the garbanzos were never canned: the whole lot leaves, jar stock as it was
    const mistake = await owner.post(api(`/shelf/lots/${garbanzo.id}/correction`), { jarsLeft: 0, cause: 'mistake' })
    expect(mistake.status).toBe(200)
    expect((mistake.body.lots as Lot[]).some(l => l.id === garbanzo.id)).toBe(false)
    expect(mistake.body.totalJars).toBe(shelf.totalJars + 1 - 2 - garbanzo.jarsLeft)
    expect(await jarStock(owner, hid, 'pint-regular')).toBe(pints)
    expect(await jarStock(owner, hid, 'quart-regular')).toBe(quarts)

    const after = (await owner.get(api('/board'))).body
    expect(after.jarsUsedPerMonth).toEqual(board.jarsUsedPerMonth)
    expect(after.usedPerMonth).toEqual(board.usedPerMonth)
    expect(after.stockOverTime.at(-1).jars).toBe(board.stockOverTime.at(-1).jars + 1 - 2 - garbanzo.jarsLeft)
    const activity = ((await owner.get(api('/activity'))).body.items as Array<{ summary: string }>).map(a => a.summary)
    expect(activity.slice(0, 3)).toEqual([
      `Removed Garbanzo beans (2026-G) from the Shelf: Recorded by mistake: these jars were never filled`,
      `Corrected Navy bean soup (imported) from ${soup.jarsLeft} jars to ${soup.jarsLeft - 2} jars: Broken or lost`,
      `Corrected Kidney beans (2025-A) from ${kidney.jarsLeft} jars to ${kidney.jarsLeft + 1} jars: Miscounted: the count was wrong — one was behind the soup`,
    ])
    // a lot removed since the export is skipped on re-import, not put back
    const reimport = await owner.post(api('/shelf/import'), { csv: await exportOf(hid, 'tamsin@example.org', 'split-peas-2026') + `Garbanzo beans,,pint-regular,4,${monthsFromToday(-1)},,2026-G,${garbanzo.id}\n` })
    expect(reimport.status).toBe(200)
    expect(reimport.body.skippedBecause).toContainEqual({ reason: 'gone', rows: 1, message: '1 row is a lot eaten or removed since (not put back)' })
  })

  it('thrown-out jars kept for reuse go back to jar stock; a correction is checked and is a canner\'s to make', async () => {
    const shelf = (await owner.get(api('/shelf'))).body
    const pinto = (shelf.lots as Lot[]).find(l => l.product === 'Pinto beans, hot pack')!
    const pints = await jarStock(owner, hid, 'pint-regular')
    const thrown = await owner.post(api(`/shelf/lots/${pinto.id}/correction`), { jarsLeft: pinto.jarsLeft - 1, cause: 'discarded', note: 'lid lifted in storage' })
    expect(thrown.status).toBe(200)
    expect(await jarStock(owner, hid, 'pint-regular')).toBe(pints + 1)

    const same = await owner.post(api(`/shelf/lots/${pinto.id}/correction`), { jarsLeft: pinto.jarsLeft - 1, cause: 'miscounted' })
    expect(same.status).toBe(400)
    expectField(same, 'jarsLeft', /already shows/)
    const up = await owner.post(api(`/shelf/lots/${pinto.id}/correction`), { jarsLeft: pinto.jarsLeft + 5, cause: 'broken' })
    expect(up.status).toBe(400)
    expectField(up, 'jarsLeft', /leave the Shelf/)
    const partialMistake = await owner.post(api(`/shelf/lots/${pinto.id}/correction`), { jarsLeft: 2, cause: 'mistake' })
    expect(partialMistake.status).toBe(400)
    expectField(partialMistake, 'jarsLeft', /enter 0 jars/)
    // another household's lot is a 404 for its owner; a helper may not correct the books
    const theirs = (await demoHelper.get(`/api/households/${demoHid}/shelf`)).body.lots[0] as Lot
    expect((await owner.post(api(`/shelf/lots/${theirs.id}/correction`), { jarsLeft: 0, cause: 'mistake' })).status).toBe(404)
    expect((await demoHelper.post(`/api/households/${demoHid}/shelf/lots/${theirs.id}/correction`, { jarsLeft: 0, cause: 'mistake' })).status).toBe(403)
    expect((await demoHelper.get(`/api/households/${demoHid}/shelf`)).body.lots[0].jarsLeft).toBe(theirs.jarsLeft)
  })

  it('undo reverses only take-offs, and not one whose lot was corrected since', async () => {
    const shelf = (await owner.get(api('/shelf'))).body
    const kidney = (shelf.lots as Lot[]).find(l => l.product === 'Kidney beans')!
    const soup = (shelf.lots as Lot[]).find(l => l.product === 'Navy bean soup')!
    const taken = await owner.post(api('/shelf/take-off'), { items: [{ lotId: kidney.id, jars: 1 }] })
    expect(taken.status).toBe(200)
    const batchId = taken.body.batchId
    // a correction of another lot does not stand in the way, and is not what Undo reverses
    await owner.post(api(`/shelf/lots/${soup.id}/correction`), { jarsLeft: soup.jarsLeft - 1, cause: 'broken' })
    expect((await owner.get(api('/shelf'))).body.lastTakeOff.batchId).toBe(batchId)
    const undone = await owner.post(api('/shelf/undo'), { batchId })
    expect(undone.status).toBe(200)
    const lots = undone.body.lots as Lot[]
    expect(lots.find(l => l.id === kidney.id)!.jarsLeft).toBe(kidney.jarsLeft)
    expect(lots.find(l => l.id === soup.id)!.jarsLeft).toBe(soup.jarsLeft - 1)
    // an undo for a take-off that is no longer the latest is refused
    expect((await owner.post(api('/shelf/undo'), { batchId })).status).toBe(409)

    // take one, then correct the same lot: the take-off stays, the correction has the last word
    const again = await owner.post(api('/shelf/take-off'), { items: [{ lotId: kidney.id, jars: 1 }] })
    await owner.post(api(`/shelf/lots/${kidney.id}/correction`), { jarsLeft: 1, cause: 'broken' })
    const blocked = await owner.post(api('/shelf/undo'), { batchId: again.body.batchId })
    expect(blocked.status).toBe(409)
    expect(blocked.body.message).toMatch(/^The count of Kidney beans was corrected after that take-off/)
    expect(((await owner.get(api('/shelf'))).body.lots as Lot[]).find(l => l.id === kidney.id)!.jarsLeft).toBe(1)
  })

  it('opens one lot for its label\'s QR code, for any member, with the latest take-off when it touched the lot', async () => {
    const shelf = (await owner.get(api('/shelf'))).body
    const lot = (shelf.lots as Lot[]).find(l => l.product === 'Baked beans')!
    const taken = await owner.post(api('/shelf/take-off'), { items: [{ lotId: lot.id, jars: 1 }] })
    const res = await owner.get(api(`/shelf/lots/${lot.id}`))
    expect(res.status).toBe(200)
    expect(res.body.lot).toMatchObject({ id: lot.id, product: 'Baked beans', jarSizeId: 'pint-regular', jarSizeName: 'Pint, regular mouth', loadCode: 'L-001', jarsLeft: lot.jarsLeft - 1, jarsIn: 7 })
    expect(res.body.lastTakeOff).toMatchObject({ batchId: taken.body.batchId, jars: 1 })
    const other = (shelf.lots as Lot[]).find(l => l.product === 'Kidney beans')!
    expect((await owner.get(api(`/shelf/lots/${other.id}`))).body.lastTakeOff).toBeNull()
    const theirs = (await demoHelper.get(`/api/households/${demoHid}/shelf`)).body.lots[0] as Lot
    expect((await demoHelper.get(`/api/households/${demoHid}/shelf/lots/${theirs.id}`)).status).toBe(200)
    expect((await owner.get(api(`/shelf/lots/${theirs.id}`))).status).toBe(404)
  })

  it('labels one load, one lot or a chosen count, with the public address for the QR codes', async () => {
    const shelf = (await owner.get(api('/shelf'))).body
    const fromLoad = (shelf.lots as Array<Lot & { loadId: string | null }>).filter(l => l.loadId)
    expect(fromLoad.length).toBe(2)
    const load = await owner.get(api(`/shelf/labels?load=${fromLoad[0]!.loadId}`))
    expect(load.status).toBe(200)
    expect(load.body.publicUrl).toBe(server.url)
    expect(load.body.lots.map((l: { id: string }) => l.id).sort()).toEqual(fromLoad.map(l => l.id).sort())
    expect(load.body.lots.map((l: { labels: number, jars: number }) => l.labels)).toEqual(load.body.lots.map((l: { jars: number }) => l.jars))
    const one = await owner.get(api(`/shelf/labels?lots=${fromLoad[0]!.id}&count=4&layout=a4-24`))
    expect(one.body).toMatchObject({ layout: 'a4-24', lots: [{ id: fromLoad[0]!.id, labels: 4 }] })
    const zero = await owner.get(api('/shelf/labels?count=0'))
    expect(zero.status).toBe(400)
    expectField(zero, 'count', /from 1 to 300/)
    expect((await owner.get(api('/shelf/labels?layout=a5'))).status).toBe(400)
  })
})
