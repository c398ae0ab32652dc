import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'

let server: RunningServer

beforeAll(async () => { server = await startServer() })
afterAll(async () => { await server?.stop() })

describe('sign-in, households and roles', () => {
  it('health answers 200 with status ok once migrations are applied', async () => {
    const res = await fetch(`${server.url}/api/health`)
    expect(res.status).toBe(200)
    expect(await res.json()).toEqual({ status: 'ok' })
  })

  it('creates an account with its own household, the creator as owner', async () => {
    const api = new ApiClient(server.url)
    const res = await api.post('/api/auth/register', { email: 'Ada@Example.org', password: 'beans-and-more-beans', name: 'Ada', householdName: 'Ada kitchen' })
    expect(res.status).toBe(201)
    expect(res.body.user.email).toBe('ada@example.org')
    expect(res.body.households).toEqual([{ id: expect.any(String), name: 'Ada kitchen', role: 'owner' }])
    const me = await api.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.user.name).toBe('Ada')
  })

  it('refuses a second account with the same e-mail in any letter case', async () => {
    const api = new ApiClient(server.url)
    const res = await api.post('/api/auth/register', { email: 'ADA@example.org', password: 'another-password', name: 'Ada 2', householdName: 'Dup' })
    expect(res.status).toBe(409)
  })

  it('rejects a bad registration body with 400 naming the field', async () => {
    const api = new ApiClient(server.url)
    const res = await api.post('/api/auth/register', { email: 'not-an-email', password: 'short', name: '', householdName: 'x' })
    expect(res.status).toBe(400)
    expectField(res, 'email')
  })

  it('signs in with the demo owner password and signs out', async () => {
    const api = new ApiClient(server.url)
    const body = await api.login('owner@demo.shelfstead.test')
    expect(body.households[0]).toMatchObject({ name: 'Quillfeather Hollow Homestead', role: 'owner' })
    expect((await api.post('/api/auth/logout')).status).toBe(200)
    expect((await api.get('/api/auth/me')).status).toBe(401)
  })

  it('answers a wrong password and an unknown e-mail with the same vague 401', async () => {
    const api = new ApiClient(server.url)
    const wrong = await api.post('/api/auth/login', { email: 'owner@demo.shelfstead.test', password: 'nope-nope-nope' })
    const unknown = await api.post('/api/auth/login', { email: 'nobody@demo.shelfstead.test', password: 'nope-nope-nope' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.message).toBe(unknown.body.message)
    expect(wrong.body.message).not.toMatch(/password is wrong|no such user/i)
  })

  it('requires a session for household routes (401)', async () => {
    const owner = new ApiClient(server.url)
    const { households } = await owner.login('owner@demo.shelfstead.test')
    const anonymous = new ApiClient(server.url)
    expect((await anonymous.get(`/api/households/${households[0]!.id}`)).status).toBe(401)
  })

  it('refuses an owner-only change from a helper (403) and lets the owner make it', async () => {
    const helper = new ApiClient(server.url)
    const { households } = await helper.login('helper@demo.shelfstead.test')
    const id = households[0]!.id
    expect(households[0]!.role).toBe('helper')
    const refused = await helper.patch(`/api/households/${id}`, { altitudeFt: 100 })
    expect(refused.status).toBe(403)
    const owner = new ApiClient(server.url)
    await owner.login('owner@demo.shelfstead.test')
    const changed = await owner.patch(`/api/households/${id}`, { altitudeFt: 2400 })
    expect(changed.status).toBe(200)
    expect(changed.body.altitudeFt).toBe(2400)
    expect((await helper.get(`/api/households/${id}`)).body.altitudeFt).toBe(2400)
  })

  it('refuses an empty or malformed altitude, naming the field, and keeps the pressure the altitude needs', async () => {
    const owner = new ApiClient(server.url)
    const { households } = await owner.login('owner@demo.shelfstead.test')
    const id = households[0]!.id
    expect((await owner.patch(`/api/households/${id}`, { altitudeFt: 5000 })).status).toBe(200)
    // Each of these was once read as 0 ft (or "0x1F40" as 8,000 ft) and answered "Saved."
    for (const altitudeFt of ['', ' ', null, false, [], '0x1F40', '5000', {}]) {
      const res = await owner.patch(`/api/households/${id}`, { altitudeFt })
      expect(res.status, JSON.stringify(altitudeFt)).toBe(400)
      expect(res.body.data.field).toBe('altitudeFt')
      expect(res.body.message).toMatch(/altitude/i)
      expect(res.body.message).not.toMatch(/^altitudeFt:|Expected|Required/)
    }
    expect((await owner.get(`/api/households/${id}`)).body.altitudeFt).toBe(5000)
    // USDA Complete Guide, Guide 4, Table 2: a weighted gauge above 1,000 ft needs 15 psi (10 psi at 0 ft).
    const canners = (await owner.get(`/api/households/${id}/canners`)).body as Array<{ id: string, gaugeType: string }>
    const weighted = canners.find(c => c.gaugeType === 'weighted')!
    const plan = await owner.post(`/api/households/${id}/plans/preview`, { cannerId: weighted.id, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 7 }] })
    expect(plan.status).toBe(200)
    expect(plan.body.loads[0].pressurePsi).toBe(15)
    expect((await owner.patch(`/api/households/${id}`, { altitudeFt: 2350 })).status).toBe(200)
  })

  it('answers 404 for another household, never revealing it exists', async () => {
    const stranger = new ApiClient(server.url)
    await stranger.post('/api/auth/register', { email: 'stranger@example.org', password: 'a-long-password', name: 'Stranger', householdName: 'Elsewhere' })
    const owner = new ApiClient(server.url)
    const { households } = await owner.login('owner@demo.shelfstead.test')
    const res = await stranger.get(`/api/households/${households[0]!.id}`)
    expect(res.status).toBe(404)
    expect((await stranger.get(`/api/households/${households[0]!.id}/members`)).status).toBe(404)
  })

  it('lists the demo household members with their roles', async () => {
    const api = new ApiClient(server.url)
    const { households } = await api.login('canner@demo.shelfstead.test')
    const res = await api.get(`/api/households/${households[0]!.id}/members`)
    expect(res.status).toBe(200)
    expect(res.body.map((m: { role: string }) => m.role).sort()).toEqual(['canner', 'helper', 'owner'])
  })
})
