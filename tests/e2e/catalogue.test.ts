import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'
import { libraryRecipe } from '../support/recipes'

let server: RunningServer
let owner: ApiClient
let canner: ApiClient
let helper: ApiClient
let stranger: ApiClient
let householdId: string
let strangerHouseholdId: string

beforeAll(async () => {
  server = await startServer()
  owner = new ApiClient(server.url)
  canner = new ApiClient(server.url)
  helper = new ApiClient(server.url)
  stranger = new ApiClient(server.url)
  householdId = (await owner.login('owner@demo.shelfstead.test')).households[0]!.id
  await canner.login('canner@demo.shelfstead.test')
  await helper.login('helper@demo.shelfstead.test')
  const made = await stranger.post('/api/auth/register', { email: 'fenna@example.org', password: 'split-pea-soup', name: 'Fenna', householdName: 'Other kitchen' })
  strangerHouseholdId = made.body.households[0].id
})
afterAll(async () => { await server?.stop() })

const recipesPath = () => `/api/recipes?householdId=${householdId}`
const houseRecipe = (extra: Record<string, unknown> = {}) => ({
  name: 'Dry-packed pintos',
  basedOnRecipeId: 'usda-dried-beans-hot-pack',
  ingredientId: 'pinto-beans',
  packStyle: 'dry',
  headspaceMm: 25.4,
  solidsFillFraction: 0.75,
  steps: 'Rinse, measure no more than the fill cap, top with boiling water.',
  note: 'Our grandmother did it this way.',
  jars: [{ sizeKey: 'pint', saltTsp: 0.25 }, { sizeKey: 'half-pint', saltTsp: 0 }],
  ...extra,
})
const pintMinutes = (recipe: { processMinutes: Array<{ jarKey: string, minutes: number }> }) =>
  recipe.processMinutes.find(p => p.jarKey === 'pint')?.minutes

describe('the Recipe book', () => {
  it('lists the five tested recipes, each with its published source, and the shared dry-pack house recipe', async () => {
    const res = await helper.get(recipesPath())
    expect(res.status).toBe(200)
    const tested = res.body.filter((r: { status: string }) => r.status === 'tested')
    expect(tested.map((r: { id: string }) => r.id).sort()).toEqual([
      'usda-baked-beans', 'usda-bean-soup', 'usda-beans-in-sauce', 'usda-dried-beans-hot-pack', 'usda-fresh-lima-hot-pack',
    ])
    for (const r of tested) expect(r.source).toMatch(/USDA Complete Guide to Home Canning/)
    const dryPack = res.body.find((r: { id: string }) => r.id === 'house-dry-pack-beans')
    expect(dryPack).toMatchObject({ status: 'house', caution: expect.stringMatching(/^Untested — your own risk/) })
  })

  // USDA Complete Guide to Home Canning (AIB 539), Guide 4: dried beans, hot pack — pints 75, quarts 90 min; 1 in headspace.
  it('gives one recipe with its process table, pressure bands, and the bean\'s cup weight and expansion with sources', async () => {
    const res = await helper.get(`/api/recipes/usda-dried-beans-hot-pack?householdId=${householdId}`)
    expect(res.status).toBe(200)
    expect(res.body.processMinutes).toEqual(expect.arrayContaining([{ jarKey: 'pint', minutes: 75 }, { jarKey: 'quart', minutes: 90 }]))
    expect(res.body.headspaceMm).toBe(25.4)
    const dial = res.body.pressureBands.filter((b: { gaugeType: string }) => b.gaugeType === 'dial').map((b: { psi: number }) => b.psi).sort()
    expect(dial).toEqual([11, 12, 13, 14])
    expect(res.body.ingredient).toMatchObject({ id: 'pinto-beans', gramsPerCup: 193, expansionRatio: 3 })
    expect(res.body.ingredient.gramsPerCupSource).toMatch(/USDA SR Legacy/)
    expect(res.body.ingredient.expansionSource).toMatch(/Rule of thumb/)
  })

  it('answers 404 for a recipe that does not exist and 404 for a household that is not yours', async () => {
    expect((await helper.get(`/api/recipes/no-such-recipe?householdId=${householdId}`)).status).toBe(404)
    expect((await stranger.get(recipesPath())).status).toBe(404)
  })

  it('lists the jar catalogue and the ingredients for any signed-in person', async () => {
    const jars = await stranger.get('/api/jar-sizes')
    expect(jars.status).toBe(200)
    expect(jars.body.find((j: { id: string }) => j.id === 'pint-regular')).toMatchObject({ sizeKey: 'pint', mouth: 'regular', dimensionsNote: expect.any(String) })
    // NIST: 1 US pint = 16 fl oz = 473.176473 mL.
    expect(jars.body.find((j: { id: string }) => j.id === 'pint-regular').capacityMl).toBeCloseTo(473.176473, 6)
    const beans = await stranger.get('/api/ingredients')
    expect(beans.body.find((i: { id: string }) => i.id === 'black-beans')).toMatchObject({ gramsPerCup: 194 })
    expect((await new ApiClient(server.url).get('/api/jar-sizes')).status).toBe(401)
  })

  it('lets only a site admin edit a shared recipe', async () => {
    const res = await owner.put('/api/recipes/usda-dried-beans-hot-pack', libraryRecipe({ name: 'Beans, renamed' }))
    expect(res.status).toBe(403)
    const still = await helper.get(`/api/recipes/usda-dried-beans-hot-pack?householdId=${householdId}`)
    expect(still.body.name).toBe('Dried beans or peas, hot pack')
  })
})

