/**
 * After the canning day, in Debian's Chromium: log a load from a saved plan's Run sheet link,
 * record its seal check the next day (the server clock moved forward; USDA Complete Guide:
 * test seals 12–24 h after unloading), take two jars off the Shelf, print labels, and read the
 * Pantry board. Screenshots land in test-results/screenshots/after-*.png.
 */
import { existsSync } from 'node:fs'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { launchBrowser, screenshot, signIn, visible } from '../support/browser'

const H = 3_600_000
let server: RunningServer
let browser: Browser
let page: Page
let api: ApiClient
let hid: string
let planId: string
let tallId: string
let loadPath = ''

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_TEST_CLOCK: '1', SHELFSTEAD_REMINDER_INTERVAL_MS: '500' } })
  api = new ApiClient(server.url)
  hid = (await api.login('canner@demo.shelfstead.test')).households[0]!.id
  const canners = (await api.get(`/api/households/${hid}/canners`)).body as Array<{ id: string, name: string }>
  tallId = canners.find(c => c.name.startsWith('Tall'))!.id
  const saved = await api.post(`/api/households/${hid}/plans`, {
    name: 'Pintos for the spring',
    request: { cannerId: tallId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 18 }] },
  })
  expect(saved.status).toBe(201)
  planId = saved.body.plan.id
  browser = await launchBrowser()
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } })
  await signIn(page, server.url, 'canner@demo.shelfstead.test')
})
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

