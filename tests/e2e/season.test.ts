/**
 * A season's bookkeeping through the server: a plan in progress and its Market list, dry goods on
 * hand, the store comparison by equal volume, items at home and missing prices, and the Logbook
 * corrected and a mistaken load deleted with stock and Shelf put back.
 */
import convert from 'convert-units'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { expectField, startServer, type RunningServer } from '../support/server'
import { ago, jarStock, newHousehold, type TestHousehold } from '../support/household'

let server: RunningServer
let H: TestHousehold
const LB_G = convert(1).from('lb').to('g')

beforeAll(async () => {
  server = await startServer()
  H = await newHousehold(server, { email: 'season@example.test', password: 'a long season password', name: 'Tamsin Orrel', householdName: 'Orrel Cove' })
})
afterAll(async () => { await server?.stop() })

const pintoOnHand = async () => ((await H.owner.get(H.api('/dry-goods'))).body as Array<{ ingredientId: string, grams: number }>).find(g => g.ingredientId === 'pinto-beans')?.grams ?? 0
const item = (result: { shopping: Array<{ kind: string, quantity: number, key: string, cost: number | null }> }, kind: string) => result.shopping.find(s => s.kind === kind)

describe('a plan in progress: the Market list asks only for what the loads not yet logged need', () => {
  let planId: string
  let capacity: number
  let perJarGrams: number
  const line = { recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans' }

  it('a three-load plan, 10 empty pints and 1 lb of pinto beans in the pantry', async () => {
    expect((await H.owner.put(H.api('/jar-stock'), { jarSizeId: 'pint-regular', count: 10 })).status).toBe(200)
    const dry = await H.owner.put(H.api('/dry-goods'), { ingredientId: 'pinto-beans', grams: LB_G })
    expect(dry.status).toBe(200)
    // One jar shows what a load holds; three full loads make the plan.
    const one = await H.owner.post(H.api('/plans/preview'), { cannerId: H.cannerId, lines: [{ ...line, jars: 1 }] })
    expect(one.status).toBe(200)
    capacity = one.body.loads[0].capacity
    const saved = await H.owner.post(H.api('/plans'), { name: 'Three loads of pintos', request: { cannerId: H.cannerId, lines: [{ ...line, jars: 3 * capacity }] } })
    expect(saved.status).toBe(201)
    planId = saved.body.plan.id
    const { result, plan } = (await H.owner.get(H.api(`/plans/${planId}`))).body
    expect(plan.status).toBe('planned')
    expect(result.loads).toHaveLength(3)
    perJarGrams = result.lines[0].perJar.dryGrams
    // CG Guide 4: "3-1/4 pounds" of dry beans per 9 pints.
    expect(perJarGrams).toBeCloseTo((3.25 * LB_G) / 9, 2)
    expect(item(result, 'jar')!.quantity).toBe(3 * capacity - 10)
    expect(item(result, 'ingredient')!.quantity).toBeCloseTo(3 * capacity * perJarGrams - LB_G, 6)
  })

  it('after logging load 1 the list is for loads 2 and 3, against the stock load 1 left: no jar counted twice', async () => {
    const logged = await H.owner.post(H.api('/loads'), {
      planId, planLoad: 1, cannerId: H.cannerId,
      lines: [{ recipeId: line.recipeId, jarSizeId: line.jarSizeId, jars: capacity, product: 'Pinto beans, hot pack' }],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(5), endedAt: ago(3),
    })
    expect(logged.status, JSON.stringify(logged.body)).toBe(201)
    // The load took the 10 empty pints there were and the pound of beans in the pantry.
    expect(await jarStock(H.owner, H.id, 'pint-regular')).toBe(0)
    expect(await pintoOnHand()).toBe(0)
    const { result, plan } = (await H.owner.get(H.api(`/plans/${planId}`))).body
    expect(plan.status).toBe('in-progress')
    expect(result.progress).toEqual({ loggedLoads: [1], loadsLeft: 2, jarsLeft: 2 * capacity })
    // Load 1 needed capacity − 10 jars beyond the stock; the rest of the plan needs 2 × capacity:
    // together exactly the 3 × capacity − 10 the plan asked for before.
    expect(item(result, 'jar')!.quantity).toBe(2 * capacity)
    expect((capacity - 10) + item(result, 'jar')!.quantity).toBe(3 * capacity - 10)
    expect(item(result, 'ingredient')!.quantity).toBeCloseTo(2 * capacity * perJarGrams, 6)
    // ½ tsp salt a pint (CG Guide 4) at 6 g a tsp (USDA SR "Salt, table"), for the jars left only.
    expect(item(result, 'salt')!.quantity).toBeCloseTo(2 * capacity * 0.5 * 6, 6)
  })

  it('the same plan load cannot be logged twice', async () => {
    const again = await H.owner.post(H.api('/loads'), {
      planId, planLoad: 1, cannerId: H.cannerId,
      lines: [{ recipeId: line.recipeId, jarSizeId: line.jarSizeId, jars: capacity }],
      pressurePsi: 15, processMinutes: 75, startedAt: ago(5), endedAt: ago(3),
    })
    expect(again.status).toBe(422)
    expect(again.body.message).toMatch(/already logged as L-001/)
  })

  it('logging loads 2 and 3 makes the plan done, with nothing left to buy', async () => {
    for (const planLoad of [2, 3]) {
      const res = await H.owner.post(H.api('/loads'), {
        planId, planLoad, cannerId: H.cannerId,
        lines: [{ recipeId: line.recipeId, jarSizeId: line.jarSizeId, jars: capacity }],
        pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1),
      })
      expect(res.status).toBe(201)
    }
    const { result, plan } = (await H.owner.get(H.api(`/plans/${planId}`))).body
    expect(plan.status).toBe('done')
    expect(result.shopping).toEqual([])
    expect(result.progress.loadsLeft).toBe(0)
  })

  it('a plan can be marked done by hand', async () => {
    const other = await H.owner.post(H.api('/plans'), { name: 'Maybe later', request: { cannerId: H.cannerId, lines: [{ ...line, jars: 4 }] } })
    const res = await H.owner.patch(H.api(`/plans/${other.body.plan.id}`), { status: 'done' })
    expect(res.status).toBe(200)
    expect(res.body.plan.status).toBe('done')
  })
})