describe('house recipes', () => {
  let createdId: string

  it('refuses a helper (403)', async () => {
    const res = await helper.post(`/api/households/${householdId}/recipes`, houseRecipe())
    expect(res.status).toBe(403)
  })

  it('lets a canner create one; it is a house recipe with the untested caution even when the body says tested', async () => {
    const res = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ status: 'tested', caution: null, fillBasis: 'published' }))
    expect(res.status).toBe(201)
    createdId = res.body.id
    expect(res.body.status).toBe('house')
    expect(res.body.fillBasis).toBe('cap')
    expect(res.body.caution).toMatch(/^Untested — your own risk/)
    expect(res.body.caution).toContain('Our grandmother did it this way.')
    expect(res.body.basedOnRecipeId).toBe('usda-dried-beans-hot-pack')
    // Borrowed from the tested table (CG Guide 4: pints 75, quarts 90), not invented.
    expect(pintMinutes(res.body)).toBe(75)
    expect(res.body.pressureBands.filter((b: { gaugeType: string }) => b.gaugeType === 'dial')).toHaveLength(4)
    const list = await helper.get(recipesPath())
    expect(list.body.find((r: { id: string }) => r.id === createdId)).toMatchObject({ status: 'house', basedOn: { id: 'usda-dried-beans-hot-pack', name: 'Dried beans or peas, hot pack' } })
  })

  it('refuses a body that sets its own process minutes or pressure, naming the field', async () => {
    const minutes = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ processMinutes: [{ jarKey: 'pint', minutes: 20 }] }))
    expect(minutes.status).toBe(400)
    expectField(minutes, 'processMinutes', /copied from the tested recipe/)
    const pressure = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ pressureBands: [{ gaugeType: 'dial', minFt: 0, maxFt: 8000, psi: 5 }] }))
    expect(pressure.status).toBe(400)
    expectField(pressure, 'pressureBands')
  })

  it('refuses a house recipe without a tested basis, with less than 1 in headspace, or an overfull fill', async () => {
    const noBasis = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ basedOnRecipeId: 'house-dry-pack-beans' }))
    expect(noBasis.status).toBe(400)
    expectField(noBasis, 'basedOnRecipeId')
    const shallow = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ headspaceMm: 12.7 }))
    expect(shallow.status).toBe(400)
    expectField(shallow, 'headspaceMm', /at least 1 inch/)
    const overfull = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ solidsFillFraction: 1.2 }))
    expect(overfull.status).toBe(400)
    expectField(overfull, 'solidsFillFraction')
  })

  // CG Guide 4: dried beans are soaked and boiled, then hot-packed; a raw pack is for fresh beans.
  it('refuses a raw pack or a full-jar fill for dried beans (422, naming the field)', async () => {
    const raw = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ packStyle: 'raw' }))
    expect(raw.status).toBe(422)
    expectField(raw, 'packStyle', /fresh beans/)
    const full = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ solidsFillFraction: 1 }))
    expect(full.status).toBe(422)
    expectField(full, 'solidsFillFraction', /¾/)
  })

  // Penn State Extension / NCHFP: a process time cannot be extended to a larger jar than was tested.
  it('refuses a jar size larger than the borrowed table covers (422)', async () => {
    const res = await canner.post(`/api/households/${householdId}/recipes`, houseRecipe({ jars: [{ sizeKey: 'half-gallon', saltTsp: 0 }] }))
    expect(res.status).toBe(422)
    expect(res.body.data.issues[0].field).toBe('jars.0.sizeKey')
    expect(res.body.message).toMatch(/quart jars or smaller/)
  })

  it('lets a canner change the basis, re-copying that table, and delete it; another household sees a 404', async () => {
    const changed = await canner.patch(`/api/households/${householdId}/recipes/${createdId}`, houseRecipe({ name: 'Navy beans in sauce, our way', basedOnRecipeId: 'usda-beans-in-sauce' }))
    expect(changed.status).toBe(200)
    // CG Guide 4, beans with tomato or molasses sauce: pints 65 min.
    expect(pintMinutes(changed.body)).toBe(65)
    expect(changed.body.caution).toMatch(/^Untested/)
    expect((await stranger.get(`/api/recipes/${createdId}?householdId=${strangerHouseholdId}`)).status).toBe(404)
    expect((await stranger.delete(`/api/households/${strangerHouseholdId}/recipes/${createdId}`)).status).toBe(404)
    expect((await helper.delete(`/api/households/${householdId}/recipes/${createdId}`)).status).toBe(403)
    expect((await canner.delete(`/api/households/${householdId}/recipes/${createdId}`)).status).toBe(200)
    expect((await helper.get(`/api/recipes/${createdId}?householdId=${householdId}`)).status).toBe(404)
  })
})

