/**
 * The Canning day on the server: one state for the whole household, moved by any member's
 * device, checked against the published sequence (USDA Complete Guide, "Using pressure
 * canners": vent 10 min; time the process from the moment of pressure and again from the
 * beginning after a drop; cool naturally; wait 10 min with the weight off), and the Logbook
 * entry written from what happened. The test clock moves the server's time.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ApiClient, RunningServer } from '../support/server'
import { expectField, startServer } from '../support/server'
import { joinByInvitation, newHousehold, type TestHousehold } from '../support/household'

let server: RunningServer
let H: TestHousehold
let helper: ApiClient
let stranger: ApiClient
let planId: string
const MIN = 60_000

const day = (client: ApiClient = H.owner) => client.get(H.api(`/plans/${planId}/day`))
const act = (client: ApiClient, target: string, kind: string, extra: Record<string, unknown> = {}) =>
  client.post(H.api(`/plans/${planId}/day/events`), { clientId: crypto.randomUUID(), target, kind, ...extra })
/** Move the server's clock to `minutes` after the test's start. */
const clockAt = async (minutes: number) => expect((await H.owner.post('/api/dev/clock', { offsetMs: Math.round(minutes * MIN) })).status).toBe(200)
const loadState = (body: { state: { loads: Array<{ index: number }> } }, index: number) => body.state.loads.find(l => l.index === index) as Record<string, unknown>
const gap = (a: unknown, b: unknown) => (Date.parse(String(b)) - Date.parse(String(a))) / MIN

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_TEST_CLOCK: '1' } })
  H = await newHousehold(server, { email: 'noor@example.org', password: 'canning-day-2026', name: 'Noor Halvorsen', householdName: 'Halvorsen cellar' })
  helper = (await joinByInvitation(server, H, { email: 'eli@example.org', password: 'helper-eli-2026', name: 'Eli Halvorsen' }, 'helper')).client
  stranger = (await newHousehold(server, { email: 'other@example.org', password: 'other-cellar-2026', name: 'Oto Other', householdName: 'Other cellar' })).owner
  // 27 pints of the tested hot pack on two canners side by side.
  const saved = await H.owner.post(H.api('/plans'), {
    name: 'Saturday pintos',
    request: { cannerIds: [H.cannerId, H.dialCannerId], lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 27 }] },
  })
  expect(saved.status, JSON.stringify(saved.body)).toBe(201)
  planId = saved.body.plan.id
})
afterAll(async () => { await server?.stop() })

