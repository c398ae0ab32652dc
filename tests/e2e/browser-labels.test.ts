/**
 * Jar labels that scan, in Debian's Chromium: the labels page draws a QR code per lot; the code,
 * read back from the page with an independent decoder (jsQR), opens the lot on a 360 × 800 phone
 * where a signed-out helper is sent to sign in and back, and one tap takes exactly one jar off.
 * Each label stock prints at actual size on the expected number of pages (Chromium's print to
 * PDF). The Shelf and the labels page do not scroll sideways on the phone. Screenshots land in
 * test-results/screenshots/labels-*.png.
 */
import jsQR from 'jsqr'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { launchBrowser, screenshot, signIn, visible } from '../support/browser'

let server: RunningServer
let browser: Browser
let desk: Page
let api: ApiClient
let hid: string
let lot: { id: string, product: string, jarsLeft: number }
let link = ''

/** ISO 216 A4, 210 × 297 mm, in PDF points (1/72 in); US letter is 8½ × 11 in, 612 × 792 pt. */
const A4 = [210 / 25.4 * 72, 297 / 25.4 * 72]
const sideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
const jarsLeft = async (lotId: string) => ((await api.get(`/api/households/${hid}/shelf`)).body.lots as Array<{ id: string, jarsLeft: number }>).find(l => l.id === lotId)?.jarsLeft ?? 0

/** Draw the first label's QR code on a canvas in the page and decode its pixels with jsQR. */
async function readFirstQr(page: Page): Promise<string | null> {
  const side = 330
  const pixels = await page.locator('.label svg').first().evaluate(async (svg, size) => {
    const image = new Image()
    image.src = `data:image/svg+xml;base64,${btoa(new XMLSerializer().serializeToString(svg))}`
    await image.decode()
    const canvas = document.createElement('canvas')
    canvas.width = size
    canvas.height = size
    const context = canvas.getContext('2d')!
    context.fillStyle = '#ffffff'
    context.fillRect(0, 0, size, size)
    context.drawImage(image, 15, 15, size - 30, size - 30)
    return Array.from(context.getImageData(0, 0, size, size).data)
  }, side)
  return jsQR(Uint8ClampedArray.from(pixels), side, side)?.data ?? null
}

