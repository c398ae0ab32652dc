/**
 * Every page on a phone: the routes are read from pages/, so a new page is visited without
 * anyone remembering to add it. Each is opened at 360 × 800 as the demo household's owner and as
 * its helper (and signed out, for the pages a person sees before signing in), and must not
 * scroll sideways, log no console error (Vue's hydration-mismatch report included) and throw no
 * page error. A screenshot of each is kept in test-results/screenshots.
 */
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { ago, linkInMail } from '../support/household'
import { launchBrowser, screenshot, signIn } from '../support/browser'

let server: RunningServer
let browser: Browser
const owner = new ApiClient('')
let hid: string
const params: Record<string, string> = {}

/** "pages/plans/[id]/day.vue" → "/plans/[id]/day"; "index.vue" → "/". */
function routesOf(dir: string): string[] {
  const out: string[] = []
  const walk = (d: string) => {
    for (const name of readdirSync(d)) {
      const path = join(d, name)
      if (statSync(path).isDirectory()) walk(path)
      else if (name.endsWith('.vue')) out.push(`/${relative(dir, path).replace(/\.vue$/, '').replace(/(^|\/)index$/, '')}`.replace(/\/$/, '') || '/')
    }
  }
  walk(dir)
  return out.sort()
}
const routes = routesOf('pages')
const publicRoutes = new Set(['/login', '/register', '/forgot', '/invite/[token]', '/reset/[token]'])

/** The page's address with its parameters filled from records made for the test. */
function address(route: string): string {
  if (route.startsWith('/plans/[id]')) return route.replace('[id]', params.plan!)
  if (route.startsWith('/logbook/[id]')) return route.replace('[id]', params.load!)
  if (route.startsWith('/recipes/[id]')) return route.replace('[id]', 'usda-dried-beans-hot-pack')
  if (route.startsWith('/shelf/lots/[id]')) return route.replace('[id]', params.lot!)
  if (route === '/invite/[token]') return params.invite!
  if (route === '/reset/[token]') return params.reset!
  if (route.includes('[')) throw new Error(`No test value for the parameters of ${route}: add one in browser-every-page.test.ts.`)
  return route
}

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_TEST_CLOCK: '1' } })
  Object.assign(owner, new ApiClient(server.url))
  hid = (await owner.login('owner@demo.shelfstead.test')).households[0]!.id
  const api = (path: string) => `/api/households/${hid}${path}`
  const canner = ((await owner.get(api('/canners'))).body as Array<{ id: string }>)[0]!.id
  const plan = await owner.post(api('/plans'), { name: 'Winter pintos', request: { cannerId: canner, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 18 }] } })
  expect(plan.status).toBe(201)
  params.plan = plan.body.plan.id
  const load = await owner.post(api('/loads'), { cannerId: canner, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 7, product: 'Pinto beans, hot pack' }], pressurePsi: 15, processMinutes: 75, startedAt: ago(4), endedAt: ago(2) })
  expect(load.status).toBe(201)
  params.load = load.body.id
  const shelf = await owner.get(api('/shelf'))
  params.lot = shelf.body.lots[0].id
  // The invitation's link, read from the invited person's own Outbox.
  const newcomer = new ApiClient(server.url)
  expect((await newcomer.post('/api/auth/register', { email: 'newcomer@example.test', password: 'a long newcomer password', name: 'Idris Fenn', householdName: 'Fenn Croft' })).status).toBe(201)
  const invited = await owner.post(api('/invitations'), { email: 'newcomer@example.test', role: 'helper' })
  expect(invited.status).toBe(201)
  params.invite = new URL(await linkInMail(newcomer, 'newcomer@example.test', '/invite/')).pathname
  const anon = new ApiClient(server.url)
  expect((await anon.post('/api/auth/reset-request', { email: 'helper@demo.shelfstead.test' })).status).toBeLessThan(300)
  const helper = new ApiClient(server.url)
  await helper.login('helper@demo.shelfstead.test')
  // The reset mail goes out just after the answer: wait for it to reach the Outbox.
  for (let tries = 0; tries < 40; tries++) {
    if (((await helper.get('/api/dev/outbox')).body as Array<{ text: string }>).some(m => m.text.includes('/reset/'))) break
    await new Promise(r => setTimeout(r, 250))
  }
  params.reset = new URL(await linkInMail(helper, 'helper@demo.shelfstead.test', '/reset/')).pathname
  browser = await launchBrowser()
}, 120_000)
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