describe('money that means something', () => {
  it('a quart batch compares equal volumes of beans: each quart counts as the cans it replaces', async () => {
    // A 15-oz can holds 1½ cups of drained beans (U.S. Dry Bean Council, "Counting Beans").
    expect((await H.owner.patch(H.api(''), { storeCanPriceCents: 119, storeCanBasis: 'net', storeCanAmount: convert(15).from('oz').to('g') })).status).toBe(200)
    const res = await H.owner.post(H.api('/plans/preview'), { cannerId: H.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'quart-regular', ingredientId: 'pinto-beans', jars: 7 }] })
    expect(res.status).toBe(200)
    const { cost, lines } = res.body
    // CG Guide 4: ¾ lb of dry beans a quart, soaked and boiled, then "fill jars with beans … leaving
    // 1-inch headspace": 1 cup dry = 3 cups cooked (U.S. Dry Bean Council) is more than the jar holds,
    // so the beans fill the quart (6.9 in tall in the jar catalogue) to its headspace line.
    const quart = { ml: convert(1).from('qt').to('ml'), heightMm: convert(6.9).from('in').to('mm') }
    const toHeadspace = quart.ml * (1 - 25.4 / quart.heightMm)
    expect(lines[0].perJar.dryMl * 3).toBeGreaterThan(toHeadspace)
    const cansPerQuart = toHeadspace / convert(1.5).from('cup').to('ml')
    expect(cost.storeCansPerJar[0].cans).toBeCloseTo(cansPerQuart, 3)
    expect(cansPerQuart).toBeGreaterThan(2)
    expect(cost.storeEquivalent).toBe(Math.round(7 * cansPerQuart * 119))
    expect(cost.saving).toBe(cost.storeEquivalent - cost.total)
    expect(cost.storeEquivalent).toBeGreaterThan(7 * 119)
  })

  it('the household\'s currency and store can are settings; a bad one is refused naming the field', async () => {
    const bad = await H.owner.patch(H.api(''), { currency: 'DOGE' })
    expect(bad.status).toBe(400)
    expectField(bad, 'currency')
    const tiny = await H.owner.patch(H.api(''), { storeCanAmount: 2 })
    expect(tiny.status).toBe(400)
    expectField(tiny, 'storeCanAmount')
    expect((await H.owner.patch(H.api(''), { currency: 'CAD' })).status).toBe(200)
    const res = await H.owner.post(H.api('/plans/preview'), { cannerId: H.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 9 }] })
    expect(res.body.household.currency).toBe('CAD')
  })

  it('with no prices entered the cost names what is missing; an item marked at home leaves the total', async () => {
    const saved = await H.owner.post(H.api('/plans'), { name: 'Salt at home', request: { cannerId: H.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 9 }] } })
    const planId = saved.body.plan.id
    let { result } = (await H.owner.get(H.api(`/plans/${planId}`))).body
    expect(result.cost.incomplete).toBe(true)
    expect(result.cost.missingPrices).toEqual(expect.arrayContaining(['Pinto beans', 'Canning salt']))
    // Prices for salt and beans, then salt marked at home.
    expect((await H.owner.post(H.api('/prices'), { kind: 'salt', label: 'Canning salt, 3 lb box', packageGrams: 1361, priceCents: 429 })).status).toBe(201)
    expect((await H.owner.post(H.api('/prices'), { kind: 'ingredient', label: 'Pinto beans, 4 lb', ingredientId: 'pinto-beans', packageGrams: 4 * LB_G, priceCents: 599 })).status).toBe(201)
    result = (await H.owner.get(H.api(`/plans/${planId}`))).body.result
    const salt = item(result, 'salt')!
    const before = result.cost.shoppingTotal
    const mark = await H.owner.put(H.api(`/plans/${planId}/market`), { itemKey: salt.key, checked: true, state: 'at-home' })
    expect(mark.status).toBe(200)
    result = (await H.owner.get(H.api(`/plans/${planId}`))).body.result
    expect(item(result, 'salt')).toMatchObject({ atHome: true })
    expect(result.cost.shoppingTotal).toBe(before - salt.cost!)
  })
})

