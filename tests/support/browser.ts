import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { chromium, type Browser, type Locator, type Page } from 'playwright-core'

const artifactsDir = join('test-results', 'screenshots')

/** Debian's Chromium, quiet on a closed network. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(artifactsDir, { recursive: true })
  const path = join(artifactsDir, `${name}.png`)
  await page.screenshot({ path, fullPage: true })
  return path
}

export async function signIn(page: Page, base: string, email: string, password = 'put-up-2026') {
  // wait until the page's scripts have run, so the form is hydrated before it is filled
  await page.goto(`${base}/login`, { waitUntil: 'networkidle' })
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(url => !url.pathname.startsWith('/login'))
}

/** Wait (up to 10 s) for the locator to be visible; false if it never shows. */
export async function visible(locator: Locator, timeout = 10_000): Promise<boolean> {
  try {
    await locator.waitFor({ state: 'visible', timeout })
    return true
  }
  catch {
    return false
  }
}
