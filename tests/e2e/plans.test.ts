import convert from 'convert-units'
import fc from 'fast-check'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'

let server: RunningServer
let canner: ApiClient
let helper: ApiClient
let householdId: string
let tallCannerId: string
let everydayCannerId: string

const LB_G = convert(1).from('lb').to('g')
const CUP_ML = convert(1).from('cup').to('ml')

beforeAll(async () => {
  server = await startServer()
  canner = new ApiClient(server.url)
  helper = new ApiClient(server.url)
  householdId = (await canner.login('canner@demo.shelfstead.test')).households[0]!.id
  await helper.login('helper@demo.shelfstead.test')
  const canners = (await canner.get(`/api/households/${householdId}/canners`)).body as Array<{ id: string, name: string }>
  tallCannerId = canners.find(c => c.name.startsWith('Tall'))!.id
  everydayCannerId = canners.find(c => c.name.startsWith('Everyday'))!.id
})
afterAll(async () => { await server?.stop() })

const preview = (client: ApiClient, body: unknown) => client.post(`/api/households/${householdId}/plans/preview`, body)

describe('plan preview', () => {
  it('answers "18 pints of black beans, dry pack, in our large canner at our altitude"', async () => {
    const res = await preview(canner, {
      cannerId: tallCannerId,
      lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: 18 }],
    })
    expect(res.status).toBe(200)
    const line = res.body.lines[0]
    expect(line.jars).toBe(18)
    // common practice, no published source: a dry-pack pint holds at most ½ US cup of dry beans
    expect(line.perJar.dryMl).toBeCloseTo(CUP_ML / 2, 2)
    // USDA SR Legacy 16014: black beans 194 g per cup
    expect(line.perJar.dryGrams).toBeCloseTo(194 / 2, 3)
    expect(line.dryGramsTotal).toBeCloseTo(18 * 97, 3)
    // common practice: ¼ tsp salt in a dry-pack pint
    expect(line.perJar.saltTsp).toBe(0.25)
    // USDA CG Guide 4 Table 2: weighted gauge above 1,000 ft (demo household at 2,350 ft) → 15 psi; pints 75 min
    expect(res.body.loads.every((l: { pressurePsi: number }) => l.pressurePsi === 15)).toBe(true)
    expect(res.body.loads[0].processMinutes).toBe(75)
    // CG "Recommended canners": large canners hold 18 pints in two layers
    expect(res.body.loads).toHaveLength(1)
    expect(res.body.loads[0]).toMatchObject({ jars: 18, perLayer: 9, layers: 2, jarSizeId: 'pint-regular', recipeIds: ['house-dry-pack-beans'] })
    expect(res.body.layout.positions).toHaveLength(9)
    expect(res.body.warnings.some((w: { message: string }) => /untested|not .*tested/i.test(w.message))).toBe(true)
    for (const key of ['shopping', 'schedule', 'cost']) expect(res.body).toHaveProperty(key)
    expect(res.body.schedule.totalMinutes).toBeGreaterThan(75)
    expect(res.body.cost.perJar).toBeGreaterThan(0)
  })

  it('answers "what do three 2 lb bags of pinto beans make?" for the tested hot pack', async () => {
    const res = await preview(canner, {
      cannerId: everydayCannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', packages: [{ grams: 2 * LB_G, count: 3 }] }],
    })
    expect(res.status).toBe(200)
    const line = res.body.lines[0]
    // USDA CG Guide 4 "Quantity": 3¼ lb per 9 pints
    const perPint = (3.25 * LB_G) / 9
    // convert-units rounds the pound to 453.592 g; NIST defines 453.59237 g: compare to 0.01 g
    expect(line.perJar.dryGrams).toBeCloseTo(perPint, 2)
    expect(line.jars).toBe(Math.floor((6 * LB_G) / perPint))
    expect(line.leftoverGrams).toBeCloseTo(6 * LB_G - line.jars * perPint, 1)
    // USDA CG Guide 4: ½ tsp salt per pint; Table 1 dial gauge 2,001–4,000 ft → 12 psi
    expect(line.perJar.saltTsp).toBe(0.5)
    expect(res.body.loads.every((l: { pressurePsi: number }) => l.pressurePsi === 12)).toBe(true)
    expect(res.body.warnings.some((w: { code: string, message: string }) => /gauge/i.test(w.message))).toBe(true)
  })

  it('turns jars per month into a target, less the jars on the shelf', async () => {
    const res = await preview(canner, {
      cannerId: tallCannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'quart-regular', jarsPerMonth: 2, months: 6, jarsOnShelf: 3 }],
    })
    expect(res.status).toBe(200)
    expect(res.body.lines[0].jars).toBe(2 * 6 - 3)
    // USDA CG Guide 4: ¾ lb dry per quart; quarts 90 min
    expect(res.body.lines[0].perJar.dryGrams).toBeCloseTo(0.75 * LB_G, 2)
    expect(res.body.loads[0].processMinutes).toBe(90)
  })

  it('plans from a dry weight in grams', async () => {
    const res = await preview(canner, {
      cannerId: tallCannerId,
      lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', dryGrams: 1000 }],
    })
    expect(res.status).toBe(200)
    expect(res.body.lines[0].jars).toBe(Math.floor(1000 / 97))
  })

  it('refuses a dial gauge above 8,000 ft with 422 and says to ask local extension guidance', async () => {
    const res = await preview(canner, {
      cannerId: everydayCannerId,
      altitudeFt: 8500,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9 }],
    })
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/8,?000/)
    expect(res.body.message).toMatch(/extension/i)
  })

  it('refuses half-gallon jars for beans: no published low-acid process (Penn State Extension; NCHFP)', async () => {
    const res = await preview(canner, {
      cannerId: tallCannerId,
      lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'half-gallon-wide', jars: 4 }],
    })
    expect(res.status).toBe(422)
    expect(res.body.message.length).toBeGreaterThan(20)
  })

  it('refuses a dry fill above the cap, with the cap in the message', async () => {
    const res = await preview(canner, {
      cannerId: tallCannerId,
      lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: 9, dryMlPerJar: 150 }],
    })
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/118|½ cup|1\/2 cup/)
  })

  it('answers 400 naming the field for bad bodies', async () => {
    const none = await preview(canner, { cannerId: tallCannerId, lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular' }] })
    expect(none.status).toBe(400)
    expectField(none, 'lines.0.jars')
    const two = await preview(canner, { cannerId: tallCannerId, lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: 3, dryGrams: 100 }] })
    expect(two.status).toBe(400)
    const negative = await preview(canner, { cannerId: tallCannerId, lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: -2 }] })
    expect(negative.status).toBe(400)
    expectField(negative, 'lines.0.jars')
    const noCanner = await preview(canner, { lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: 3 }] })
    expect(noCanner.status).toBe(400)
    expectField(noCanner, 'cannerId')
  })

  it('refuses unknown recipes and other households\' canners with 422 naming the field', async () => {
    const recipe = await preview(canner, { cannerId: tallCannerId, lines: [{ recipeId: 'no-such-recipe', jarSizeId: 'pint-regular', jars: 3 }] })
    expect(recipe.status).toBe(422)
    expect(recipe.body.data.field).toBe('lines.0.recipeId')
    const stranger = new ApiClient(server.url)
    const reg = await stranger.post('/api/auth/register', { email: 'plans-stranger@example.org', password: 'stranger-danger', name: 'S', householdName: 'S' })
    const strangerHousehold = reg.body.households[0].id
    const res = await stranger.post(`/api/households/${strangerHousehold}/plans/preview`, { cannerId: tallCannerId, lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: 3 }] })
    expect(res.status).toBe(422)
    expect(res.body.data.field).toBe('cannerId')
  })

  it('lets a helper preview but not save; 401 without a session; 404 for another household', async () => {
    const body = { cannerId: tallCannerId, lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: 9 }] }
    expect((await preview(helper, body)).status).toBe(200)
    expect((await helper.post(`/api/households/${householdId}/plans`, { name: 'Nope', request: body })).status).toBe(403)
    expect((await preview(new ApiClient(server.url), body)).status).toBe(401)
    const stranger = new ApiClient(server.url)
    await stranger.post('/api/auth/register', { email: 'plans-stranger2@example.org', password: 'stranger-danger', name: 'S', householdName: 'S' })
    expect((await preview(stranger, body)).status).toBe(404)
  })
})

