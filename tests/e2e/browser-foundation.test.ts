import { existsSync } from 'node:fs'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer, type RunningServer } from '../support/server'
import { launchBrowser, screenshot, signIn, visible } from '../support/browser'

let server: RunningServer
let browser: Browser

beforeAll(async () => {
  server = await startServer()
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

describe('first visit in Chromium', () => {
  it('creates an account, lands on the Pantry board, signs out, and signs in as the demo helper', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } })
    await page.goto(`${server.url}/`)
    await page.waitForURL(/\/login/)
    await page.getByRole('link', { name: 'Create an account' }).click()
    await page.waitForURL(/\/register/)

    await page.getByLabel('Your name').fill('Ilse Brandvold')
    await page.getByLabel('Household name').fill('Brandvold pantry')
    await page.getByLabel('E-mail').fill('ilse@example.org')
    await page.getByLabel('Password').fill('lentil-season-9')
    await page.getByRole('button', { name: 'Create account' }).click()

    await page.waitForURL(`${server.url}/`)
    expect(await visible(page.getByRole('heading', { level: 1, name: 'Pantry board' }))).toBe(true)
    expect(await visible(page.getByText('Brandvold pantry').first())).toBe(true)
    expect(existsSync(await screenshot(page, 'foundation-1-pantry-board-new-account'))).toBe(true)

    // a new household has no canner yet: the planner says what to do instead of spinning
    await page.goto(`${server.url}/plan`)
    expect(await visible(page.getByRole('heading', { name: 'No canner yet' }))).toBe(true)
    expect(await page.getByRole('link', { name: 'Add a canner' }).getAttribute('href')).toBe('/household')

    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.waitForURL(/\/login/)

    await signIn(page, server.url, 'helper@demo.shelfstead.test')
    expect(await visible(page.getByText('Quillfeather Hollow Homestead').first())).toBe(true)
    expect(await visible(page.getByText('Wren Okafor'))).toBe(true)
    // a helper may not start a plan: the server would refuse, so the button is not offered
    expect(await page.getByRole('link', { name: 'Plan a canning day' }).count()).toBe(0)
    await screenshot(page, 'foundation-2-pantry-board-helper')
  })

  it('shows a wrong password as a message on the sign-in form, not an error page', async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } })
    await page.goto(`${server.url}/login`)
    await page.getByLabel('E-mail').fill('owner@demo.shelfstead.test')
    await page.getByLabel('Password').fill('not-the-password')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect(page.getByRole('alert').textContent()).resolves.toMatch(/do not match an account/)
    expect(new URL(page.url()).pathname).toBe('/login')
    await screenshot(page, 'foundation-3-wrong-password-phone')
  })
})
