import { expect } from 'vitest'
import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { freePort } from './ports'
import { databaseFor } from './databases'

export { freePort }

export const serverEntry = resolve(process.env.SHELFSTEAD_OUTPUT_DIR || '.output', 'server/index.mjs')

export interface RunningServer {
  url: string
  dataDir: string
  /** The PostgreSQL database this server uses (the PostgreSQL pass, or a test's own), else PGlite. */
  databaseUrl?: string
  process: ChildProcess
  output: () => string
  stop: () => Promise<void>
}

/** Start the built server (.output) on a free loopback port with its own data directory. */
export async function startServer(options: { dataDir?: string, env?: Record<string, string> } = {}): Promise<RunningServer> {
  const dataDir = options.dataDir ?? mkdtempSync(join(tmpdir(), 'shelfstead-test-'))
  const port = await freePort()
  // A test that sets DATABASE_URL itself (a URL, or '' for PGlite) decides; else this run's pass does.
  const databaseUrl = options.env && 'DATABASE_URL' in options.env
    ? options.env.DATABASE_URL || undefined
    : await databaseFor(dataDir)
  let log = ''
  const child = spawn(process.execPath, [serverEntry], {
    env: {
      ...process.env,
      NUXT_DATA_DIR: dataDir,
      PORT: String(port),
      HOST: '127.0.0.1',
      NITRO_HOST: '127.0.0.1',
      SHELFSTEAD_DEMO: '1',
      NUXT_SESSION_PASSWORD: '',
      // links in mail point where the test's browser already is (cookies are per host)
      SHELFSTEAD_PUBLIC_URL: `http://127.0.0.1:${port}`,
      ...options.env,
      DATABASE_URL: databaseUrl ?? '',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  child.stdout!.on('data', (chunk: Buffer) => { log += chunk.toString() })
  child.stderr!.on('data', (chunk: Buffer) => { log += chunk.toString() })
  const url = `http://127.0.0.1:${port}`
  const deadline = Date.now() + 60_000
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`Server exited early (${child.exitCode}):\n${log}`)
    try {
      const res = await fetch(`${url}/api/health`)
      if (res.status === 200) break
    }
    catch { /* not listening yet */ }
    await new Promise(r => setTimeout(r, 200))
  }
  if (Date.now() >= deadline) throw new Error(`Server did not become healthy:\n${log}`)
  return {
    url,
    dataDir,
    databaseUrl,
    process: child,
    output: () => log,
    stop: () => new Promise<void>((done) => {
      if (child.exitCode !== null) return done()
      child.once('exit', () => done())
      child.kill('SIGTERM')
    }),
  }
}

/** A tiny cookie-keeping client for API tests. */
export class ApiClient {
  private cookie = ''
  constructor(private readonly base: string) {}

  async request(method: string, path: string, body?: unknown): Promise<{ status: number, body: any }> { // eslint-disable-line @typescript-eslint/no-explicit-any -- test helper returns arbitrary JSON
    const res = await fetch(this.base + path, {
      method,
      headers: { ...(body === undefined ? {} : { 'content-type': 'application/json' }), ...(this.cookie ? { cookie: this.cookie } : {}) },
      body: body === undefined ? undefined : JSON.stringify(body),
    })
    const setCookie = res.headers.getSetCookie()
    if (setCookie.length) this.cookie = setCookie.map(c => c.split(';')[0]).join('; ')
    const text = await res.text()
    let parsed: unknown = text
    try { parsed = JSON.parse(text) }
    catch { /* not JSON */ }
    return { status: res.status, body: parsed }
  }

  /** The session cookie, for requests made with fetch directly (uploads, CSV). */
  get cookieHeader() { return this.cookie }

  get(path: string) { return this.request('GET', path) }
  post(path: string, body?: unknown) { return this.request('POST', path, body ?? {}) }
  patch(path: string, body: unknown) { return this.request('PATCH', path, body) }
  put(path: string, body: unknown) { return this.request('PUT', path, body) }
  delete(path: string) { return this.request('DELETE', path) }

  async login(email: string, password = 'put-up-2026') {
    const res = await this.post('/api/auth/login', { email, password })
    if (res.status !== 200) throw new Error(`login failed for ${email}: ${res.status} ${JSON.stringify(res.body)}`)
    return res.body as { user: { id: string }, households: Array<{ id: string, name: string, role: string }> }
  }
}

/**
 * An error answer in the API's envelope that names `field`: the field in `data.field`, and a
 * message for a person (never starting with the field path), matching `pattern` when given.
 */
export function expectField(res: { body: any }, field: string, pattern?: RegExp) { // eslint-disable-line @typescript-eslint/no-explicit-any -- test JSON
  expect(res.body.data?.field, JSON.stringify(res.body)).toBe(field)
  expect(res.body.message).not.toMatch(new RegExp(`^${field.replace(/\./g, '\\.')}:`))
  expect(res.body.message).not.toMatch(/^(Expected|Required|Invalid|String must|Number must)/)
  if (pattern) expect(res.body.message).toMatch(pattern)
}
