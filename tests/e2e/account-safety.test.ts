/**
 * Account safety against the built server: password reset by e-mail, common passwords, rate
 * limits, sign-out that ends the session on the server, session cookies, cross-origin writes,
 * security headers, and markup in stored names shown as text.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'
import { newHousehold, type TestHousehold } from '../support/household'
import { launchBrowser, visible } from '../support/browser'

let server: RunningServer
let home: TestHousehold
const EMAIL = 'ottilie@example.org'
const PASSWORD = 'kidney-keep-2026'

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_TEST_CLOCK: '1', SHELFSTEAD_TRUST_PROXY: '1' } })
  home = await newHousehold(server, { email: EMAIL, password: PASSWORD, name: 'Ottilie Roe', householdName: 'Roe pantry' })
})
afterAll(async () => { await server?.stop() })

/** A client that says it is at `address` (the server trusts X-Forwarded-For in this test). */
function from(address: string) {
  return async (path: string, body: unknown) => {
    const res = await fetch(server.url + path, { method: 'POST', headers: { 'content-type': 'application/json', 'x-forwarded-for': address }, body: JSON.stringify(body) })
    return { status: res.status, headers: res.headers, body: await res.json().catch(() => null) }
  }
}

describe('password reset', () => {
  it('answers the same for a known and an unknown address, and mails a single-use link that ends other sessions', async () => {
    const phone = new ApiClient(server.url)
    await phone.login(EMAIL, PASSWORD)
    expect((await phone.get(home.api('/shelf'))).status).toBe(200)

    const known = await new ApiClient(server.url).post('/api/auth/reset-request', { email: EMAIL })
    const unknown = await new ApiClient(server.url).post('/api/auth/reset-request', { email: 'nobody-here@example.org' })
    expect(known.status).toBe(200)
    expect(unknown.status).toBe(200)
    expect(unknown.body).toEqual(known.body)

    let link = ''
    for (let i = 0; i < 50 && !link; i++) {
      const box = (await home.owner.get('/api/dev/outbox')).body as Array<{ to: string[], text: string }>
      link = box.find(m => m.to.includes(EMAIL) && m.text.includes('/reset/'))?.text.match(/https?:\/\/\S+\/reset\/[A-Za-z0-9_-]+/)?.[0] ?? ''
      if (!link) await new Promise(r => setTimeout(r, 100))
    }
    expect(link).not.toBe('')
    const token = link.split('/reset/')[1]!
    const visitor = new ApiClient(server.url)
    expect((await visitor.get(`/api/auth/reset/${token}`)).body.status).toBe('open')
    const common = await visitor.post('/api/auth/reset', { token, password: 'qwertyuiop' })
    expect(common.status).toBe(400)
    expectField(common, 'password', /common passwords/)
    const done = await visitor.post('/api/auth/reset', { token, password: 'new-kidney-keep-2026' })
    expect(done.status).toBe(200)
    expect(done.body.user.email).toBe(EMAIL)
    // other sessions ended; the old password no longer works; the link is spent
    expect((await phone.get(home.api('/shelf'))).status).toBe(401)
    expect((await home.owner.get('/api/auth/me')).status).toBe(401)
    expect((await new ApiClient(server.url).post('/api/auth/login', { email: EMAIL, password: PASSWORD })).status).toBe(401)
    const reused = await new ApiClient(server.url).post('/api/auth/reset', { token, password: 'third-kidney-keep-2026' })
    expect(reused.status).toBe(400)
    expect(reused.body.message).toMatch(/already used/)
    await home.owner.login(EMAIL, 'new-kidney-keep-2026')
  })

  it('expires a link after an hour', async () => {
    await new ApiClient(server.url).post('/api/auth/reset-request', { email: EMAIL })
    let link = ''
    for (let i = 0; i < 50 && !link; i++) {
      const box = (await home.owner.get('/api/dev/outbox')).body as Array<{ to: string[], text: string, receivedAt: string }>
      const newest = box.filter(m => m.to.includes(EMAIL) && m.text.includes('/reset/'))
      if (newest.length >= 2) link = newest[0]!.text.match(/https?:\/\/\S+\/reset\/[A-Za-z0-9_-]+/)?.[0] ?? ''
      if (!link) await new Promise(r => setTimeout(r, 100))
    }
    const token = link.split('/reset/')[1]!
    expect((await home.owner.post('/api/dev/clock', { offsetMs: 61 * 60_000 })).status).toBe(200)
    const late = await new ApiClient(server.url).post('/api/auth/reset', { token, password: 'late-kidney-keep-2026' })
    expect(late.status).toBe(400)
    expect(late.body.message).toMatch(/expired/)
    expect((await home.owner.post('/api/dev/clock', { offsetMs: 0 })).status).toBe(200)
  })

  it('refuses a common password at sign-up', async () => {
    const res = await new ApiClient(server.url).post('/api/auth/register', { email: 'common@example.org', password: 'iloveyou123', name: 'C', householdName: 'C' })
    expect(res.status).toBe(400)
    expectField(res, 'password', /common passwords/)
  })
})