describe('canners', () => {
  const newCanner = { name: 'Borrowed canner', innerDiameterMm: 305, usableHeightMm: 250, rackThicknessMm: 6, gaugeType: 'dial', maxLayers: 1, waterDepthMm: 76, lastGaugeTestAt: '2026-10-01' }

  // Dial gauges are tested yearly (PNW 421; Illinois Extension); weighted gauges need no test (Univ. of Missouri Extension).
  it('flags the demo dial canner (tested 2025-09-20) as due and the weighted one as not due', async () => {
    const res = await helper.get(`/api/households/${householdId}/canners`)
    expect(res.status).toBe(200)
    const dial = res.body.find((c: { gaugeType: string }) => c.gaugeType === 'dial')
    const weighted = res.body.find((c: { gaugeType: string }) => c.gaugeType === 'weighted')
    expect(dial).toMatchObject({ lastGaugeTestAt: '2025-09-20', gaugeTestDue: true, innerDiameterMm: 300 })
    expect(weighted).toMatchObject({ lastGaugeTestAt: null, gaugeTestDue: false })
  })

  it('refuses a helper (403) and a canner (403), and lets the owner add, change and delete one', async () => {
    expect((await helper.post(`/api/households/${householdId}/canners`, newCanner)).status).toBe(403)
    expect((await canner.post(`/api/households/${householdId}/canners`, newCanner)).status).toBe(403)
    const made = await owner.post(`/api/households/${householdId}/canners`, newCanner)
    expect(made.status).toBe(201)
    expect(made.body).toMatchObject({ name: 'Borrowed canner', innerDiameterMm: 305, gaugeTestDue: false })
    const never = await owner.patch(`/api/households/${householdId}/canners/${made.body.id}`, { lastGaugeTestAt: null })
    expect(never.status).toBe(200)
    expect(never.body.gaugeTestDue).toBe(true)
    expect((await owner.delete(`/api/households/${householdId}/canners/${made.body.id}`)).status).toBe(200)
    const after = await owner.get(`/api/households/${householdId}/canners`)
    expect(after.body.some((c: { id: string }) => c.id === made.body.id)).toBe(false)
  })

  it('answers 404 when another household\'s owner changes or deletes a demo canner', async () => {
    const demo = (await owner.get(`/api/households/${householdId}/canners`)).body[0]
    expect((await stranger.patch(`/api/households/${strangerHouseholdId}/canners/${demo.id}`, { name: 'Mine now' })).status).toBe(404)
    expect((await stranger.delete(`/api/households/${strangerHouseholdId}/canners/${demo.id}`)).status).toBe(404)
    expect((await stranger.patch(`/api/households/${householdId}/canners/${demo.id}`, { name: 'Mine now' })).status).toBe(404)
    expect((await owner.get(`/api/households/${householdId}/canners`)).body.find((c: { id: string }) => c.id === demo.id).name).toBe(demo.name)
  })

  it('refuses out-of-range measurements with 400 naming the field, in both units', async () => {
    const tiny = await owner.post(`/api/households/${householdId}/canners`, { ...newCanner, innerDiameterMm: 90 })
    expect(tiny.status).toBe(400)
    expectField(tiny, 'innerDiameterMm', /150 mm and 600 mm.*in\)/)
    const future = await owner.post(`/api/households/${householdId}/canners`, { ...newCanner, lastGaugeTestAt: '2099-01-01' })
    expect(future.status).toBe(400)
    expectField(future, 'lastGaugeTestAt')
    const gauge = await owner.post(`/api/households/${householdId}/canners`, { ...newCanner, gaugeType: 'steam' })
    expectField(gauge, 'gaugeType')
  })
})