interface Visit { route: string, url: string, scrollWidth: number, innerWidth: number, errors: string[] }

async function visit(page: Page, route: string, who: string): Promise<Visit> {
  const errors: string[] = []
  const onConsole = (m: { type: () => string, text: () => string }) => { if (m.type() === 'error') errors.push(m.text()) }
  const onError = (e: Error) => errors.push(`page error: ${e.message}`)
  page.on('console', onConsole)
  page.on('pageerror', onError)
  try {
    await page.goto(`${server.url}${address(route)}`, { waitUntil: 'networkidle' })
    // Let late content (charts, client-only parts) settle before measuring.
    await page.waitForTimeout(300)
    // A phone's browser widens its layout viewport to fit wide content (innerWidth grows with it),
    // so the page is measured against the 360 px screen itself.
    const size = await page.evaluate(() => ({ scrollWidth: document.documentElement.scrollWidth, innerWidth: Math.min(window.innerWidth, window.screen.width) }))
    await screenshot(page, `every-page-${who}${route.replace(/[[\]]/g, '').replace(/\//g, '-') || '-board'}`)
    return { route, url: page.url(), ...size, errors: [...errors] }
  }
  finally {
    page.off('console', onConsole)
    page.off('pageerror', onError)
  }
}

describe('every page fits a 360 px phone, with no console errors', () => {
  it('finds the pages from pages/', () => {
    expect(routes).toContain('/')
    expect(routes).toContain('/plans/[id]/market')
    expect(routes.length).toBeGreaterThan(20)
  })

  for (const who of ['owner', 'helper'] as const) {
    it(`as the ${who}`, async () => {
      const context = await browser.newContext({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 1, isMobile: true, hasTouch: true })
      const page = await context.newPage()
      await signIn(page, server.url, `${who}@demo.shelfstead.test`)
      const results: Visit[] = []
      for (const route of routes.filter(r => !publicRoutes.has(r))) results.push(await visit(page, route, who))
      await context.close()
      const wide = results.filter(r => r.scrollWidth > r.innerWidth).map(r => `${r.route}: ${r.scrollWidth} px > ${r.innerWidth} px`)
      const noisy = results.filter(r => r.errors.length).map(r => `${r.route}: ${r.errors.join(' | ')}`)
      expect(wide, 'pages that scroll sideways').toEqual([])
      expect(noisy, 'pages with console errors').toEqual([])
    }, 300_000)
  }

  it('signed out: sign-in, create account, forgotten password and e-mailed links', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 1, isMobile: true, hasTouch: true })
    const page = await context.newPage()
    const results: Visit[] = []
    for (const route of [...publicRoutes]) results.push(await visit(page, route, 'signed-out'))
    await context.close()
    expect(results.filter(r => r.scrollWidth > r.innerWidth).map(r => `${r.route}: ${r.scrollWidth} px`)).toEqual([])
    expect(results.filter(r => r.errors.length).map(r => `${r.route}: ${r.errors.join(' | ')}`)).toEqual([])
  }, 120_000)

  it('an address that is no page answers HTTP 404, signed in or not', async () => {
    const anon = await fetch(`${server.url}/no-such-shelf`, { redirect: 'manual' })
    expect(anon.status).toBe(404)
    const context = await browser.newContext({ viewport: { width: 360, height: 800 } })
    const page = await context.newPage()
    await signIn(page, server.url, 'owner@demo.shelfstead.test')
    const res = await page.goto(`${server.url}/no-such-shelf`)
    expect(res?.status()).toBe(404)
    const missing = await page.goto(`${server.url}/plans/00000000-0000-4000-8000-000000000000`)
    expect(missing?.status()).toBe(404)
    await context.close()
  }, 60_000)
})
