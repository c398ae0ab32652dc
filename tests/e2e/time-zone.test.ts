/**
 * One clock and the household's own time zone: the reminder e-mail, the Logbook's date filter
 * and the Logbook page read times in the household's zone, whatever zone the server or the
 * browser is in.
 *
 * Outside facts used: America/Denver keeps Mountain Standard Time, UTC−7 ("MST"), and Mountain
 * Daylight Time, UTC−6 ("MDT"), from 2:00 local time on the second Sunday of March to 2:00 on
 * the first Sunday of November (US Energy Policy Act of 2005, §110; IANA time zone database).
 * The expected wall clock is worked out here by that rule, not with the app's helpers.
 */
import { simpleParser } from 'mailparser'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchBrowser, screenshot, signIn, visible } from '../support/browser'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'

const H = 3_600_000
const ZONE = 'America/Denver'
const EMAIL = 'ilse@example.org'
const PASSWORD = 'tepary-beans-2026'

let server: RunningServer
let client: ApiClient
let hid: string
let cannerId: string

/** The nth Sunday of a month (0-based month), as a UTC date. */
function nthSunday(year: number, month: number, n: number): number {
  const first = new Date(Date.UTC(year, month, 1)).getUTCDay()
  return 1 + ((7 - first) % 7) + (n - 1) * 7
}
/** Denver's offset from UTC at an instant, in hours, by the US daylight-saving rule. */
function denverOffset(at: Date): -6 | -7 {
  const year = at.getUTCFullYear()
  // 2:00 MST on the second Sunday of March is 09:00 UTC; 2:00 MDT on the first Sunday of November is 08:00 UTC.
  const starts = Date.UTC(year, 2, nthSunday(year, 2, 2), 9)
  const ends = Date.UTC(year, 10, nthSunday(year, 10, 1), 8)
  return at.getTime() >= starts && at.getTime() < ends ? -6 : -7
}
/** "7:00 PM MST" for Denver's wall clock of a whole-hour UTC instant. */
function denverClock(at: Date): string {
  const offset = denverOffset(at)
  const hour = (at.getUTCHours() + 24 + offset) % 24
  return `${hour % 12 === 0 ? 12 : hour % 12}:00 ${hour < 12 ? 'AM' : 'PM'} ${offset === -6 ? 'MDT' : 'MST'}`
}
/** Denver's calendar date of an instant. */
const denverDate = (at: Date) => new Date(at.getTime() + denverOffset(at) * H).toISOString().slice(0, 10)
const wholeHour = (ms: number) => new Date(Math.floor(ms / H) * H)

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_TEST_CLOCK: '1', SHELFSTEAD_REMINDER_INTERVAL_MS: '250', TZ: 'Asia/Tokyo' } })
  client = new ApiClient(server.url)
  const bad = await new ApiClient(server.url).post('/api/auth/register', { email: 'nowhere@example.org', password: PASSWORD, name: 'N', householdName: 'N', timeZone: 'Atlantis/Central' })
  expect(bad.status).toBe(400)
  expectField(bad, 'timeZone', /time zone/)
  const reg = await client.post('/api/auth/register', { email: EMAIL, password: PASSWORD, name: 'Ilse Marchetti', householdName: 'Marchetti mesa kitchen', timeZone: ZONE })
  expect(reg.status).toBe(201)
  hid = reg.body.households[0].id
  // A mesa kitchen at 6,000 ft: a weighted gauge needs 15 psi above 1,000 ft (USDA CG Guide 4, Table 2).
  expect((await client.patch(`/api/households/${hid}`, { altitudeFt: 6000 })).status).toBe(200)
  const canner = await client.post(`/api/households/${hid}/canners`, { name: 'Weighted canner', innerDiameterMm: 310, usableHeightMm: 330, rackThicknessMm: 6, gaugeType: 'weighted', maxLayers: 2, waterDepthMm: 76 })
  expect(canner.status).toBe(201)
  cannerId = canner.body.id
}, 180_000)

afterAll(async () => {
  await server?.stop()
})

const logLoad = (startedAt: Date, endedAt: Date) => client.post(`/api/households/${hid}/loads`, {
  cannerId,
  lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 7, product: 'Tepary beans, hot pack' }],
  pressurePsi: 15, processMinutes: 75, startedAt: startedAt.toISOString(), endedAt: endedAt.toISOString(),
})