/** Pages and page size of a PDF made by Chromium (its page objects are written uncompressed). */
function pdfPages(pdf: Buffer): { pages: number, box: number[] } {
  const text = pdf.toString('latin1')
  const box = text.match(/\/MediaBox\s*\[\s*([\d.\s]+)\]/)![1]!.trim().split(/\s+/).map(Number)
  return { pages: (text.match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length, box }
}

beforeAll(async () => {
  server = await startServer()
  api = new ApiClient(server.url)
  hid = (await api.login('canner@demo.shelfstead.test')).households[0]!.id
  const shelf = (await api.get(`/api/households/${hid}/shelf`)).body
  lot = shelf.lots.find((l: { jarsLeft: number }) => l.jarsLeft >= 3)
  expect(lot).toBeTruthy()
  browser = await launchBrowser()
  desk = await browser.newPage({ viewport: { width: 1280, height: 900 } })
  await signIn(desk, server.url, 'canner@demo.shelfstead.test')
})
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

describe('jar labels that scan', () => {
  it('draws a QR code on each label that decodes to the lot\'s page', async () => {
    await desk.goto(`${server.url}/shelf/labels?lots=${lot.id}`)
    expect(await visible(desk.getByRole('heading', { level: 1, name: `Labels for ${lot.product}` }))).toBe(true)
    expect(await desk.locator('.label').count()).toBe(lot.jarsLeft)
    link = (await readFirstQr(desk))!
    expect(link).toBe(`${server.url}/shelf/lots/${lot.id}`)
    expect(await desk.locator('.label').first().getAttribute('data-link')).toBe(link)
    // the test server's address is the loopback one: the page says a phone cannot open it
    expect(await visible(desk.getByText('A phone cannot open these QR codes'))).toBe(true)
    await screenshot(desk, 'labels-1-one-lot')
  })

  it('prints each label stock at actual size on the expected number of pages', async () => {
    // 30 labels: one US-letter sheet of 30, two A4 sheets of 24, two plain pages of 21
    const cases = [
      { layout: 'sheet-30', count: 30, pages: 1, box: [612, 792], label: [2.625 * 96, 96] },
      { layout: 'sheet-30', count: 31, pages: 2, box: [612, 792], label: [2.625 * 96, 96] },
      { layout: 'a4-24', count: 30, pages: 2, box: [A4[0], A4[1]], label: [70 / 25.4 * 96, 37 / 25.4 * 96] },
      { layout: 'a4-24', count: 24, pages: 1, box: [A4[0], A4[1]], label: [70 / 25.4 * 96, 37 / 25.4 * 96] },
      { layout: 'plain', count: 30, pages: 2, box: [612, 792], label: [2.3 * 96, 1.25 * 96] },
    ]
    for (const c of cases) {
      await desk.goto(`${server.url}/shelf/labels?lots=${lot.id}&count=${c.count}&layout=${c.layout}`)
      await expect.poll(() => desk.locator('.label').count()).toBe(c.count)
      await desk.emulateMedia({ media: 'print' })
      const box = (await desk.locator('.label').first().boundingBox())!
      expect(box.width, c.layout).toBeCloseTo(c.label[0]!, 0)
      expect(box.height, c.layout).toBeCloseTo(c.label[1]!, 0)
      const pdf = pdfPages(await desk.pdf({ preferCSSPageSize: true, printBackground: true }))
      expect(pdf.pages, `${c.layout} × ${c.count}`).toBe(c.pages)
      // within a point: Chromium lays the page out in whole CSS pixels
      expect(Math.abs(pdf.box[2]! - c.box[0]!), `${c.layout} width ${pdf.box[2]}`).toBeLessThan(1)
      expect(Math.abs(pdf.box[3]! - c.box[1]!), `${c.layout} height ${pdf.box[3]}`).toBeLessThan(1)
      await desk.emulateMedia({ media: 'screen' })
    }
    await screenshot(desk, 'labels-2-plain-paper')
  })

  it('opens the label\'s link on a phone: a signed-out helper signs in, comes back and takes one jar off with one tap', async () => {
    const phone = await browser.newPage({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 1 })
    await phone.goto(link, { waitUntil: 'networkidle' })
    await phone.waitForURL(url => url.pathname === '/login')
    expect(new URL(phone.url()).searchParams.get('next')).toBe(`/shelf/lots/${lot.id}`)
    await phone.getByLabel('E-mail').fill('helper@demo.shelfstead.test')
    await phone.getByLabel('Password').fill('put-up-2026')
    await phone.getByRole('button', { name: 'Sign in' }).click()
    await phone.waitForURL(url => url.pathname === `/shelf/lots/${lot.id}`)
    expect(await visible(phone.getByRole('heading', { level: 1, name: lot.product }))).toBe(true)
    const before = await jarsLeft(lot.id)
    expect(await phone.getByTestId('jars-left').textContent()).toBe(String(before))
    expect(await sideways(phone)).toBeLessThanOrEqual(0)
    await screenshot(phone, 'labels-3-lot-on-phone')

    const take = phone.getByRole('button', { name: 'Take 1 jar off the Shelf' })
    const target = (await take.boundingBox())!
    expect(target.height).toBeGreaterThanOrEqual(44)
    expect(target.x + target.width).toBeLessThanOrEqual(360)
    await take.click()
    expect(await visible(phone.getByText(`Took 1 jar of ${lot.product} off the Shelf`))).toBe(true)
    expect(await jarsLeft(lot.id)).toBe(before - 1)
    await expect.poll(() => phone.getByTestId('jars-left').textContent()).toBe(String(before - 1))
    expect(await sideways(phone)).toBeLessThanOrEqual(0)
    await screenshot(phone, 'labels-4-one-jar-off')

    await phone.getByRole('button', { name: /^Undo the last take-off \(1 jar,/ }).click()
    expect(await visible(phone.getByText('Undone: the jar is back on the Shelf.'))).toBe(true)
    expect(await jarsLeft(lot.id)).toBe(before)
    await phone.close()
  })

  it('the Shelf and the labels page fit a 360 px phone, with Take off in view and 44 px targets', async () => {
    for (const who of ['helper@demo.shelfstead.test', 'canner@demo.shelfstead.test']) {
      const phone = await browser.newPage({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 1 })
      await signIn(phone, server.url, who)
      await phone.goto(`${server.url}/shelf`)
      expect(await visible(phone.getByRole('heading', { level: 1, name: 'Shelf' }))).toBe(true)
      expect(await sideways(phone), `${who} on the Shelf`).toBeLessThanOrEqual(0)
      const takeOff = phone.getByRole('button', { name: 'Take off' }).first()
      const box = (await takeOff.boundingBox())!
      expect(box.x).toBeGreaterThanOrEqual(0)
      expect(box.x + box.width).toBeLessThanOrEqual(360)
      const row = phone.locator('tr.shelf-lot').first()
      const small = await row.locator('button, a, input').evaluateAll(els => els
        .map(e => e.getBoundingClientRect())
        .filter(r => r.width > 0 && (r.width < 44 || r.height < 44)).length)
      expect(small, `${who}: targets under 44 × 44 px in a lot's row`).toBe(0)
      await screenshot(phone, `labels-5-shelf-phone-${who.split('@')[0]}`)
      if (who.startsWith('canner')) {
        // the correction form opens under its lot and fits too
        await row.getByRole('button', { name: /^Correct/ }).click()
        expect(await visible(phone.getByLabel('Jars on the shelf now'))).toBe(true)
        expect(await sideways(phone), 'the correction form').toBeLessThanOrEqual(0)
        await screenshot(phone, 'labels-5-shelf-phone-correct')
      }
      await phone.goto(`${server.url}/shelf/labels`)
      expect(await visible(phone.locator('.label').first())).toBe(true)
      expect(await sideways(phone), `${who} on the labels page`).toBeLessThanOrEqual(0)
      await screenshot(phone, `labels-6-labels-phone-${who.split('@')[0]}`)
      await phone.close()
    }
  })
})