describe('the Canning day', () => {
  it('is not started until someone starts it; then every member sees the same frozen day', async () => {
    expect((await day()).body.started).toBe(false)
    const refused = await act(H.owner, 'load:1', 'start-heat')
    expect(refused.status).toBe(422)
    const started = await helper.post(H.api(`/plans/${planId}/day`))
    expect(started.status).toBe(200)
    expect(started.body.started).toBe(true)
    const { snapshot } = started.body
    expect(snapshot.loads.length).toBeGreaterThanOrEqual(2)
    expect(new Set(snapshot.loads.map((l: { cannerId: string }) => l.cannerId))).toEqual(new Set([H.cannerId, H.dialCannerId]))
    // CG Guide 4: soak 12–18 h (overnight by default), then boil 30 min, before the jars are filled.
    const soak = snapshot.tasks.find((t: { key: string }) => t.key.endsWith(':soak'))
    expect(soak.minutes).toBe(12 * 60)
    expect(snapshot.tasks.find((t: { key: string }) => t.key.endsWith(':cook')).minutes).toBe(30)
    expect(gap(soak.earliestStart, soak.plannedStart)).toBe(6 * 60)
    // Starting again changes nothing.
    expect((await H.owner.post(H.api(`/plans/${planId}/day`))).body.startedAt).toBe(started.body.startedAt)
  })

  it('shares each timer between the canner and the helper, and either moves it on', async () => {
    await clockAt(0)
    expect((await act(H.owner, 'load:1', 'start-heat')).status).toBe(200)
    await clockAt(14)
    const vent = await act(helper, 'load:1', 'start-vent')
    expect(vent.status).toBe(200)
    const seenByOwner = loadState((await day(H.owner)).body, 1)
    const seenByHelper = loadState((await day(helper)).body, 1)
    expect(seenByOwner).toEqual(seenByHelper)
    expect(seenByOwner.phase).toBe('vent')
    expect(gap((seenByOwner.timer as { startedAt: string }).startedAt, (seenByOwner.timer as { endsAt: string }).endsAt)).toBe(10)
    // A second timer runs at the same time on the other canner.
    const other = (await day()).body.snapshot.loads.find((l: { cannerId: string }) => l.cannerId === H.dialCannerId).index
    expect((await act(helper, `load:${other}`, 'start-heat')).status).toBe(200)
    expect(loadState((await day()).body, other).phase).toBe('heat')
    expect(loadState((await day()).body, 1).phase).toBe('vent')
  })

  it('refuses to cut the vent short and names the minutes left', async () => {
    await clockAt(20)
    const early = await act(H.owner, 'load:1', 'close-vent')
    expect(early.status).toBe(409)
    expect(early.body.message).toMatch(/4 more minutes of venting/)
    await clockAt(24)
    expect((await act(H.owner, 'load:1', 'close-vent')).status).toBe(200)
  })

  it('restarts the process timing after a pressure drop and writes the Logbook entry with the real times', async () => {
    await clockAt(29)
    expect((await act(H.owner, 'load:1', 'pressure-reached')).status).toBe(200)
    await clockAt(60)
    expect((await act(helper, 'load:1', 'pressure-dropped')).status).toBe(200)
    await clockAt(65)
    expect((await act(H.owner, 'load:1', 'pressure-reached')).status).toBe(200)
    await clockAt(104)
    const tooSoon = await act(H.owner, 'load:1', 'process-done')
    expect(tooSoon.status).toBe(409)
    // CG Guide 4: pints 75 min, timed from the second time the pressure was reached (65 + 75 = 140).
    expect(tooSoon.body.message).toMatch(/36 more minutes to process/)
    await clockAt(140)
    expect((await act(H.owner, 'load:1', 'process-done')).status).toBe(200)
    await clockAt(170)
    expect((await act(H.owner, 'load:1', 'at-zero')).status).toBe(200)
    await clockAt(180)
    expect((await act(H.owner, 'load:1', 'open')).status).toBe(200)
    await clockAt(183)
    const out = await act(H.owner, 'load:1', 'out')
    expect(out.status).toBe(200)
    const logged = out.body.logged.find((l: { index: number }) => l.index === 1)
    expect(logged).toMatchObject({ confirmed: false, shortfall: null })

    const load = (await H.owner.get(H.api(`/loads/${logged.loadId}`))).body
    expect(load).toMatchObject({ processMinutes: 75, confirmedAt: null, planId })
    expect(gap(load.startedAt, load.ventStartedAt)).toBeCloseTo(14, 1)
    expect(gap(load.startedAt, load.pressureReachedAt)).toBeCloseTo(29, 1)
    expect(gap(load.startedAt, load.processStartedAt)).toBeCloseTo(65, 1)
    expect(gap(load.startedAt, load.processEndedAt)).toBeCloseTo(140, 1)
    expect(gap(load.startedAt, load.endedAt)).toBeCloseTo(183, 1)
    expect(load.pressureDrops).toHaveLength(1)
    expect(gap(load.startedAt, load.pressureDrops[0])).toBeCloseTo(60, 1)
    // CG Guide 4 Table 2: weighted gauge above 1,000 ft (the household is at 2,500 ft) → 15 psi.
    expect(load.pressurePsi).toBe(15)

    // Out is final on the day: the Logbook entry is corrected in the Logbook.
    expect((await act(H.owner, 'load:1', 'undo')).status).toBe(409)
    // The canner confirms it; a helper may not.
    expect((await helper.patch(H.api(`/loads/${logged.loadId}`), { confirmed: true })).status).toBe(403)
    const confirmed = await H.owner.patch(H.api(`/loads/${logged.loadId}`), { confirmed: true })
    expect(confirmed.status).toBe(200)
    expect(confirmed.body.confirmedAt).not.toBeNull()
  })

  it('flags a load stopped short at once and lets the household refrigerate it without waiting for the seal check', async () => {
    const other = (await day()).body.snapshot.loads.find((l: { cannerId: string }) => l.cannerId === H.dialCannerId).index
    const t = `load:${other}`
    await clockAt(190)
    expect((await act(helper, t, 'start-vent')).status).toBe(200)
    await clockAt(200)
    expect((await act(helper, t, 'close-vent')).status).toBe(200)
    await clockAt(205)
    expect((await act(helper, t, 'pressure-reached')).status).toBe(200)
    await clockAt(235)
    expect((await act(helper, t, 'stop-early')).status).toBe(200)
    await clockAt(260)
    expect((await act(helper, t, 'at-zero')).status).toBe(200)
    await clockAt(270)
    expect((await act(helper, t, 'open')).status).toBe(200)
    await clockAt(272)
    const out = await act(helper, t, 'out')
    expect(out.status).toBe(200)
    const logged = out.body.logged.find((l: { index: number }) => l.index === other)
    // 30 of the published 75 minutes (CG Guide 4).
    expect(logged.shortfall.kind).toBe('under-processed')
    expect(logged.decided).toBe(false)
    const decided = await helper.post(H.api(`/loads/${logged.loadId}/decision`), { action: 'refrigerate' })
    expect(decided.status, JSON.stringify(decided.body)).toBe(200)
    expect((await day()).body.logged.find((l: { index: number }) => l.index === other).decided).toBe(true)
    expect((await helper.post(H.api(`/loads/${logged.loadId}/decision`), { action: 'reprocess' })).status).toBe(409)
    const checks = (await H.owner.get(H.api('/seal-checks'))).body
    expect(checks.fridge.some((f: { loadId: string }) => f.loadId === logged.loadId)).toBe(true)
  })

  it('stores an action sent twice once, and takes the time an offline device kept', async () => {
    const before = (await day()).body.events.length
    const task = (await day()).body.snapshot.tasks.find((x: { key: string }) => x.key.startsWith('fill:')).key
    const clientId = crypto.randomUUID()
    const now = Date.parse((await day()).body.now)
    const kept = new Date(now - 20 * MIN).toISOString()
    const first = await H.owner.post(H.api(`/plans/${planId}/day/events`), { clientId, target: task, kind: 'task-start', at: kept })
    expect(first.status).toBe(200)
    const again = await H.owner.post(H.api(`/plans/${planId}/day/events`), { clientId, target: task, kind: 'task-start', at: kept })
    expect(again.status).toBe(200)
    expect(again.body.events.length).toBe(before + 1)
    expect(again.body.state.tasks.find((x: { key: string }) => x.key === task).startedAt).toBe(kept)
    const future = await H.owner.post(H.api(`/plans/${planId}/day/events`), { clientId: crypto.randomUUID(), target: task, kind: 'task-done', at: new Date(now + 10 * MIN).toISOString() })
    expect(future.status).toBe(400)
    expectField(future, 'at', /later than now/)
  })

  it('exports the day as iCalendar (RFC 5545): every step, and each load\'s seal check 12–24 h after it came out', async () => {
    const res = await fetch(`${server.url}${H.api(`/plans/${planId}/calendar.ics`)}`, { headers: { cookie: H.owner.cookieHeader } })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/calendar/)
    const text = await res.text()
    expect(text.startsWith('BEGIN:VCALENDAR\r\nVERSION:2.0\r\n')).toBe(true)
    const events = text.split('BEGIN:VEVENT').slice(1)
    const { snapshot, state } = (await day()).body
    // One event per planned load step and kitchen task, plus one seal check per load.
    expect(events).toHaveLength(snapshot.planned.length + snapshot.tasks.length + snapshot.loads.length)
    const seal = events.find(e => e.includes('SUMMARY:Check the seals of load 1'))!
    const stamp = (field: string) => {
      const m = new RegExp(`${field}:(\\d{4})(\\d{2})(\\d{2})T(\\d{2})(\\d{2})(\\d{2})Z`).exec(seal)!
      return Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!, +m[4]!, +m[5]!, +m[6]!)
    }
    // USDA Complete Guide, "Cooling jars": check the seals 12 to 24 hours after the load came out.
    const out = Date.parse(state.loads.find((l: { index: number }) => l.index === 1).outAt)
    expect(stamp('DTSTART') - Math.floor(out / 1000) * 1000).toBe(12 * 60 * MIN)
    expect(stamp('DTEND') - stamp('DTSTART')).toBe(12 * 60 * MIN)
  })

  it('shows nothing of the day to another household', async () => {
    expect((await stranger.get(H.api(`/plans/${planId}/day`))).status).toBe(404)
    expect((await stranger.post(H.api(`/plans/${planId}/day/events`), { clientId: crypto.randomUUID(), target: 'load:1', kind: 'undo' })).status).toBe(404)
  })
})
