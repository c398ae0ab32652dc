import { chromium } from 'playwright-core'
const base = process.argv[2]
const b = await chromium.launch({ executablePath: '/usr/bin/chromium' })
const ctx = await b.newContext({ viewport: { width: 360, height: 800 } })
const p = await ctx.newPage()
p.on('console', m => { if (m.type() === 'error') console.log('CONSOLE', p.url(), m.text()) })
await p.goto(base + '/login', { waitUntil: 'networkidle' })
await p.getByLabel('E-mail').fill('owner@demo.shelfstead.test')
await p.getByLabel('Password').fill('put-up-2026')
await p.getByRole('button', { name: 'Sign in' }).click()
await p.waitForURL(u => !u.pathname.startsWith('/login'))
const api = async (method, path, body) => p.evaluate(async ([m, u, b]) => { const r = await fetch(u, { method: m, headers: { 'content-type': 'application/json' }, body: b ? JSON.stringify(b) : undefined }); return { status: r.status, body: await r.json().catch(() => null) } }, [method, path, body])
const me = await api('GET', '/api/auth/me')
const hid = me.body.households?.[0]?.id ?? me.body.activeHouseholdId
const canners = (await api('GET', `/api/households/${hid}/canners`)).body
await api('PUT', `/api/households/${hid}/dry-goods`, { ingredientId: 'pinto-beans', grams: 2721.6 })
const plan = await api('POST', `/api/households/${hid}/plans`, { name: 'Spring pintos', request: { cannerId: canners[0].id, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 27 }] } })
const planId = plan.body.plan.id
const full = (await api('GET', `/api/households/${hid}/plans/${planId}`)).body
const l1 = full.result.loads[0]
const out = new Date(Date.now() - 3600e3).toISOString(), start = new Date(Date.now() - 4 * 3600e3).toISOString()
const logged = await api('POST', `/api/households/${hid}/loads`, { planId, planLoad: 1, cannerId: l1.cannerId, lines: l1.contents.map(c => ({ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: l1.jarSizeId, jars: c.jars, product: 'Pinto beans, hot pack' })), pressurePsi: 15, processMinutes: 75, startedAt: start, endedAt: out })
console.log('logged', logged.status, JSON.stringify(logged.body).slice(0, 200))
const shots = [['board', '/'], ['plan', `/plans/${planId}`], ['market', `/plans/${planId}/market`], ['household', '/household'], ['load', `/logbook/${logged.body.id}`], ['shelf', '/shelf'], ['planner', '/plan'], ['logbook', '/logbook']]
for (const w of [360, 1280]) {
  await p.setViewportSize({ width: w, height: 900 })
  for (const [name, path] of shots) {
    await p.goto(base + path, { waitUntil: 'networkidle' })
    await p.waitForTimeout(400)
    if (name === 'load') { const b = p.getByRole('button', { name: 'Correct this entry…' }); if (await b.count()) { await b.click(); await p.waitForTimeout(300) } }
    const sw = await p.evaluate(() => document.documentElement.scrollWidth)
    console.log(w, name, 'scrollWidth', sw)
    await p.screenshot({ path: `/tmp/walk/${name}-${w}.png`, fullPage: true })
  }
}
await b.close()