describe('the household time zone', () => {
  it('is kept from sign-up, refused when unknown (naming the field), and changes nothing when refused', async () => {
    expect((await client.get(`/api/households/${hid}`)).body.timeZone).toBe(ZONE)
    const bad = await client.patch(`/api/households/${hid}`, { timeZone: 'Mars/Olympus_Mons' })
    expect(bad.status).toBe(400)
    expectField(bad, 'timeZone', /time zone/)
    expect((await client.get(`/api/households/${hid}`)).body.timeZone).toBe(ZONE)
  })

  it('the household answer carries the server clock, which the test clock moves', async () => {
    const before = Date.parse((await client.get(`/api/households/${hid}`)).body.now)
    expect(Math.abs(before - Date.now())).toBeLessThan(60_000)
    expect((await client.post('/api/dev/clock', { offsetMs: 5 * H })).status).toBe(200)
    const moved = Date.parse((await client.get(`/api/households/${hid}`)).body.now)
    expect(moved - Date.now()).toBeGreaterThan(5 * H - 60_000)
    expect((await client.post('/api/dev/clock', { offsetMs: 0 })).status).toBe(200)
  })

  it('filters the Logbook by the household\'s calendar date, not the server\'s', async () => {
    // 03:00 UTC two days ago is 20:00 or 21:00 the evening before in Denver.
    const day = new Date(Date.now() - 48 * H).toISOString().slice(0, 10)
    const startedAt = new Date(`${day}T03:00:00Z`)
    const load = await logLoad(startedAt, new Date(startedAt.getTime() + 2 * H))
    expect(load.status).toBe(201)
    const local = denverDate(startedAt)
    expect(local).not.toBe(day)
    const onLocalDay = await client.get(`/api/households/${hid}/loads?from=${local}&to=${local}`)
    expect(onLocalDay.body.rows.map((r: { id: string }) => r.id)).toContain(load.body.id)
    const onUtcDay = await client.get(`/api/households/${hid}/loads?from=${day}&to=${day}`)
    expect(onUtcDay.body.rows.map((r: { id: string }) => r.id)).not.toContain(load.body.id)
  })

  it('writes the seal-check reminder in the household\'s time, with its zone', async () => {
    const endedAt = wholeHour(Date.now() - 13 * H)
    const load = await logLoad(new Date(endedAt.getTime() - 2 * H), endedAt)
    expect(load.status).toBe(201)
    let reminder: { text: string } | undefined
    for (let i = 0; i < 75 && !reminder; i++) {
      const box = (await client.get('/api/dev/outbox')).body as Array<{ to: string[], subject: string, raw: string }>
      const found = box.find(m => m.to.includes(EMAIL) && m.subject.includes(load.body.code))
      if (found) reminder = { text: (await simpleParser(found.raw)).text ?? '' }
      else await new Promise(r => setTimeout(r, 200))
    }
    expect(reminder, 'a reminder e-mail').toBeDefined()
    expect(reminder!.text).toContain(denverClock(endedAt))
  })

  it('shows the Logbook in the household\'s time in a browser set to another zone', async () => {
    const startedAt = wholeHour(Date.now() - 30 * H)
    const load = await logLoad(startedAt, new Date(startedAt.getTime() + 2 * H))
    expect(load.status).toBe(201)
    const browser = await launchBrowser()
    try {
      const context = await browser.newContext({ timezoneId: 'Europe/Lisbon', viewport: { width: 360, height: 800 } })
      const page = await context.newPage()
      await signIn(page, server.url, EMAIL, PASSWORD)
      await page.goto(`${server.url}/logbook/${load.body.id}`, { waitUntil: 'networkidle' })
      await page.getByText(denverClock(startedAt).replace(/ M[SD]T$/, '')).first().waitFor()
      await screenshot(page, 'time-zone-logbook-phone')
      await page.goto(`${server.url}/logbook/new`, { waitUntil: 'networkidle' })
      expect(await visible(page.getByText(`Your household's time (${ZONE})`))).toBe(true)
    }
    finally {
      await browser.close()
    }
  })
})
