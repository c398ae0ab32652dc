#!/usr/bin/env node
// Benchmarks (never timed assertions in tests):
//  1. the layout function for 1…40 jars per layer (vitest bench);
//  2. the plan preview route against the health route of the same built server, with
//     autocannon on 127.0.0.1, 10 connections for 10 s each; printed as a ratio;
//  3. a mixed read/write load of many households at once (scripts/lib/load.mjs) on PGlite, and on
//     a throwaway PostgreSQL cluster with two app servers; errors, lost writes (counted after),
//     throughput and p50/p99 beside the bare health route of the same run. Exits non-zero on
//     any error or lost write.
//  --smoke: short durations (a check that the bench still runs), --no-build: use .output as is.
import { spawn, spawnSync } from 'node:child_process'
import { mkdtempSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { cpus, tmpdir, totalmem } from 'node:os'
import autocannon from 'autocannon'
import { mixedLoad, startServers } from './lib/load.mjs'
import { freePort } from './lib/ports.mjs'
import { postgresBin, startPostgres } from './lib/postgres-cluster.mjs'

const env = { ...process.env, NUXT_TELEMETRY_DISABLED: '1' }
const output = resolve(env.SHELFSTEAD_OUTPUT_DIR || '.output')
const smoke = process.argv.includes('--smoke')
const seconds = smoke ? 2 : 10

console.log('== Layout: one layer, 1…40 jars ==')
const layout = spawnSync('npx', ['vitest', 'bench', '--run', '--project', 'unit', 'tests/bench/layout.bench.ts'], { stdio: 'inherit', env })
if (layout.status !== 0) process.exit(layout.status ?? 1)

if (!process.argv.includes('--no-build')) {
  const build = spawnSync('npx', ['nuxt', 'build'], { stdio: 'inherit', env })
  if (build.status !== 0) process.exit(build.status ?? 1)
}

const port = await freePort()
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
  const run = opts => autocannon({ connections: 10, duration: seconds, ...opts })
  const preview = await run({ url: `${base}/api/households/${householdId}/plans/preview`, method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body })
  const health = await run({ url: `${base}/api/health` })
  const row = (name, r) => `${name.padEnd(8)} ${r.requests.average.toFixed(0).padStart(7)} req/s   p50 ${String(r.latency.p50).padStart(4)} ms   p99 ${String(r.latency.p99).padStart(4)} ms   non-2xx ${r.non2xx}`
  console.log(`\n== HTTP (10 connections, ${seconds} s each, 127.0.0.1) ==`)
  console.log(row('preview', preview))
  console.log(row('health', health))
  console.log(`preview / health throughput: ${(preview.requests.average / health.requests.average).toFixed(3)}`)
}
finally {
  server.kill('SIGTERM')
}

// 3. Mixed load with nothing lost.
const loadOptions = smoke ? { households: 4, seconds: 3, maxRequests: 2_000 } : { households: 40, seconds: 30, maxRequests: 200_000 }
const health = async url => autocannon({ url: `${url}/api/health`, connections: 10, duration: smoke ? 2 : 10 })
const loadRow = (name, r, h) => `${name.padEnd(28)} ${String(r.households).padStart(4)} households  ${r.perSecond.toFixed(0).padStart(6)} req/s  p50 ${String(r.p50).padStart(4)} ms  p99 ${String(r.p99).padStart(5)} ms  ${String(r.requests).padStart(7)} requests  ${String(r.writes).padStart(6)} writes  errors ${r.errors}  lost ${r.lost}   | health ${h.requests.average.toFixed(0)} req/s, p50 ${h.latency.p50} ms, p99 ${h.latency.p99} ms`
const rows = []
let failed = false
async function measure(name, servers) {
  try {
    const result = await mixedLoad(servers.urls, loadOptions)
    const h = await health(servers.urls[0])
    rows.push(loadRow(name, result, h))
    if (result.errors || result.lost) {
      failed = true
      console.log(`${name}: ${result.errors} errors, ${result.lost} lost writes; first errors:\n  ${result.firstErrors.join('\n  ')}`)
    }
  }
  finally {
    await servers.stop()
  }
}
await measure('PGlite, one server', await startServers(output))
if (postgresBin()) {
  const cluster = await startPostgres()
  try {
    await measure('PostgreSQL, two servers', await startServers(output, { count: 2, databaseUrl: cluster.url }))
  }
  finally {
    await cluster.stop()
  }
}
else {
  console.log('PostgreSQL not installed (apt-get install postgresql): the two-server load was not run.')
  failed = true
}
console.log(`\n== Mixed load, ${new Date().toISOString().slice(0, 10)}, ${cpus().length} cores, ${Math.round(totalmem() / 2 ** 30)} GiB, one request in flight per household, ${loadOptions.seconds} s ==`)
for (const r of rows) console.log(r)
if (failed) process.exit(1)