describe('saved plans', () => {
  it('creates, lists, reads (recomputed), renames, copies and deletes a plan', async () => {
    const request = { cannerId: tallCannerId, lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: 18 }] }
    const created = await canner.post(`/api/households/${householdId}/plans`, { name: 'Black beans for winter', request })
    expect(created.status).toBe(201)
    const planId = created.body.plan.id
    const list = await helper.get(`/api/households/${householdId}/plans`)
    expect(list.body.map((p: { id: string }) => p.id)).toContain(planId)
    expect(list.body.find((p: { id: string }) => p.id === planId).summary.jars).toBe(18)

    // recomputed from current data: the owner lowers the altitude below 1,000 ft → weighted 10 psi (CG Table 2)
    const owner = new ApiClient(server.url)
    await owner.login('owner@demo.shelfstead.test')
    await owner.patch(`/api/households/${householdId}`, { altitudeFt: 900 })
    const read = await helper.get(`/api/households/${householdId}/plans/${planId}`)
    expect(read.status).toBe(200)
    expect(read.body.result.loads[0].pressurePsi).toBe(10)
    await owner.patch(`/api/households/${householdId}`, { altitudeFt: 2350 })

    const renamed = await canner.patch(`/api/households/${householdId}/plans/${planId}`, { name: 'Winter black beans' })
    expect(renamed.body.plan.name).toBe('Winter black beans')
    expect((await helper.patch(`/api/households/${householdId}/plans/${planId}`, { name: 'x' })).status).toBe(403)

    const copy = await canner.post(`/api/households/${householdId}/plans/${planId}/copy`)
    expect(copy.status).toBe(201)
    expect(copy.body.plan.name).toBe('Copy of Winter black beans')

    expect((await helper.delete(`/api/households/${householdId}/plans/${planId}`)).status).toBe(403)
    expect((await canner.delete(`/api/households/${householdId}/plans/${planId}`)).status).toBe(204)
    expect((await canner.get(`/api/households/${householdId}/plans/${planId}`)).status).toBe(404)
  })

  it('does not save a plan the model refuses, and a bad update changes nothing', async () => {
    const refused = await canner.post(`/api/households/${householdId}/plans`, {
      name: 'Too high',
      request: { cannerId: everydayCannerId, altitudeFt: 9000, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9 }] },
    })
    expect(refused.status).toBe(422)
    const before = (await canner.get(`/api/households/${householdId}/plans`)).body.length
    const created = await canner.post(`/api/households/${householdId}/plans`, { name: 'Keep me', request: { cannerId: tallCannerId, lines: [{ recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', jars: 9 }] } })
    const planId = created.body.plan.id
    const bad = await canner.patch(`/api/households/${householdId}/plans/${planId}`, { request: { cannerId: everydayCannerId, altitudeFt: 9000, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9 }] } })
    expect(bad.status).toBe(422)
    const after = await canner.get(`/api/households/${householdId}/plans/${planId}`)
    expect(after.body.plan.request.cannerId).toBe(tallCannerId)
    expect((await canner.get(`/api/households/${householdId}/plans`)).body.length).toBe(before + 1)
  })
})

