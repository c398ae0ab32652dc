/**
 * The owner downloads the household's backup from the Household page on a 360 px phone, in
 * Debian's Chromium; a helper is not offered it.
 */
import { readFileSync } from 'node:fs'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer, type RunningServer } from '../support/server'
import { launchBrowser, signIn, visible } from '../support/browser'

let server: RunningServer
let browser: Browser

async function phone(): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 360, height: 780 }, deviceScaleFactor: 1, acceptDownloads: true })
  return context.newPage()
}

beforeAll(async () => {
  server = await startServer({ env: { DATABASE_URL: '' } })
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

describe('Download a backup', () => {
  it('gives the owner the household in one file, from a button that fits the phone', async () => {
    const page = await phone()
    await signIn(page, server.url, 'owner@demo.shelfstead.test')
    await page.goto(`${server.url}/household`, { waitUntil: 'networkidle' })
    const link = page.getByRole('link', { name: 'Download a backup' })
    expect(await visible(link)).toBe(true)
    const box = (await link.boundingBox())!
    expect(box.x).toBeGreaterThanOrEqual(0)
    expect(box.x + box.width).toBeLessThanOrEqual(360)
    expect(box.height).toBeGreaterThanOrEqual(44)
    expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBe(0)
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()])
    expect(download.suggestedFilename()).toMatch(/^shelfstead-backup-quillfeather-hollow-homestead-\d{4}-\d\d-\d\d\.json$/)
    const file = JSON.parse(readFileSync((await download.path())!, 'utf8'))
    expect(file.format).toBe('shelfstead-household-backup')
    expect(file.household.name).toBe('Quillfeather Hollow Homestead')
    expect(file.tables.canning_loads.length).toBeGreaterThan(0)
  })

  it('is not offered to a helper', async () => {
    const page = await phone()
    await signIn(page, server.url, 'helper@demo.shelfstead.test')
    await page.goto(`${server.url}/household`, { waitUntil: 'networkidle' })
    expect(await visible(page.getByRole('heading', { name: 'Your sign-ins' }))).toBe(true)
    expect(await page.getByRole('link', { name: 'Download a backup' }).count()).toBe(0)
  })
})