describe('price list and empty jars owned', () => {
  it('lets a helper read the demo price list and refuses a helper\'s change (403)', async () => {
    const list = await helper.get(`/api/households/${householdId}/prices`)
    expect(list.status).toBe(200)
    expect(list.body).toHaveLength(13)
    expect(list.body.find((p: { label: string }) => p.label === 'Pinto beans, 2 lb bag')).toMatchObject({ kind: 'ingredient', priceCents: 349 })
    expect((await helper.post(`/api/households/${householdId}/prices`, { kind: 'salt', label: 'Salt', packageGrams: 737, priceCents: 199 })).status).toBe(403)
  })

  it('lets the owner add, change and delete an item; only the fields of its kind are kept', async () => {
    const made = await owner.post(`/api/households/${householdId}/prices`, { kind: 'jar', label: 'Wide pints, 12', jarSizeId: 'pint-wide', packCount: 12, priceCents: 1799, ingredientId: 'pinto-beans' })
    expect(made.status).toBe(201)
    expect(made.body).toMatchObject({ kind: 'jar', jarSizeId: 'pint-wide', packCount: 12, priceCents: 1799, ingredientId: null })
    const changed = await owner.patch(`/api/households/${householdId}/prices/${made.body.id}`, { kind: 'lid', label: 'Wide lids, 24', mouth: 'wide', packCount: 24, priceCents: 0 })
    expect(changed.status).toBe(200)
    expect(changed.body).toMatchObject({ kind: 'lid', mouth: 'wide', jarSizeId: null, priceCents: 0 })
    expect((await stranger.delete(`/api/households/${strangerHouseholdId}/prices/${made.body.id}`)).status).toBe(404)
    expect((await owner.delete(`/api/households/${householdId}/prices/${made.body.id}`)).status).toBe(200)
    expect((await owner.get(`/api/households/${householdId}/prices`)).body).toHaveLength(13)
  })

  it('refuses bad price items with 400 naming the field', async () => {
    const negative = await owner.post(`/api/households/${householdId}/prices`, { kind: 'salt', label: 'Salt', packageGrams: 737, priceCents: -5 })
    expect(negative.status).toBe(400)
    expectField(negative, 'priceCents', /A price cannot be negative/)
    const noBean = await owner.post(`/api/households/${householdId}/prices`, { kind: 'ingredient', label: 'Mystery', ingredientId: 'moon-beans', packageGrams: 500, priceCents: 100 })
    expect(noBean.status).toBe(400)
    expectField(noBean, 'ingredientId')
    const kind = await owner.post(`/api/households/${householdId}/prices`, { kind: 'canner', label: 'x', priceCents: 1 })
    expectField(kind, 'kind')
  })

  it('lists every jar size with the demo counts and lets only the owner set a count', async () => {
    const stock = await helper.get(`/api/households/${householdId}/jar-stock`)
    expect(stock.status).toBe(200)
    expect(stock.body.find((s: { jarSizeId: string }) => s.jarSizeId === 'pint-regular').count).toBe(28)
    expect(stock.body.find((s: { jarSizeId: string }) => s.jarSizeId === 'half-gallon-wide').count).toBe(0)
    expect((await canner.request('PUT', `/api/households/${householdId}/jar-stock`, { jarSizeId: 'quart-wide', count: 4 })).status).toBe(403)
    const set = await owner.request('PUT', `/api/households/${householdId}/jar-stock`, { jarSizeId: 'quart-wide', count: 4 })
    expect(set.status).toBe(200)
    expect((await helper.get(`/api/households/${householdId}/jar-stock`)).body.find((s: { jarSizeId: string }) => s.jarSizeId === 'quart-wide').count).toBe(4)
    const bad = await owner.request('PUT', `/api/households/${householdId}/jar-stock`, { jarSizeId: 'quart-wide', count: 2.5 })
    expect(bad.status).toBe(400)
    expectField(bad, 'count')
    const unknown = await owner.request('PUT', `/api/households/${householdId}/jar-stock`, { jarSizeId: 'gallon-jug', count: 1 })
    expectField(unknown, 'jarSizeId')
    expect((await stranger.request('PUT', `/api/households/${householdId}/jar-stock`, { jarSizeId: 'quart-wide', count: 0 })).status).toBe(404)
  })
})
