/**
 * The season on a phone (360 × 800): the Market list page checked off in the shop, an item marked
 * as at home leaving the total, and a Logbook entry corrected from its page.
 */
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { ago } from '../support/household'
import { launchBrowser, screenshot, signIn } from '../support/browser'

let server: RunningServer
let browser: Browser
let page: Page
const api = new ApiClient('')
let hid: string
let planId: string
let loadId: string
const money = (text: string) => Number(text.replace(/[^0-9.]/g, ''))

beforeAll(async () => {
  server = await startServer()
  Object.assign(api, new ApiClient(server.url))
  hid = (await api.login('canner@demo.shelfstead.test')).households[0]!.id
  const canner = ((await api.get(`/api/households/${hid}/canners`)).body as Array<{ id: string }>)[0]!.id
  const plan = await api.post(`/api/households/${hid}/plans`, { name: 'Pintos for the pantry', request: { cannerId: canner, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 18 }] } })
  expect(plan.status).toBe(201)
  planId = plan.body.plan.id
  const load = await api.post(`/api/households/${hid}/loads`, { cannerId: canner, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 7, product: 'Pinto beans, hot pack' }], pressurePsi: 15, processMinutes: 75, startedAt: ago(4), endedAt: ago(2) })
  expect(load.status).toBe(201)
  loadId = load.body.id
  browser = await launchBrowser()
  page = await browser.newPage({ viewport: { width: 360, height: 800 } })
  await signIn(page, server.url, 'canner@demo.shelfstead.test')
})
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

describe('the season on a phone', () => {
  it('the Market list: a tick checks an item off for everyone; "Have it at home" takes it out of the total', async () => {
    await page.goto(`${server.url}/plans/${planId}/market`, { waitUntil: 'networkidle' })
    const total = page.getByTestId('market-total')
    const before = money((await total.locator('span').nth(1).textContent()) ?? '')
    const salt = page.getByTestId('market-row').filter({ hasText: 'Canning salt' })
    const saltCost = money((await salt.locator('p.font-bold').nth(1).textContent()) ?? '')
    expect(saltCost).toBeGreaterThan(0)
    await salt.getByRole('button', { name: 'Have it at home' }).click()
    await expect.poll(async () => money((await total.locator('span').nth(1).textContent()) ?? '')).toBeCloseTo(before - saltCost, 2)
    const lids = page.getByTestId('market-row').filter({ hasText: 'Lids' })
    await lids.getByRole('checkbox').check()
    await expect.poll(async () => (await api.get(`/api/households/${hid}/plans/${planId}/market`)).body.map((c: { itemKey: string, state: string }) => c.state).sort()).toEqual(['at-home', 'bought'])
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360)
    await screenshot(page, 'season-1-market-list-phone')
  })

  it('the Market list prints as the list alone, on one page', async () => {
    const desk = await browser.newPage({ viewport: { width: 1280, height: 900 } })
    await signIn(desk, server.url, 'canner@demo.shelfstead.test')
    await desk.goto(`${server.url}/plans/${planId}/market`, { waitUntil: 'networkidle' })
    await desk.emulateMedia({ media: 'print' })
    // Nothing but the list and its total: no navigation, buttons or the e-mail form.
    expect(await desk.getByRole('button', { name: 'Send the list' }).isVisible()).toBe(false)
    expect(await desk.getByRole('navigation').first().isVisible().catch(() => false)).toBe(false)
    const text = (await desk.pdf({ format: 'Letter', printBackground: true })).toString('latin1')
    // Chromium writes its page objects uncompressed.
    expect((text.match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length).toBe(1)
    await desk.close()
  })

  it('a Logbook entry opens for correction with its own values, and the correction is kept', async () => {
    await page.goto(`${server.url}/logbook/${loadId}`, { waitUntil: 'networkidle' })
    await page.getByRole('button', { name: 'Correct this entry…' }).click()
    // The inputs hold the load's times as logged, in the household's time zone.
    expect(await page.locator('input[name="correctStartedAt"]').inputValue()).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/)
    expect(await page.locator('input[name="correctEndedAt"]').inputValue()).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/)
    expect(await page.locator('input[name="correctMinutes"]').inputValue()).toBe('75')
    await page.locator('input[name="correctMinutes"]').fill('80')
    await page.locator('input[name="correctJars0"]').fill('6')
    await page.getByRole('button', { name: 'Save the correction' }).click()
    await page.getByText('Corrected; the change is in the activity record.').waitFor()
    const load = (await api.get(`/api/households/${hid}/loads/${loadId}`)).body
    expect(load.processMinutes).toBe(80)
    expect(load.lines[0].jars).toBe(6)
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360)
    await screenshot(page, 'season-2-logbook-correction-phone')
  })
})
