// A mixed read/write load of many simulated households at once against built servers on
// 127.0.0.1, bounded in count and in time, then a count of every acknowledged write afterwards.
// Used by scripts/bench.mjs; every number it prints comes from this run.
import { spawn } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { mkdtempSync } from 'node:fs'
import { freePort } from './ports.mjs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import hdr from 'hdr-histogram-js'

/** Start `count` built servers on one database (PGlite when `databaseUrl` is unset; then count must be 1). */
export async function startServers(output, { count = 1, databaseUrl } = {}) {
  const secret = randomBytes(32).toString('hex')
  const servers = []
  for (let i = 0; i < count; i++) {
    const port = await freePort()
    const child = spawn(process.execPath, [join(output, 'server/index.mjs')], {
      env: {
        ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_DATA_DIR: mkdtempSync(join(tmpdir(), 'shelfstead-bench-')),
        SHELFSTEAD_DEMO: '1', NUXT_SESSION_PASSWORD: secret, DATABASE_URL: databaseUrl ?? '', SHELFSTEAD_MAIL: 'off',
      },
      stdio: 'ignore',
    })
    servers.push({ url: `http://127.0.0.1:${port}`, child })
  }
  for (const s of servers) {
    let up = false
    for (let i = 0; i < 600 && !up; i++) {
      try { up = (await fetch(`${s.url}/api/health`)).status === 200 }
      catch { /* not listening yet */ }
      if (!up) await new Promise(r => setTimeout(r, 200))
    }
    if (!up) throw new Error(`A server did not start on ${s.url}`)
  }
  const stopOne = s => new Promise((done) => {
    s.child.once('exit', done)
    s.child.kill('SIGTERM')
  })
  return { urls: servers.map(s => s.url), stop: () => Promise.all(servers.map(stopOne)) }
}

/**
 * Run the load: `households` simulated households, each with one request in flight at a time, for
 * `seconds` or `maxRequests` in all, whichever comes first; requests alternate over `urls` (one
 * address in front of several servers). Each household mixes reads (board, shelf, Logbook, plan
 * preview) with writes (a price, a logged load, a seal check that shelves its jars, a take-off).
 */
