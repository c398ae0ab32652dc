import type { Browser, Page } from 'playwright-core'
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

/** The cell texts of one table row, trimmed, whitespace collapsed. */
async function rowText(page: Page, selector: string): Promise<string> {
  return (await page.locator(selector).first().innerText()).replace(/\s+/g, ' ').trim()
}

describe('Recipe book and Household in Chromium', () => {
  it('a canner reads the published dried-beans table and adds a house recipe that carries the untested caution', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } })
    await signIn(page, server.url, 'canner@demo.shelfstead.test')
    await page.getByRole('link', { name: 'Recipe book' }).first().click()
    await page.waitForURL(/\/recipes$/)
    expect(await visible(page.getByRole('heading', { level: 1, name: 'Recipe book' }))).toBe(true)
    expect(await visible(page.getByRole('heading', { name: 'Dry-packed beans (no soak)' }))).toBe(true)
    await screenshot(page, 'recipes-1-book-canner')

    await page.getByRole('link', { name: 'Open Dried beans or peas, hot pack' }).click()
    await page.waitForURL(/\/recipes\/usda-dried-beans-hot-pack$/)
    expect(await visible(page.getByRole('heading', { level: 1, name: 'Dried beans or peas, hot pack' }))).toBe(true)
    // USDA Complete Guide to Home Canning, Guide 4, dried beans hot pack: pints 75 min, quarts 90 min.
    expect(await rowText(page, '[data-jar="pint"]')).toBe('Pint jars 75 min')
    expect(await rowText(page, '[data-jar="quart"]')).toBe('Quart jars 90 min')
    // CG Guide 4, Table 1 (dial gauge): 11 / 12 / 13 / 14 psi for 0–2,000 / … / 6,001–8,000 ft.
    const dialRows = await page.locator('[data-gauge="dial"] tbody tr').allInnerTexts()
    expect(dialRows.map(t => t.replace(/\s+/g, ' ').trim())).toEqual([
      '0–2,000 ft 11 psi',
      '2,001–4,000 ft Your kitchen 12 psi',
      '4,001–6,000 ft 13 psi',
      '6,001–8,000 ft 14 psi',
    ])
    // CG Guide 4, Table 2 (weighted gauge): 10 psi at 0–1,000 ft, 15 psi above 1,000 ft.
    expect(await rowText(page, '[data-gauge="weighted"] tbody tr:last-child')).toBe('above 1,000 ft Your kitchen 15 psi')
    expect(await page.getByText('Rule of thumb: 1 cup dry makes about 3 cups cooked', { exact: false }).count()).toBeGreaterThan(0)
    await screenshot(page, 'recipes-2-dried-beans')

    await page.goto(`${server.url}/recipes/new`)
    expect(await visible(page.getByLabel('Name', { exact: true }))).toBe(true)
    await page.getByLabel('Name', { exact: true }).fill('Dry-packed pintos, our way')
    await page.getByLabel('Bean', { exact: true }).selectOption({ label: 'Pinto beans' })
    await page.getByLabel('Steps', { exact: true }).fill('Rinse the beans, measure no more than the fill cap into each hot jar, top with boiling water.')
    await page.getByLabel('Your note for the caution').fill('We soak nothing; the beans hydrate in the canner.')
    await page.getByLabel('Borrow time and pressure from').selectOption({ label: 'Dried beans or peas, hot pack' })
    // The dried-beans table stops at quarts: half-gallon jars cannot be chosen.
    expect(await page.getByLabel('Half-gallon jars').isDisabled()).toBe(true)
    await page.getByLabel('Pint jars', { exact: true }).check()
    await page.getByLabel('Salt per pint').fill('0.25')
    await screenshot(page, 'recipes-3-new-house-recipe')
    await page.getByRole('button', { name: 'Save house recipe' }).click()

    await page.waitForURL(/\/recipes\/house-/)
    expect(await visible(page.getByRole('heading', { level: 1, name: 'Dry-packed pintos, our way' }))).toBe(true)
    const caution = page.getByRole('note').filter({ hasText: 'Untested — your own risk' }).first()
    expect(await visible(caution)).toBe(true)
    expect(await caution.textContent()).toContain('We soak nothing; the beans hydrate in the canner.')
    expect(await rowText(page, '[data-jar="pint"]')).toBe('Pint jars 75 min')
    await screenshot(page, 'recipes-4-house-recipe')

    // Editing keeps the choices made, and a new basis brings its own table (CG Guide 4, beans in sauce: pints 65 min).
    await page.getByRole('link', { name: 'Edit' }).click()
    await page.waitForURL(/\/edit$/)
    expect(await page.getByLabel('Pint jars', { exact: true }).isChecked()).toBe(true)
    expect(await page.getByLabel('Salt per pint').inputValue()).toBe('0.25')
    await page.getByLabel('Borrow time and pressure from').selectOption({ label: 'Dried beans with tomato or molasses sauce' })
    await page.getByRole('button', { name: 'Save changes' }).click()
    await page.waitForURL(/\/recipes\/house-[^/]+$/)
    await page.getByText('Time and pressure borrowed from the tested recipe Dried beans with tomato or molasses sauce').waitFor()
    expect(await rowText(page, '[data-jar="pint"]')).toBe('Pint jars 65 min')

    const phone = await browser.newPage({ viewport: { width: 360, height: 780 } })
    await signIn(phone, server.url, 'canner@demo.shelfstead.test')
    await phone.goto(`${server.url}/recipes`)
    expect(await visible(phone.getByRole('heading', { name: 'Dry-packed pintos, our way' }))).toBe(true)
    await screenshot(phone, 'recipes-5-book-phone')
  })

  it('a helper reads the Recipe book but is not offered a new house recipe', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } })
    await signIn(page, server.url, 'helper@demo.shelfstead.test')
    await page.goto(`${server.url}/recipes`)
    expect(await visible(page.getByRole('heading', { name: 'Baked beans' }))).toBe(true)
    expect(await page.getByRole('link', { name: 'New house recipe' }).count()).toBe(0)
  })

  it('the owner adds a canner in inches, switches the household to metric and sees it in mm', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } })
    await signIn(page, server.url, 'owner@demo.shelfstead.test')
    await page.goto(`${server.url}/household`)
    expect(await visible(page.getByRole('heading', { level: 1, name: 'Household' }))).toBe(true)
    // Demo dial gauge last tested 2025-09-20: more than a year ago, so a test is due (PNW 421: test yearly).
    const everyday = page.locator('[data-canner="Everyday canner (16 qt)"]')
    expect(await visible(everyday.getByText('Gauge test due'))).toBe(true)
    expect(await page.getByText('Wren Okafor').count()).toBe(1)

    await page.getByRole('button', { name: 'Add a canner' }).click()
    await page.getByLabel('Canner name').fill('Borrowed canner')
    await page.getByLabel('Inside diameter').fill('12')
    await page.getByLabel('Usable height').fill('9')
    await page.getByLabel('Gauge', { exact: true }).selectOption('weighted')
    await page.getByRole('button', { name: 'Add canner' }).click()
    const added = page.locator('[data-canner="Borrowed canner"]')
    expect(await visible(added)).toBe(true)
    expect(await added.textContent()).toContain('12 in')
    await screenshot(page, 'household-1-canner-added-us')

    // A price is typed in currency units and pounds, and shown back the same way.
    await page.getByRole('button', { name: 'Add a price' }).click()
    await page.getByLabel('What it is').selectOption('salt')
    await page.getByLabel('As the package says').fill('Pickling salt, 2 lb bag')
    await page.getByLabel('Package weight').fill('2')
    await page.getByLabel('Price', { exact: true }).fill('-1')
    await page.getByRole('button', { name: 'Add to price list' }).click()
    expect(await visible(page.getByText('A price cannot be negative.'))).toBe(true)
    await page.getByLabel('Price', { exact: true }).fill('2.50')
    await page.getByRole('button', { name: 'Add to price list' }).click()
    const saltRow = page.locator('tbody tr').filter({ hasText: 'Pickling salt, 2 lb bag' })
    expect(await visible(saltRow)).toBe(true)
    expect((await saltRow.innerText()).replace(/\s+/g, ' ')).toContain('Salt 2 lb $2.50 $1.25 / lb')

    await page.getByLabel('Quart, wide mouth').fill('4')
    await page.getByRole('button', { name: 'Save jar counts' }).click()
    expect(await visible(page.getByRole('region', { name: 'Empty jars owned' }).getByRole('status'))).toBe(true)

    await page.getByLabel('Units').selectOption('metric')
    await page.getByRole('button', { name: 'Save settings' }).click()
    expect(await visible(page.getByRole('region', { name: 'Settings' }).getByRole('status'))).toBe(true)
    // 12 in × 25.4 = 304.8 mm, shown to the whole mm.
    expect(await visible(added.getByText('305 mm'))).toBe(true)
    expect(await added.textContent()).not.toContain(' in')
    await screenshot(page, 'household-2-metric')

    const phone = await browser.newPage({ viewport: { width: 360, height: 780 } })
    await signIn(phone, server.url, 'owner@demo.shelfstead.test')
    await phone.goto(`${server.url}/household`)
    expect(await visible(phone.locator('[data-canner="Borrowed canner"]').getByText('305 mm'))).toBe(true)
    await screenshot(phone, 'household-3-phone')
  })

  it('a cleared Altitude field is refused beside the field and the saved altitude stays', async () => {
    const phone = await browser.newPage({ viewport: { width: 360, height: 780 } })
    await signIn(phone, server.url, 'owner@demo.shelfstead.test')
    await phone.goto(`${server.url}/household`, { waitUntil: 'networkidle' })
    const altitude = phone.getByLabel('Altitude')
    // The test before switched the household to metric: 2,350 ft shows as 716 m (convert-units).
    expect(await altitude.inputValue()).toBe('716')
    await altitude.fill('')
    await phone.getByRole('button', { name: 'Save settings' }).click()
    const settings = phone.getByRole('region', { name: 'Settings' })
    expect(await visible(settings.getByText('Enter the altitude of your kitchen in feet'))).toBe(true)
    expect(await altitude.getAttribute('aria-invalid')).toBe('true')
    expect(await settings.getByText('Saved.').count()).toBe(0)
    await screenshot(phone, 'household-4-altitude-refused')
    await phone.reload({ waitUntil: 'networkidle' })
    expect(await phone.getByLabel('Altitude').inputValue()).toBe('716')
  })
})
