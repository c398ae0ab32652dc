#!/usr/bin/env node
// Build and start Shelfstead on the embedded database (PGlite in .data/) with the demo household.
// SHELFSTEAD_DEMO=0 starts without demo data; PORT and NUXT_DATA_DIR are honoured.
import { spawn, spawnSync } from 'node:child_process'
import { networkInterfaces } from 'node:os'
import { resolve } from 'node:path'

const env = {
  ...process.env,
  NUXT_TELEMETRY_DISABLED: '1',
  NUXT_DATA_DIR: resolve(process.env.NUXT_DATA_DIR || '.data'),
  SHELFSTEAD_DEMO: process.env.SHELFSTEAD_DEMO ?? '1',
  PORT: process.env.PORT || '3000',
}

if (!process.argv.includes('--no-build')) {
  const build = spawnSync('npx', ['nuxt', 'build'], { stdio: 'inherit', env })
  if (build.status !== 0) process.exit(build.status ?? 1)
}

const server = spawn(process.execPath, ['.output/server/index.mjs'], { stdio: 'inherit', env })
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal))
server.on('exit', code => process.exit(code ?? 0))

const url = `http://localhost:${env.PORT}`
const deadline = Date.now() + 120_000
while (Date.now() < deadline && server.exitCode === null) {
  try {
    if ((await fetch(`${url}/api/health`)).status === 200) {
      console.log(`\nShelfstead is ready: ${url}`)
      // The server listens on every interface: a phone on the same network opens one of these.
      const lan = Object.values(networkInterfaces()).flat().filter(a => a && a.family === 'IPv4' && !a.internal).map(a => `http://${a.address}:${env.PORT}`)
      if (lan.length) console.log(`On a phone on the same network: ${lan.join('  or  ')}`)
      console.log(`Data: ${env.NUXT_DATA_DIR}`)
      if (env.SHELFSTEAD_DEMO !== '0') {
        console.log('Demo sign-ins (password put-up-2026):')
        console.log('  owner@demo.shelfstead.test   — household owner')
        console.log('  canner@demo.shelfstead.test  — canner')
        console.log('  helper@demo.shelfstead.test  — helper')
      }
      break
    }
  }
  catch { /* still starting */ }
  await new Promise(r => setTimeout(r, 300))
}