export async function mixedLoad(urls, { households = 20, seconds = 20, maxRequests = 20_000 } = {}) {
  let turn = 0
  const nextUrl = () => urls[turn++ % urls.length]
  const latency = hdr.build({ lowestDiscernibleValue: 1, highestTrackableValue: 120_000, numberOfSignificantValueDigits: 3 })
  const errors = []
  let requests = 0

  async function call(cookie, method, path, body) {
    const started = performance.now()
    requests++
    let status = 0
    let json
    try {
      const res = await fetch(nextUrl() + path, {
        method,
        headers: { ...(cookie ? { cookie } : {}), ...(body ? { 'content-type': 'application/json' } : {}) },
        body: body ? JSON.stringify(body) : undefined,
      })
      status = res.status
      const text = await res.text()
      try { json = JSON.parse(text) }
      catch { json = text }
      if (status >= 400) errors.push(`${method} ${path} → ${status} ${(json?.message ?? text).slice(0, 200)}`)
      return { status, json, headers: res.headers }
    }
    catch (error) {
      errors.push(`${method} ${path} → ${error.message}`)
      return { status, json }
    }
    finally {
      latency.recordValue(Math.max(1, Math.round(performance.now() - started)))
    }
  }

  // Sign-up is not part of the timed load.
  const people = []
  for (let i = 0; i < households; i++) {
    const email = `bench-${i}-${randomBytes(4).toString('hex')}@example.org`
    const reg = await fetch(`${urls[0]}/api/auth/register`, {
      method: 'POST', headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email, password: 'bench-pressure-2026', name: `Bench household ${i + 1}`, householdName: `Bench cellar ${i + 1}` }),
    })
    if (reg.status !== 201) throw new Error(`register → ${reg.status} ${await reg.text()}`)
    const cookie = reg.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
    const id = (await reg.json()).households[0].id
    const api = p => `/api/households/${id}${p}`
    const setup = [
      await call(cookie, 'PATCH', api(''), { altitudeFt: 1500 }),
      await call(cookie, 'POST', api('/canners'), { name: 'Weighted canner', innerDiameterMm: 310, usableHeightMm: 330, rackThicknessMm: 6, gaugeType: 'weighted', maxLayers: 2, waterDepthMm: 76 }),
      await call(cookie, 'PUT', api('/jar-stock'), { jarSizeId: 'pint-regular', count: 5_000 }),
    ]
    if (setup.some(r => r.status >= 300)) throw new Error(`set-up failed: ${errors.join('\n')}`)
    people.push({ cookie, api, cannerId: setup[1].json.id, prices: [], loads: [], shelved: 0, taken: 0, lots: [] })
  }
  latency.reset()
  requests = 0
  const setupErrors = errors.length

  const hour = 3_600_000
  const iso = ms => new Date(Date.now() - ms).toISOString()
  const stopAt = Date.now() + seconds * 1000
  const startedAt = performance.now()
  let writes = 0

  async function household(p, index) {
    let step = 0
    while (Date.now() < stopAt && requests < maxRequests) {
      const kind = step++ % 10
      if (kind === 0) {
        const label = `Lids, bench ${index}-${step}`
        const r = await call(p.cookie, 'POST', p.api('/prices'), { kind: 'lid', label, packCount: 12, priceCents: 400, mouth: 'regular' })
        if (r.status === 201) p.prices.push(label)
        writes++
      }
      else if (kind === 3) {
        // Logged loads came out 13 h ago and earlier, two hours apart: none overlaps another in one
        // canner, and each is ready for its seal check (12–24 h after, USDA Complete Guide, "Testing jar seals").
        const endedMs = 13 * hour + p.loads.length * 2 * hour
        const r = await call(p.cookie, 'POST', p.api('/loads'), {
          cannerId: p.cannerId, lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', jars: 4, product: 'Bench pintos' }],
          pressurePsi: 15, processMinutes: 75, startedAt: iso(endedMs + hour + 30 * 60_000), endedAt: iso(endedMs),
        })
        writes++
        if (r.status === 201) {
          p.loads.push(r.json.id)
          const s = await call(p.cookie, 'POST', p.api('/seal-checks'), { loadId: r.json.id, lines: [{ loadLineId: r.json.lines[0].id, sealed: 4, unsealed: 0 }] })
          writes++
          if (s.status === 201) p.shelved += 4
        }
      }
      else if (kind === 6) {
        const shelf = await call(p.cookie, 'GET', p.api('/shelf'))
        const lot = shelf.json?.lots?.find(l => l.jarsLeft > 0)
        if (lot) {
          const t = await call(p.cookie, 'POST', p.api('/shelf/take-off'), { items: [{ lotId: lot.id, jars: 1 }] })
          writes++
          if (t.status === 200) p.taken++
        }
      }
      else if (kind === 1 || kind === 7) {
        await call(p.cookie, 'POST', p.api('/plans/preview'), { cannerIds: [p.cannerId], lines: [{ recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 18 }] })
      }
      else if (kind === 2 || kind === 8) await call(p.cookie, 'GET', p.api('/board'))
      else if (kind === 4) await call(p.cookie, 'GET', p.api('/loads?pageSize=20'))
      else await call(p.cookie, 'GET', p.api('/shelf'))
    }
  }
  await Promise.all(people.map((p, i) => household(p, i)))
  const elapsed = (performance.now() - startedAt) / 1000
  const sent = requests
  const p50 = latency.getValueAtPercentile(50)
  const p99 = latency.getValueAtPercentile(99)

  // Count afterwards: every acknowledged write is there, and no more.
  let lost = 0
  for (const p of people) {
    const prices = await call(p.cookie, 'GET', p.api('/prices'))
    const labels = new Set(prices.json.map(x => x.label))
    lost += p.prices.filter(l => !labels.has(l)).length
    const ids = new Set()
    let total = 0
    for (let page = 1; page <= Math.ceil(p.loads.length / 100) + 1; page++) {
      const loads = await call(p.cookie, 'GET', p.api(`/loads?pageSize=100&page=${page}`))
      loads.json.rows.forEach(r => ids.add(r.id))
      total = loads.json.total
    }
    lost += p.loads.filter(id => !ids.has(id)).length + Math.abs(total - p.loads.length)
    const shelf = await call(p.cookie, 'GET', p.api('/shelf'))
    lost += Math.abs(shelf.json.totalJars - (p.shelved - p.taken))
  }
  return {
    households, seconds: elapsed, requests: sent, writes, errors: errors.length - setupErrors, firstErrors: errors.slice(setupErrors, setupErrors + 5), lost,
    perSecond: sent / elapsed, p50, p99,
  }
}