describe('after the canning day', () => {
  it('logs a load prefilled from the plan\'s load', async () => {
    await page.goto(`${server.url}/logbook/new?planId=${planId}&load=1`)
    expect(await visible(page.getByText('From your plan'))).toBe(true)
    // CG Guide 4 Table 2: weighted gauge above 1,000 ft (the demo kitchen is at 2,350 ft) → 15 psi; pints 75 min
    await expect.poll(() => page.getByLabel('Pressure held').inputValue()).toBe('15')
    expect(await page.getByLabel('Minutes at pressure').inputValue()).toBe('75')
    expect(await page.getByLabel('Canner', { exact: true }).inputValue()).toBe(tallId)
    expect(await page.getByLabel('Jars', { exact: true }).inputValue()).toBe('18')
    await screenshot(page, 'after-1-log-load-prefilled')
    await page.getByRole('button', { name: 'Save to the Logbook' }).click()
    await page.waitForURL(/\/logbook\/[0-9a-f-]{36}$/)
    loadPath = new URL(page.url()).pathname
    expect(await visible(page.getByRole('heading', { level: 1, name: 'Load L-009' }))).toBe(true)
    expect(await visible(page.getByText('Let the jars cool undisturbed'))).toBe(true)
    await screenshot(page, 'after-2-load-logged')
  })

  it('records the seal check the next day', async () => {
    const load = (await api.get(`/api/households/${hid}${loadPath.replace('/logbook', '/loads')}`)).body
    const hoursToEnd = (Date.parse(load.endedAt) - Date.now()) / H
    const moved = await api.post('/api/dev/clock', { offsetMs: Math.round((hoursToEnd + 14) * H) })
    expect(moved.status).toBe(200)
    await page.goto(server.url + loadPath)
    expect(await visible(page.getByRole('button', { name: 'Record the seal check' }))).toBe(true)
    await page.getByLabel('Sealed jars of 18').fill('17')
    await page.getByLabel(/What to do with the 1 unsealed/).selectOption('refrigerate')
    await screenshot(page, 'after-3-seal-check-form')
    await page.getByRole('button', { name: 'Record the seal check' }).click()
    expect(await visible(page.getByText('Seal check recorded'))).toBe(true)
    const after = (await api.get(`/api/households/${hid}${loadPath.replace('/logbook', '/loads')}`)).body
    expect(after.lines[0]).toMatchObject({ sealed: 17, unsealed: 1, unsealedAction: 'refrigerate' })
    await screenshot(page, 'after-4-seal-check-recorded')
  })

  it('takes two jars off the Shelf, oldest first, and can undo', async () => {
    const before = (await api.get(`/api/households/${hid}/shelf`)).body
    const oldest = before.lots[0]
    await page.goto(`${server.url}/shelf`)
    expect(await visible(page.getByRole('heading', { level: 1, name: 'Shelf' }))).toBe(true)
    await page.locator(`#take-${oldest.id}`).fill('2')
    await page.locator('tr', { has: page.locator(`#take-${oldest.id}`) }).getByRole('button', { name: 'Take off' }).click()
    expect(await visible(page.getByText(`Took 2 jars of ${oldest.product}`))).toBe(true)
    const after = (await api.get(`/api/households/${hid}/shelf`)).body
    expect(after.lots.find((l: { id: string }) => l.id === oldest.id)?.jarsLeft ?? 0).toBe(oldest.jarsLeft - 2)
    expect(after.totalJars).toBe(before.totalJars - 2)
    await screenshot(page, 'after-5-shelf-two-off')
  })

  it('prints labels for a label sheet', async () => {
    await page.goto(`${server.url}/shelf/labels`)
    expect(await visible(page.locator('.label').first())).toBe(true)
    const shelf = (await api.get(`/api/households/${hid}/shelf`)).body
    expect(await page.locator('.label').count()).toBe(Math.min(300, shelf.totalJars))
    await screenshot(page, 'after-6-labels-screen')
    await page.emulateMedia({ media: 'print' })
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false)
    // 30-up sheet: 2⅝ in wide labels at 96 px per inch
    const box = await page.locator('.label').first().boundingBox()
    expect(box!.width).toBeCloseTo(2.625 * 96, 0)
    expect(box!.height).toBeCloseTo(96, 0)
    expect(existsSync(await screenshot(page, 'after-7-labels-print'))).toBe(true)
    await page.emulateMedia({ media: 'screen' })
  })

  it('reads the Pantry board', async () => {
    await page.goto(`${server.url}/`)
    expect(await visible(page.getByRole('heading', { name: 'Seal checks due' }))).toBe(true)
    expect(await visible(page.getByRole('img', { name: /Jars on the shelf at each month's end/ }))).toBe(true)
    // The plan's one load is logged, so the plan is done and has left "Plans in progress".
    expect((await api.get(`/api/households/${hid}/plans/${planId}`)).body.plan.status).toBe('done')
    expect(await page.getByText('Pintos for the spring').count()).toBe(0)
    expect(await visible(page.getByText('Jars on the shelf', { exact: true }))).toBe(true)
    await screenshot(page, 'after-8-pantry-board')
    // the Logbook sorts on the server when a column header is pressed
    await page.goto(`${server.url}/logbook`)
    await page.getByRole('button', { name: 'Jars', exact: true }).click()
    await page.waitForURL(/sort=-?jars/)
    // The address changes first; the rows follow when the server's sorted page arrives.
    const jarCounts = async () => (await page.locator('tbody tr td:nth-child(4)').allTextContents()).map(t => Number(t.trim()))
    const inOrder = (counts: number[]) => {
      const asc = [...counts].sort((a, b) => a - b).join()
      return counts.length > 1 && (asc === counts.join() || asc === [...counts].reverse().join())
    }
    await expect.poll(async () => inOrder(await jarCounts()), { timeout: 10_000 }).toBe(true)
    const phone = await browser.newPage({ viewport: { width: 390, height: 844 } })
    await signIn(phone, server.url, 'helper@demo.shelfstead.test')
    const shelfHeading = await visible(phone.getByRole('heading', { name: 'On the shelf' }))
    await screenshot(phone, 'after-9-pantry-board-phone-helper')
    expect(shelfHeading).toBe(true)
    await phone.goto(`${server.url}/logbook`)
    expect(await visible(phone.getByRole('link', { name: 'L-009' }))).toBe(true)
    await screenshot(phone, 'after-10-logbook-phone')
    await phone.goto(`${server.url}/dev/outbox`)
    expect(await visible(phone.getByText(/Seal check due: load L-/).first())).toBe(true)
    await screenshot(phone, 'after-11-outbox-phone')
    await phone.close()
  })
})