describe('a saved plan that today\'s data refuses', () => {
  it('still opens (with the refusal) and can still be renamed', async () => {
    const created = await canner.post(`/api/households/${householdId}/plans`, { name: 'Dial gauge pints', request: { cannerId: everydayCannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9 }] } })
    expect(created.status).toBe(201)
    const planId = created.body.plan.id
    const owner = new ApiClient(server.url)
    await owner.login('owner@demo.shelfstead.test')
    // USDA CG Table 1 stops at 8,000 ft for dial gauges
    await owner.patch(`/api/households/${householdId}`, { altitudeFt: 8200 })
    try {
      const read = await helper.get(`/api/households/${householdId}/plans/${planId}`)
      expect(read.status).toBe(200)
      expect(read.body.result).toBeNull()
      expect(read.body.refusal.message).toMatch(/8,?000/)
      const renamed = await canner.patch(`/api/households/${householdId}/plans/${planId}`, { name: 'Dial gauge pints (moved house)' })
      expect(renamed.status).toBe(200)
      expect(renamed.body.plan.name).toBe('Dial gauge pints (moved house)')
    }
    finally {
      await owner.patch(`/api/households/${householdId}`, { altitudeFt: 2350 })
    }
  })
})

describe('preview never fails with a server error', () => {
  it('answers 200, 400 or 422 (with a message) for random plan bodies, never 500', async () => {
    const recipeIds = ['usda-dried-beans-hot-pack', 'usda-beans-in-sauce', 'usda-baked-beans', 'usda-bean-soup', 'usda-fresh-lima-hot-pack', 'house-dry-pack-beans', 'nope']
    const jarIds = ['half-pint-regular', 'pint-regular', 'pint-wide', 'pint-and-a-half-wide', 'quart-regular', 'quart-wide', 'half-gallon-wide', 'nope']
    const amount = fc.oneof(
      fc.record({ jars: fc.oneof(fc.integer({ min: -5, max: 600 }), fc.double({ noNaN: true, min: -1, max: 50 })) }),
      fc.record({ dryGrams: fc.double({ noNaN: true, min: -10, max: 600_000 }) }),
      fc.record({ packages: fc.array(fc.record({ grams: fc.double({ noNaN: true, min: -1, max: 60_000 }), count: fc.integer({ min: -1, max: 250 }) }), { maxLength: 3 }) }),
      fc.record({ jarsPerMonth: fc.double({ noNaN: true, min: -1, max: 250 }), months: fc.integer({ min: -1, max: 40 }), jarsOnShelf: fc.integer({ min: -1, max: 300 }) }),
      fc.record({ jars: fc.integer({ min: 1, max: 40 }), dryMlPerJar: fc.double({ noNaN: true, min: 0, max: 400 }), saltTsp: fc.double({ noNaN: true, min: -1, max: 4 }) }),
    )
    const line = fc.tuple(fc.constantFrom(...recipeIds), fc.constantFrom(...jarIds), amount)
      .map(([recipeId, jarSizeId, a]) => ({ recipeId, jarSizeId, ...a }))
    const body = fc.record({
      altitudeFt: fc.option(fc.integer({ min: -2000, max: 32_000 }), { nil: undefined }),
      two: fc.boolean(),
      lines: fc.array(line, { minLength: 0, maxLength: 4 }),
    })
    await fc.assert(fc.asyncProperty(body, async ({ altitudeFt, two, lines }) => {
      const res = await preview(canner, {
        ...(two ? { cannerIds: [tallCannerId, everydayCannerId] } : { cannerId: everydayCannerId }),
        ...(altitudeFt === undefined ? {} : { altitudeFt }),
        lines,
      })
      expect([200, 400, 422]).toContain(res.status)
      if (res.status !== 200) expect(String(res.body.message).length).toBeGreaterThan(10)
    }), { numRuns: 120 })
  })
})
