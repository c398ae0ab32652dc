/**
 * The shared library of tested recipes, kept by a site admin: add, correct, retire, restore.
 * Each change keeps its citation and is recorded with who and when; a saved plan that names the
 * recipe says what changed; a retired recipe is never planned again; non-admins change nothing.
 *
 * Published values: USDA Complete Guide to Home Canning (2015), Guide 4 "Beans or peas—shelled,
 * dried, all varieties" (shared/reference/canning-reference.md §1): pints 75 min, quarts 90 min;
 * weighted gauge 15 psi above 1,000 ft (Table 2); dial gauge 12 psi at 2,001–4,000 ft (Table 1).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'
import { joinByInvitation, newHousehold, type TestHousehold } from '../support/household'
import { libraryRecipe } from '../support/recipes'

let server: RunningServer
let H: TestHousehold
let admin: ApiClient
let helper: ApiClient
let recipeId: string
let planId: string
let houseRecipeId: string

const recipeOf = (client: ApiClient, id: string) => client.get(`/api/recipes/${id}?householdId=${H.id}`)
const quartMinutes = (r: { processMinutes: Array<{ jarKey: string, minutes: number }> }) => r.processMinutes.find(p => p.jarKey === 'quart')?.minutes
const preview = (id: string) => H.owner.post(H.api('/plans/preview'), { cannerId: H.cannerId, lines: [{ recipeId: id, jarSizeId: 'quart-regular', jars: 7 }] })

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_ADMIN_EMAIL: 'keeper@example.org' } })
  H = await newHousehold(server, { email: 'ines@example.org', password: 'cowpea-cellar-2026', name: 'Ines Farrow', householdName: 'Farrow larder' })
  helper = (await joinByInvitation(server, H, { email: 'tam@example.org', password: 'helper-tam-2026', name: 'Tam Farrow' }, 'helper')).client
  admin = new ApiClient(server.url)
  const reg = await admin.post('/api/auth/register', { email: 'keeper@example.org', password: 'library-keeper-2026', name: 'Wren Keeper', householdName: 'Keeper kitchen' })
  expect(reg.status).toBe(201)
  expect(reg.body.user.isAdmin).toBe(true)
})
afterAll(async () => { await server?.stop() })

describe('the shared library of tested recipes', () => {
  it('refuses a table that leaves an altitude without a pressure, naming the field, and adds nothing', async () => {
    const before = (await H.owner.get(`/api/recipes?householdId=${H.id}`)).body.length
    const gap = libraryRecipe({ pressureBands: [
      { gaugeType: 'weighted', minFt: 0, maxFt: 1000, psi: 10, source: 'CG Guide 4, Table 2' },
      { gaugeType: 'weighted', minFt: 1500, maxFt: null, psi: 15, source: 'CG Guide 4, Table 2' },
    ] })
    const res = await admin.post('/api/recipes', gap)
    expect(res.status).toBe(400)
    expectField(res, 'pressureBands.1.minFt', /must start at 1,001 ft/)
    const weights = await admin.post('/api/recipes', libraryRecipe({ pressureBands: [{ gaugeType: 'weighted', minFt: 0, maxFt: null, psi: 12, source: 'CG Guide 4, Table 2' }] }))
    expectField(weights, 'pressureBands.0.psi', /5, 10 or 15/)
    const noCitation = await admin.post('/api/recipes', libraryRecipe({ source: '' }))
    expectField(noCitation, 'source', /published source/)
    const noReason = await admin.post('/api/recipes', libraryRecipe({ reason: undefined }))
    expectField(noReason, 'reason', /what changed and why/i)
    expect((await H.owner.get(`/api/recipes?householdId=${H.id}`)).body.length).toBe(before)
  })

  it('lets a site admin add one, which every household can then plan with its published values', async () => {
    // The admin mistypes the quart time as 80 minutes (corrected below to the published 90).
    const body = libraryRecipe({ jars: libraryRecipe().jars.map(j => (j.sizeKey === 'quart' ? { ...j, processMinutes: 80 } : j)) })
    const res = await admin.post('/api/recipes', body)
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    recipeId = res.body.id
    const seen = await recipeOf(helper, recipeId)
    expect(seen.status).toBe(200)
    expect(seen.body).toMatchObject({ status: 'tested', householdId: null, source: expect.stringContaining('Guide 4') })
    expect(seen.body.history).toHaveLength(1)
    expect(seen.body.history[0]).toMatchObject({ what: expect.stringContaining('added to the shared library'), by: 'A site admin', source: expect.stringContaining('Guide 4') })
    // The admin sees who did it.
    expect((await admin.get(`/api/recipes/${recipeId}?householdId=${(await admin.get('/api/auth/me')).body.activeHouseholdId}`)).body.history[0].by).toBe('Wren Keeper')
    const planned = await preview(recipeId)
    expect(planned.status, JSON.stringify(planned.body)).toBe(200)
    // CG Guide 4 Table 2: weighted gauge above 1,000 ft (household at 2,500 ft) → 15 psi.
    expect(planned.body.loads[0].pressurePsi).toBe(15)
    expect(planned.body.loads[0].processMinutes).toBe(80)

    const saved = await H.owner.post(H.api('/plans'), { name: 'Cowpeas for the winter', request: { cannerId: H.cannerId, lines: [{ recipeId, jarSizeId: 'quart-regular', jars: 7 }] } })
    expect(saved.status, JSON.stringify(saved.body)).toBe(201)
    planId = saved.body.plan.id
    const house = await H.owner.post(H.api('/recipes'), {
      name: 'Our cowpeas, dry-packed', basedOnRecipeId: recipeId, ingredientId: 'black-eyed-peas', packStyle: 'dry',
      headspaceMm: 25.4, solidsFillFraction: 0.75, steps: 'Rinse, measure no more than the fill cap, top with boiling water.', jars: [{ sizeKey: 'quart', saltTsp: 0.5 }],
    })
    expect(house.status, JSON.stringify(house.body)).toBe(201)
    houseRecipeId = house.body.id
  })

  it('never lets a member change a shared recipe: 403, and the recipe reads as before', async () => {
    for (const client of [H.owner, helper]) {
      expect((await client.put(`/api/recipes/${recipeId}`, libraryRecipe({ name: 'Renamed by a member' }))).status).toBe(403)
      expect((await client.post(`/api/recipes/${recipeId}/retire`, { reason: 'A member tries to retire it.' })).status).toBe(403)
    }
    expect((await recipeOf(helper, recipeId)).body).toMatchObject({ name: 'Black-eyed peas, dried, hot pack', retiredAt: null })
  })

  it('records a correction with who, when and why, carries it to house recipes that borrow the table, and tells the saved plan', async () => {
    const res = await admin.put(`/api/recipes/${recipeId}`, libraryRecipe({ reason: 'Quart time corrected to the published 90 minutes (CG Guide 4).' }))
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.changes).toEqual([expect.stringMatching(/quart.*80 min.*→ 90 min/)])
    // CG Guide 4: quarts 90 minutes, now for the recipe and the house recipe borrowing its table.
    expect(quartMinutes((await recipeOf(helper, recipeId)).body)).toBe(90)
    expect(quartMinutes((await recipeOf(helper, houseRecipeId)).body)).toBe(90)
    const history = (await recipeOf(helper, recipeId)).body.history
    expect(history[0]).toMatchObject({ reason: expect.stringContaining('published 90 minutes'), source: expect.stringContaining('Guide 4') })
    expect(Date.parse(history[0].at)).toBeGreaterThanOrEqual(Date.parse(history[1].at))

    const plan = await H.owner.get(H.api(`/plans/${planId}`))
    expect(plan.status).toBe(200)
    expect(plan.body.referenceChanges).toEqual([expect.stringMatching(/80 min.*→ 90 min.*published 90 minutes/)])
    expect(plan.body.result.loads[0].processMinutes).toBe(90)

    // Saving the same recipe again changes nothing and records nothing.
    const again = await admin.put(`/api/recipes/${recipeId}`, libraryRecipe({ reason: 'Checked against the Guide again.' }))
    expect(again.body.changes).toEqual([])
    expect((await recipeOf(helper, recipeId)).body.history).toHaveLength(history.length)
  })

  it('retires a recipe: it and the house recipes borrowing from it are refused by the planner and say why; the plan still opens', async () => {
    const res = await admin.post(`/api/recipes/${recipeId}/retire`, { reason: 'Duplicates the dried beans entry' })
    expect(res.status).toBe(200)
    expect((await admin.post(`/api/recipes/${recipeId}/retire`, { reason: 'Twice by mistake.' })).status).toBe(409)

    const refused = await preview(recipeId)
    expect(refused.status).toBe(422)
    expectField(refused, 'lines.0.recipeId', /retired from the shared library on \d{4}-\d{2}-\d{2}: Duplicates the dried beans entry\./)
    const borrowed = await preview(houseRecipeId)
    expectField(borrowed, 'lines.0.recipeId', /borrows its time and pressure from Black-eyed peas.*retired/)
    const newHouse = await H.owner.post(H.api('/recipes'), {
      name: 'Another cowpea way', basedOnRecipeId: recipeId, ingredientId: 'black-eyed-peas', packStyle: 'dry',
      headspaceMm: 25.4, solidsFillFraction: 0.75, steps: 'Rinse and fill.', jars: [{ sizeKey: 'quart', saltTsp: 0 }],
    })
    expect(newHouse.status).toBe(422)
    expectField(newHouse, 'basedOnRecipeId', /retired/)

    const plan = await H.owner.get(H.api(`/plans/${planId}`))
    expect(plan.status).toBe(200)
    expect(plan.body.referenceChanges.some((c: string) => /in the library → retired \(Duplicates the dried beans entry\)/.test(c))).toBe(true)
    expect(plan.body.refusal.message).toMatch(/retired/)
    // Still readable in the Recipe book, marked retired.
    expect((await recipeOf(helper, recipeId)).body.retiredAt).not.toBeNull()
  })

  it('restores a retired recipe, after which it plans again', async () => {
    expect((await admin.post(`/api/recipes/${recipeId}/restore`, { reason: 'Kept: dried peas are listed separately in the Guide.' })).status).toBe(200)
    const planned = await preview(recipeId)
    expect(planned.status).toBe(200)
    // CG Guide 4: quarts 90 minutes.
    expect(planned.body.loads[0].processMinutes).toBe(90)
    const history = (await recipeOf(helper, recipeId)).body.history as Array<{ what: string }>
    expect(history[0]!.what).toMatch(/retired → in the library/)
  })

  it('refuses to edit a shared house recipe here: its table is borrowed', async () => {
    const res = await admin.put('/api/recipes/house-dry-pack-beans', libraryRecipe({ reason: 'Trying to give it its own table.' }))
    expect(res.status).toBe(422)
  })
})
