import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { startPostgres } from '../support/postgres'

let postgres: Awaited<ReturnType<typeof startPostgres>>
let server: RunningServer

beforeAll(async () => {
  postgres = await startPostgres()
  server = await startServer({ env: { DATABASE_URL: postgres.url } })
})
afterAll(async () => {
  await server?.stop()
  await postgres?.stop()
})

describe('on a real PostgreSQL server (DATABASE_URL)', () => {
  it('applies the same migrations and seeds, and serves sign-in and household routes', async () => {
    expect(server.output()).toContain('Database ready (PostgreSQL server)')
    const api = new ApiClient(server.url)
    const { households } = await api.login('owner@demo.shelfstead.test')
    const res = await api.get(`/api/households/${households[0]!.id}`)
    expect(res.status).toBe(200)
    expect(res.body.altitudeFt).toBe(2350)
    const created = await new ApiClient(server.url).post('/api/auth/register', { email: 'pg@example.org', password: 'postgres-works', name: 'Pg', householdName: 'Pg house' })
    expect(created.status).toBe(201)
  })

  it('takes no PGlite lock, so the data directory is not claimed', async () => {
    const { existsSync } = await import('node:fs')
    expect(existsSync(`${server.dataDir}/shelfstead.lock`)).toBe(false)
  })
})
