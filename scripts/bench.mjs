#!/usr/bin/env node
// Benchmarks (never timed assertions in tests):
//  1. the layout function for 1…40 jars per layer (vitest bench);
//  2. the plan preview route against the health route of the same built server, with
//     autocannon on 127.0.0.1, 10 connections for 10 s each; printed as a ratio.
import { spawn, spawnSync } from 'node:child_process'
import { mkdtempSync } from 'node:fs'
import { createServer } from 'node:net'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import autocannon from 'autocannon'

const env = { ...process.env, NUXT_TELEMETRY_DISABLED: '1' }
const output = resolve(env.SHELFSTEAD_OUTPUT_DIR || '.output')

console.log('== Layout: one layer, 1…40 jars ==')
const layout = spawnSync('npx', ['vitest', 'bench', '--run', '--project', 'unit', 'tests/bench/layout.bench.ts'], { stdio: 'inherit', env })
if (layout.status !== 0) process.exit(layout.status ?? 1)

if (!process.argv.includes('--no-build')) {
  const build = spawnSync('npx', ['nuxt', 'build'], { stdio: 'inherit', env })
  if (build.status !== 0) process.exit(build.status ?? 1)
}

const port = await new Promise((done) => {
  const probe = createServer().listen(0, '127.0.0.1', () => {
    const { port } = probe.address()
    probe.close(() => done(port))
  })
})
const base = `http://127.0.0.1:${port}`
const server = spawn(process.execPath, [join(output, 'server/index.mjs')], {
  env: { ...env, PORT: String(port), HOST: '127.0.0.1', NUXT_DATA_DIR: mkdtempSync(join(tmpdir(), 'shelfstead-bench-')), SHELFSTEAD_DEMO: '1' },
  stdio: 'ignore',
})
try {
  for (let i = 0; i < 300; i++) {
    try { if ((await fetch(`${base}/api/health`)).status === 200) break }
    catch { /* not listening yet */ }
    await new Promise(r => setTimeout(r, 200))
  }
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'canner@demo.shelfstead.test', password: 'put-up-2026' }) })
  const cookie = login.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
  const { households } = await login.json()
  const householdId = households[0].id
  const canners = await (await fetch(`${base}/api/households/${householdId}/canners`, { headers: { cookie } })).json()
  const body = JSON.stringify({
    cannerId: canners[0].id,
    lines: [
      { recipeId: 'house-dry-pack-beans', jarSizeId: 'pint-regular', ingredientId: 'black-beans', jars: 18 },
      { recipeId: 'usda-dried-beans-hot-pack', jarSizeId: 'quart-regular', ingredientId: 'pinto-beans', packages: [{ grams: 907.18474, count: 3 }] },
    ],
  })
  const run = opts => autocannon({ connections: 10, duration: 10, ...opts })
  const preview = await run({ url: `${base}/api/households/${householdId}/plans/preview`, method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body })
  const health = await run({ url: `${base}/api/health` })
  const row = (name, r) => `${name.padEnd(8)} ${r.requests.average.toFixed(0).padStart(7)} req/s   p50 ${String(r.latency.p50).padStart(4)} ms   p99 ${String(r.latency.p99).padStart(4)} ms   non-2xx ${r.non2xx}`
  console.log('\n== HTTP (10 connections, 10 s each, 127.0.0.1) ==')
  console.log(row('preview', preview))
  console.log(row('health', health))
  console.log(`preview / health throughput: ${(preview.requests.average / health.requests.average).toFixed(3)}`)
}
finally {
  server.kill('SIGTERM')
}
