/**
 * The Canning day on a 360 × 800 phone in Debian's Chromium, with screenshots: two timers run at
 * once and survive a reload; the helper's device shows the same countdown; with the connection
 * gone the timers keep running, an action is kept and is sent when the connection is back, and
 * the page opens again from the service worker; nothing scrolls sideways; the printed Run sheet
 * takes at most two pages.
 */
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { launchBrowser, screenshot, signIn, visible } from '../support/browser'

let server: RunningServer
let browser: Browser
let ownerContext: BrowserContext
let owner: Page
let helper: Page
let planId: string
let api: ApiClient
let hid: string

const dayUrl = () => `${server.url}/plans/${planId}/day`
const sideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)
/** The countdowns on the page, in seconds left ("9:58" → 598). */
async function countdowns(page: Page): Promise<number[]> {
  const texts = await page.getByTestId('lane-countdown').allTextContents()
  return texts.map((t) => {
    const [m, s] = t.match(/(\d+):(\d{2})/)!.slice(1).map(Number)
    return m! * 60 + s!
  })
}

beforeAll(async () => {
  server = await startServer()
  browser = await launchBrowser()
  ownerContext = await browser.newContext({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 1 })
  owner = await ownerContext.newPage()
  helper = await (await browser.newContext({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 1 })).newPage()
  api = new ApiClient(server.url)
  await api.login('owner@demo.shelfstead.test')
  hid = (await api.get('/api/auth/me')).body.activeHouseholdId
  const canners = (await api.get(`/api/households/${hid}/canners`)).body as Array<{ id: string }>
  expect(canners.length).toBeGreaterThanOrEqual(2)
  const saved = await api.post(`/api/households/${hid}/plans`, {
    name: 'Two canners of pintos',
    request: { cannerIds: [canners[0]!.id, canners[1]!.id], lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 27 }] },
  })
  expect(saved.status).toBe(201)
  planId = saved.body.plan.id
})
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

describe('the Canning day on a phone', () => {
  it('starts the day and runs a vent timer on each canner at once', async () => {
    await signIn(owner, server.url, 'owner@demo.shelfstead.test')
    await owner.goto(dayUrl(), { waitUntil: 'networkidle' })
    expect(await sideways(owner)).toBe(0)
    await screenshot(owner, 'day-1-not-started')
    await owner.getByRole('button', { name: 'Start the canning day' }).click()
    for (const load of [1, 2]) {
      await owner.getByRole('button', { name: `Heat on for load ${load}` }).click()
      await owner.getByRole('button', { name: 'Steam is flowing: vent 10 minutes' }).first().click()
      await expect.poll(async () => (await countdowns(owner)).length).toBe(load)
    }
    const times = await countdowns(owner)
    expect(times).toHaveLength(2)
    // CG "Using pressure canners": vent 10 minutes.
    for (const t of times) expect(t).toBeLessThanOrEqual(600)
    expect(await owner.title()).toMatch(/^\d+:\d{2} · Load \d on /)
    expect(await sideways(owner)).toBe(0)
    await screenshot(owner, 'day-2-two-timers')
  })

  it('keeps both timers through a reload', async () => {
    const before = await countdowns(owner)
    await owner.reload({ waitUntil: 'networkidle' })
    await expect.poll(async () => (await countdowns(owner)).length).toBe(2)
    const after = await countdowns(owner)
    after.forEach((t, i) => {
      expect(t).toBeLessThanOrEqual(before[i]!)
      expect(before[i]! - t).toBeLessThan(20)
    })
  })

  it('shows the helper the same countdowns', async () => {
    await signIn(helper, server.url, 'helper@demo.shelfstead.test')
    await helper.goto(dayUrl(), { waitUntil: 'networkidle' })
    await expect.poll(async () => (await countdowns(helper)).length).toBe(2)
    const [mine, theirs] = await Promise.all([countdowns(owner), countdowns(helper)])
    theirs.forEach((t, i) => expect(Math.abs(t - mine[i]!)).toBeLessThanOrEqual(2))
    expect(await sideways(helper)).toBe(0)
    await screenshot(helper, 'day-3-helper-sees-the-same')
  })

  it('keeps counting offline, keeps an action and sends it when the connection is back', async () => {
    await ownerContext.setOffline(true)
    const first = await countdowns(owner)
    await owner.waitForTimeout(2500)
    const later = await countdowns(owner)
    later.forEach((t, i) => expect(t).toBeLessThan(first[i]!))
    // The soak, the first task of the kitchen, is started while offline.
    await owner.getByTestId('day-task').first().getByRole('button', { name: /^Start/ }).click()
    expect(await visible(owner.getByText(/1 action is kept here/))).toBe(true)
    await screenshot(owner, 'day-4-offline-action-kept')
    // It opens again from the service worker, with the kept action.
    await owner.reload({ waitUntil: 'load' })
    await expect.poll(async () => (await countdowns(owner)).length).toBe(2)
    expect(await visible(owner.getByText(/1 action is kept here/))).toBe(true)
    await ownerContext.setOffline(false)
    await expect.poll(async () => owner.getByText(/kept here|Sending/).count(), { timeout: 15_000 }).toBe(0)
    const day = (await api.get(`/api/households/${hid}/plans/${planId}/day`)).body
    expect(day.state.tasks[0].status).toBe('running')
    // The helper's device picks it up on its next read.
    await expect.poll(async () => helper.getByTestId('day-task').first().getByRole('button', { name: 'Done' }).count(), { timeout: 10_000 }).toBe(1)
  })

  it('prints the Run sheet on at most two pages', async () => {
    await ownerContext.setOffline(false) // whatever the test before left
    await owner.goto(`${server.url}/plans/${planId}/run`, { waitUntil: 'networkidle' })
    expect(await sideways(owner)).toBe(0)
    await screenshot(owner, 'day-5-run-sheet')
    await owner.emulateMedia({ media: 'print' })
    const pdf = await owner.pdf({ format: 'Letter' })
    // A page object in the PDF is "/Type /Page" (the page tree is "/Type /Pages").
    const pages = pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []
    expect(pages.length).toBeGreaterThanOrEqual(1)
    expect(pages.length).toBeLessThanOrEqual(2)
    const a4 = await owner.pdf({ format: 'A4' })
    expect((a4.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []).length).toBeLessThanOrEqual(2)
    await owner.emulateMedia({ media: 'screen' })
  })
})
