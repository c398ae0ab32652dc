import { spawnSync } from 'node:child_process'
import { statSync, readFileSync, mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, serverEntry, startServer, type RunningServer } from '../support/server'

const started: RunningServer[] = []
afterAll(async () => { await Promise.all(started.map(s => s.stop())) })

describe('start-up safety', () => {
  it('refuses a second server on the same data directory, naming the directory and the holding pid', async () => {
    // PGlite's data directory is what is locked (on a PostgreSQL server the server locks)
    const first = await startServer({ env: { DATABASE_URL: '' } })
    started.push(first)
    const second = spawnSync(process.execPath, [serverEntry], {
      env: { ...process.env, NUXT_DATA_DIR: first.dataDir, PORT: '0', NUXT_SESSION_PASSWORD: '' },
      encoding: 'utf8',
      timeout: 30_000,
    })
    expect(second.status).not.toBe(0)
    expect(second.stderr).toContain(first.dataDir)
    expect(second.stderr).toContain(`pid ${first.process.pid}`)
    // the first server still works and still sees its data
    const api = new ApiClient(first.url)
    await api.login('owner@demo.shelfstead.test')
  })

  it('without NUXT_SESSION_PASSWORD generates an owner-only secret, and sign-in works across a restart', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'shelfstead-secret-'))
    const first = await startServer({ dataDir })
    const secretPath = join(dataDir, 'session-secret')
    expect(statSync(secretPath).mode & 0o777).toBe(0o600)
    expect(readFileSync(secretPath, 'utf8').trim().length).toBeGreaterThanOrEqual(32)
    expect(first.output()).toContain('generated a session secret')
    const api = new ApiClient(first.url)
    await api.post('/api/auth/register', { email: 'kept@example.org', password: 'kept-password-1', name: 'Kept', householdName: 'Kept' })
    await first.stop()
    const second = await startServer({ dataDir })
    started.push(second)
    expect(second.output()).not.toContain('generated a session secret')
    const again = new ApiClient(second.url)
    const login = await again.post('/api/auth/login', { email: 'kept@example.org', password: 'kept-password-1' })
    expect(login.status).toBe(200)
  })

  it('refuses to start with a session password shorter than 32 characters', () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'shelfstead-short-'))
    const run = spawnSync(process.execPath, [serverEntry], {
      env: { ...process.env, NUXT_DATA_DIR: dataDir, PORT: '0', NUXT_SESSION_PASSWORD: 'too-short' },
      encoding: 'utf8',
      timeout: 30_000,
    })
    expect(run.status).not.toBe(0)
    expect(run.stderr).toMatch(/at least 32 characters/)
  })

  it('creates no demo household when SHELFSTEAD_DEMO=0', async () => {
    const server = await startServer({ env: { SHELFSTEAD_DEMO: '0' } })
    started.push(server)
    const api = new ApiClient(server.url)
    const res = await api.post('/api/auth/login', { email: 'owner@demo.shelfstead.test', password: 'put-up-2026' })
    expect(res.status).toBe(401)
  })
})