describe('the Logbook can be corrected', () => {
  const pints = (jars: number) => [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars, product: 'Pinto beans, hot pack' }]
  let loadId: string
  let lineId: string

  it('refuses a load in the future and more jars than the canner holds, naming the capacity', async () => {
    expect((await H.owner.put(H.api('/jar-stock'), { jarSizeId: 'pint-regular', count: 30 })).status).toBe(200)
    const future = await H.owner.post(H.api('/loads'), { cannerId: H.cannerId, lines: pints(9), pressurePsi: 15, processMinutes: 75, startedAt: ago(1), endedAt: ago(-2) })
    expect(future.status).toBe(400)
    expectField(future, 'endedAt', /future/)
    const one = await H.owner.post(H.api('/plans/preview'), { cannerId: H.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 1 }] })
    const holds = one.body.loads[0].capacity as number
    const tooMany = await H.owner.post(H.api('/loads'), { cannerId: H.cannerId, lines: pints(60), pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1) })
    expect(tooMany.status).toBe(400)
    expectField(tooMany, 'lines.0.jars', new RegExp(`holds ${holds} pint jars`))
    expect(await jarStock(H.owner, H.id, 'pint-regular')).toBe(30)
  })

  it('edits the jars (stock follows), the times and the minutes, and keeps the change in the activity record', async () => {
    const res = await H.owner.post(H.api('/loads'), { cannerId: H.cannerId, lines: pints(9), pressurePsi: 15, processMinutes: 75, startedAt: ago(4), endedAt: ago(2) })
    expect(res.status).toBe(201)
    loadId = res.body.id
    lineId = res.body.lines[0].id
    expect(await jarStock(H.owner, H.id, 'pint-regular')).toBe(21)
    const fewer = await H.owner.patch(H.api(`/loads/${loadId}`), { lines: [{ id: lineId, jars: 7 }], processMinutes: 80, startedAt: ago(4.5) })
    expect(fewer.status, JSON.stringify(fewer.body)).toBe(200)
    expect(fewer.body.lines[0].jars).toBe(7)
    expect(fewer.body.processMinutes).toBe(80)
    expect(await jarStock(H.owner, H.id, 'pint-regular')).toBe(23)
    const activity = (await H.owner.get(H.api('/activity'))).body
    const rows = activity.items as Array<{ summary: string }>
    expect(rows.some(r => /Corrected load L-\d{3}: .*process 75 → 80 min.*Pinto beans, hot pack 9 → 7 jars/.test(r.summary))).toBe(true)
  })

  it('refuses a correction into the future or past the canner, changing nothing', async () => {
    const future = await H.owner.patch(H.api(`/loads/${loadId}`), { endedAt: ago(-1) })
    expect(future.status).toBe(400)
    expectField(future, 'endedAt')
    const over = await H.owner.patch(H.api(`/loads/${loadId}`), { lines: [{ id: lineId, jars: 60 }] })
    expect(over.status).toBe(400)
    expectField(over, 'lines')
    const load = (await H.owner.get(H.api(`/loads/${loadId}`))).body
    expect(load.lines[0].jars).toBe(7)
    expect(await jarStock(H.owner, H.id, 'pint-regular')).toBe(23)
  })

  it('deleting a mistaken load after its seal check and a take-off puts stock and Shelf back exactly', async () => {
    // Seal check after 12 h: 7 sealed go on the Shelf; two eaten, their empty jars back to stock.
    const res = await H.owner.post(H.api('/loads'), { cannerId: H.cannerId, lines: pints(7), pressurePsi: 15, processMinutes: 75, startedAt: ago(16), endedAt: ago(14) })
    expect(res.status).toBe(201)
    const before = await jarStock(H.owner, H.id, 'pint-regular')
    expect(before).toBe(23 - 7)
    const id = res.body.id as string
    const check = await H.owner.post(H.api('/seal-checks'), { loadId: id, lines: [{ loadLineId: res.body.lines[0].id, sealed: 7, unsealed: 0 }] })
    expect(check.status).toBe(201)
    const shelf = (await H.owner.get(H.api('/shelf'))).body
    const lot = shelf.lots.find((l: { loadId: string }) => l.loadId === id)
    expect(lot.jarsLeft).toBe(7)
    const jarsOnShelf = shelf.totalJars as number
    expect((await H.owner.post(H.api('/shelf/take-off'), { items: [{ lotId: lot.id, jars: 2 }], returnJars: true })).status).toBe(200)
    expect(await jarStock(H.owner, H.id, 'pint-regular')).toBe(before + 2)
    // Jars counted at the seal check cannot change on the load any more.
    const late = await H.owner.patch(H.api(`/loads/${id}`), { lines: [{ id: res.body.lines[0].id, jars: 6 }] })
    expect(late.status).toBe(422)
    const gone = await H.owner.delete(H.api(`/loads/${id}`))
    expect(gone.status, JSON.stringify(gone.body)).toBe(200)
    expect(await jarStock(H.owner, H.id, 'pint-regular')).toBe(23)
    const after = (await H.owner.get(H.api('/shelf'))).body
    expect(after.lots.some((l: { id: string }) => l.id === lot.id)).toBe(false)
    expect(after.totalJars).toBe(jarsOnShelf - 7)
    expect((await H.owner.get(H.api(`/loads/${id}`))).status).toBe(404)
  })

  it('deleting a plan\'s load gives its dry goods back and sets the plan from the loads that remain', async () => {
    expect((await H.owner.put(H.api('/dry-goods'), { ingredientId: 'pinto-beans', grams: 5 * LB_G })).status).toBe(200)
    const saved = await H.owner.post(H.api('/plans'), { name: 'One load', request: { cannerId: H.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 9 }] } })
    const planId = saved.body.plan.id
    const res = await H.owner.post(H.api('/loads'), { planId, planLoad: 1, cannerId: H.cannerId, lines: pints(9), pressurePsi: 15, processMinutes: 75, startedAt: ago(3), endedAt: ago(1) })
    expect(res.status).toBe(201)
    // CG Guide 4: 3¼ lb for 9 pints came out of the 5 lb in the pantry.
    expect(await pintoOnHand()).toBeCloseTo(5 * LB_G - 3.25 * LB_G, 1)
    expect((await H.owner.get(H.api(`/plans/${planId}`))).body.plan.status).toBe('done')
    expect((await H.owner.delete(H.api(`/loads/${res.body.id}`))).status).toBe(200)
    expect(await pintoOnHand()).toBeCloseTo(5 * LB_G, 6)
    expect((await H.owner.get(H.api(`/plans/${planId}`))).body.plan.status).toBe('planned')
  })
})
