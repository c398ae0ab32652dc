/**
 * The household brings in a helper, in Debian's Chromium on a 360 px phone: the owner invites
 * by e-mail, the helper opens the link from their Outbox and joins, checks off a Market list item
 * and takes a jar off the Shelf, and the owner sees both in the activity record.
 */
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { launchBrowser, screenshot, signIn, visible } from '../support/browser'

let server: RunningServer
let browser: Browser
let owner: Page
let helper: Page
const HELPER = { email: 'rosalind@example.org', password: 'garbanzo-gardens-2026', name: 'Rosalind Achebe' }

async function phone(): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 360, height: 780 }, deviceScaleFactor: 1 })
  return context.newPage()
}
const sideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)

beforeAll(async () => {
  server = await startServer()
  browser = await launchBrowser()
  owner = await phone()
  helper = await phone()
  // The demo household has no saved plan yet: the owner saves one to shop for.
  const api = new ApiClient(server.url)
  await api.login('owner@demo.shelfstead.test')
  const hid = (await api.get('/api/auth/me')).body.activeHouseholdId
  const canners = (await api.get(`/api/households/${hid}/canners`)).body as Array<{ id: string }>
  const saved = await api.post(`/api/households/${hid}/plans`, { name: 'Pintos for the winter', request: { cannerId: canners[0]!.id, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 9 }] } })
  expect(saved.status).toBe(201)
})
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

describe('a helper joins the household by e-mail', () => {
  it('the owner invites the helper from the Household page', async () => {
    await signIn(owner, server.url, 'owner@demo.shelfstead.test')
    await owner.goto(`${server.url}/household`, { waitUntil: 'networkidle' })
    await owner.getByLabel('E-mail address').fill(HELPER.email)
    await owner.getByLabel('Role', { exact: true }).selectOption('helper')
    await owner.getByRole('button', { name: 'Send invitation' }).click()
    expect(await visible(owner.getByText(`Invitation sent to ${HELPER.email}.`))).toBe(true)
    expect(await visible(owner.getByText(HELPER.email, { exact: true }))).toBe(true)
    expect(await sideways(owner)).toBe(0)
    await screenshot(owner, 'household-1-owner-invites')
  })

  it('the helper, signed in to an account of their own, opens the link in the Outbox and joins', async () => {
    await helper.goto(`${server.url}/register`, { waitUntil: 'networkidle' })
    await helper.getByLabel('Your name').fill(HELPER.name)
    await helper.getByLabel('Household name').fill('Achebe kitchen')
    await helper.getByLabel('E-mail').fill(HELPER.email)
    await helper.getByLabel('Password').fill(HELPER.password)
    await helper.getByRole('button', { name: 'Create account' }).click()
    await helper.waitForURL(url => url.pathname === '/')
    await helper.goto(`${server.url}/dev/outbox`, { waitUntil: 'networkidle' })
    // only the helper's own mail: the demo household's reminders are not shown
    expect(await helper.getByText(/^To /).count()).toBe(1)
    await helper.getByRole('button', { name: /Join Quillfeather Hollow Homestead/ }).click()
    await screenshot(helper, 'household-2-helper-outbox')
    await helper.getByRole('link', { name: /\/invite\// }).click()
    await helper.waitForURL(/\/invite\//)
    expect(await visible(helper.getByText('invites', { exact: false }))).toBe(true)
    expect(await sideways(helper)).toBe(0)
    await screenshot(helper, 'household-3-helper-invitation')
    await helper.getByRole('button', { name: /^Join Quillfeather Hollow Homestead/ }).click()
    await helper.waitForURL(url => url.pathname === '/')
    expect(await visible(helper.getByRole('heading', { level: 1, name: 'Pantry board' }))).toBe(true)
    await screenshot(helper, 'household-3b-helper-joined')
    expect(await visible(helper.getByText('What Quillfeather Hollow Homestead has put up', { exact: false }))).toBe(true)
  })

  it('the helper checks off a Market list item and takes a jar off the Shelf', async () => {
    await helper.goto(`${server.url}/plans`, { waitUntil: 'networkidle' })
    await helper.locator('main a[href^="/plans/"]').first().click()
    const boxes = helper.getByRole('checkbox', { name: /^Got / })
    await boxes.first().waitFor()
    await boxes.first().check()
    await helper.getByText('checked by Rosalind Achebe').first().waitFor()
    await screenshot(helper, 'household-4-helper-market')

    await helper.goto(`${server.url}/shelf`, { waitUntil: 'networkidle' })
    const takeId = await helper.locator('input[id^="take-"]').first().getAttribute('id')
    await helper.locator(`#${takeId}`).fill('1')
    await helper.locator('tr', { has: helper.locator(`#${takeId}`) }).getByRole('button', { name: 'Take off' }).click()
    expect(await visible(helper.getByText(/^Took 1 jar/))).toBe(true)
    await screenshot(helper, 'household-5-helper-shelf')
  })

  it('the owner sees both in the activity record, newest first', async () => {
    await owner.goto(`${server.url}/household`, { waitUntil: 'networkidle' })
    const activity = owner.locator('main')
    expect(await visible(activity.getByText(/Rosalind Achebe: Took 1 jar off the Shelf/))).toBe(true)
    expect(await visible(activity.getByText(/Rosalind Achebe: Checked off .* on the Market list/))).toBe(true)
    expect(await visible(activity.getByText('Rosalind Achebe: Joined as helper'))).toBe(true)
    const api = new ApiClient(server.url)
    await api.login('owner@demo.shelfstead.test')
    const hid = (await api.get('/api/auth/me')).body.activeHouseholdId
    const items = (await api.get(`/api/households/${hid}/activity`)).body.items as Array<{ summary: string, by: string }>
    expect(items[0]).toMatchObject({ by: 'Rosalind Achebe' })
    expect(items[0]!.summary).toMatch(/^Took 1 jar off the Shelf/)
    await owner.getByRole('heading', { name: 'Activity' }).scrollIntoViewIfNeeded()
    await screenshot(owner, 'household-6-owner-activity')
  })
})