describe('guessing is slowed', () => {
  it('answers the sixth wrong password for one address within a minute with 429 and Retry-After; another address from another client still signs in', async () => {
    const attacker = from('203.0.113.7')
    for (let i = 0; i < 5; i++) expect((await attacker('/api/auth/login', { email: 'target@example.org', password: `guess-${i}` })).status).toBe(401)
    const sixth = await attacker('/api/auth/login', { email: 'target@example.org', password: 'guess-6' })
    expect(sixth.status).toBe(429)
    const wait = Number(sixth.headers.get('retry-after'))
    expect(wait).toBeGreaterThan(0)
    expect(wait).toBeLessThanOrEqual(60)
    expect(sixth.body.message).toMatch(/Try again in \d+ seconds?/)
    const someoneElse = await from('198.51.100.20')('/api/auth/login', { email: EMAIL, password: 'new-kidney-keep-2026' })
    expect(someoneElse.status).toBe(200)
  })

  it('takes as long to refuse an unknown address as a wrong password', async () => {
    const time = async (email: string) => {
      const started = performance.now()
      await from(`192.0.2.${Math.floor(Math.random() * 200)}`)('/api/auth/login', { email, password: 'not-the-password' })
      return performance.now() - started
    }
    const unknown: number[] = []
    const wrong: number[] = []
    for (let i = 0; i < 4; i++) {
      unknown.push(await time(`unknown-${i}@example.org`))
      wrong.push(await time(EMAIL))
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
    // Both run one password hash; without the decoy an unknown address answered ~10× faster.
    expect(median(unknown)).toBeGreaterThan(median(wrong) / 3)
  })
})

describe('sessions', () => {
  it('sign-out ends the session on the server: the old cookie is refused afterwards', async () => {
    const client = new ApiClient(server.url)
    await client.login(EMAIL, 'new-kidney-keep-2026')
    const kept = client.cookieHeader
    expect((await client.post('/api/auth/logout')).status).toBe(200)
    const replay = await fetch(`${server.url}/api/auth/me`, { headers: { cookie: kept } })
    expect(replay.status).toBe(401)
  })

  it('sign-out everywhere ends every session of the person', async () => {
    const a = new ApiClient(server.url)
    const b = new ApiClient(server.url)
    await a.login(EMAIL, 'new-kidney-keep-2026')
    await b.login(EMAIL, 'new-kidney-keep-2026')
    expect((await a.post('/api/auth/logout-everywhere')).status).toBe(200)
    expect((await b.get('/api/auth/me')).status).toBe(401)
    expect((await a.get('/api/auth/me')).status).toBe(401)
    await home.owner.login(EMAIL, 'new-kidney-keep-2026')
  })

  it('the session cookie is HttpOnly and SameSite=Lax, and Secure only over HTTPS', async () => {
    const login = (headers: Record<string, string>) => fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body: JSON.stringify({ email: EMAIL, password: 'new-kidney-keep-2026' }) })
    const plain = (await login({})).headers.getSetCookie().find(c => c.startsWith('nuxt-session='))!
    expect(plain).toMatch(/HttpOnly/i)
    expect(plain).toMatch(/SameSite=Lax/i)
    expect(plain).not.toMatch(/Secure/i)
    const proxied = (await login({ 'x-forwarded-proto': 'https' })).headers.getSetCookie().find(c => c.startsWith('nuxt-session='))!
    expect(proxied).toMatch(/Secure/i)
  })

  it('answers 401 to a request without a session before reading its body', async () => {
    const res = await fetch(server.url + home.api('/plans'), { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{not json' })
    expect(res.status).toBe(401)
  })
})

describe('other sites and stored markup', () => {
  it('refuses a cross-origin write, a form post and text/plain, and sends security headers', async () => {
    const cookie = home.owner.cookieHeader
    const evil = await fetch(server.url + home.api('/canners'), { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'origin': 'https://sibling.example' }, body: JSON.stringify({ name: 'Evil' }) })
    expect(evil.status).toBe(403)
    const site = await fetch(server.url + home.api('/canners'), { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'sec-fetch-site': 'cross-site' }, body: JSON.stringify({ name: 'Evil' }) })
    expect(site.status).toBe(403)
    const form = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: `email=${EMAIL}&password=x` })
    expect(form.status).toBe(415)
    const text = await fetch(server.url + home.api('/shelf/undo'), { method: 'POST', headers: { cookie, 'content-type': 'text/plain' }, body: '{}' })
    expect(text.status).toBe(415)
    const same = await fetch(server.url + home.api('/jar-stock'), { method: 'PUT', headers: { cookie, 'content-type': 'application/json', 'origin': server.url, 'sec-fetch-site': 'same-origin' }, body: JSON.stringify({ jarSizeId: 'pint-regular', count: 24 }) })
    expect(same.status).toBe(200)

    const page = await fetch(`${server.url}/login`)
    const csp = page.headers.get('content-security-policy') ?? ''
    expect(csp).toMatch(/frame-ancestors 'none'/)
    expect(csp).toMatch(/script-src 'self'/)
    expect(csp).not.toMatch(/unsafe-inline[^;]*;?\s*$|script-src[^;]*unsafe-inline/)
    expect(page.headers.get('x-content-type-options')).toBe('nosniff')
    expect(page.headers.get('referrer-policy')).toBe('same-origin')
  })

  it('shows markup in a stored name as text, and the page runs under its policy', async () => {
    const markup = '<img src=x onerror="window.__owned=1">Tall <b>canner</b>'
    expect((await home.owner.post(home.api('/canners'), { name: markup, innerDiameterMm: 300, usableHeightMm: 220, rackThicknessMm: 6, gaugeType: 'weighted', maxLayers: 1, waterDepthMm: 76 })).status).toBe(201)
    const browser = await launchBrowser()
    try {
      const context = await browser.newContext({ viewport: { width: 360, height: 800 } })
      const cookie = home.owner.cookieHeader.split('; ').map((c) => {
        const [name, ...v] = c.split('=')
        return { name: name!, value: v.join('='), url: server.url }
      })
      await context.addCookies(cookie)
      const page = await context.newPage()
      const violations: string[] = []
      page.on('console', (m) => { if (/Content Security Policy/i.test(m.text())) violations.push(m.text()) })
      await page.goto(`${server.url}/household`, { waitUntil: 'networkidle' })
      expect(await visible(page.getByText(markup).first())).toBe(true)
      expect(await page.evaluate(() => (window as unknown as { __owned?: number }).__owned)).toBeUndefined()
      expect(await page.locator('img[src="x"]').count()).toBe(0)
      expect(violations).toEqual([])
    }
    finally {
      await browser.close()
    }
  })
})
