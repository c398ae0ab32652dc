/**
 * Start-up faults: a server that cannot serve exits non-zero at once with a message naming the
 * port or the directory, before it opens the database or keeps the data-directory lock. These run
 * on PGlite (DATABASE_URL cleared): they are about the data directory and the port.
 */
import { spawn, execFileSync } from 'node:child_process'
import { existsSync, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs'
import { createServer, type Server } from 'node:net'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { freePort, serverEntry, startServer } from '../support/server'

const mounts: string[] = []
const blockers: Server[] = []
afterAll(() => {
  for (const m of mounts) execFileSync('umount', [m])
  for (const b of blockers) b.close()
})

const scratch = (name: string) => mkdtempSync(join(tmpdir(), `shelfstead-${name}-`))

/** Run the built server until it exits (at most 30 s), with the test's settings over the usual ones. */
async function runToExit(env: Record<string, string>) {
  const port = await freePort()
  const started = Date.now()
  const child = spawn(process.execPath, [serverEntry], {
    env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1', SHELFSTEAD_DEMO: '1', NUXT_SESSION_PASSWORD: '', DATABASE_URL: '', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let stderr = ''
  child.stderr!.on('data', (chunk: Buffer) => { stderr += chunk.toString() })
  child.stdout!.resume()
  const timer = setTimeout(() => child.kill('SIGKILL'), 30_000)
  const code = await new Promise<number | null>(done => child.once('exit', c => done(c)))
  clearTimeout(timer)
  return { code, stderr, ms: Date.now() - started }
}

/** A tmpfs of its own (root only), for a read-only or a nearly full disk. */
function mountTmpfs(options: string): string {
  const dir = scratch('mount')
  execFileSync('mount', ['-t', 'tmpfs', '-o', options, 'tmpfs', dir])
  mounts.unshift(dir)
  return dir
}
const root = process.getuid?.() === 0

describe('start-up faults', () => {
  it('a taken port: exits non-zero naming the port, without opening the database or keeping the lock', async () => {
    const blocker = createServer()
    await new Promise<void>(done => blocker.listen(0, '127.0.0.1', done))
    blockers.push(blocker)
    const port = (blocker.address() as { port: number }).port
    const dataDir = scratch('port')
    const run = await runToExit({ NUXT_DATA_DIR: dataDir, PORT: String(port) })
    expect(run.code).toBe(1)
    expect(run.stderr).toContain(`port ${port} on 127.0.0.1 is already in use`)
    expect(run.ms).toBeLessThan(10_000)
    expect(existsSync(join(dataDir, 'pglite')), 'no database opened').toBe(false)
    expect(existsSync(join(dataDir, 'shelfstead.lock')), 'no lock kept').toBe(false)
  })

  it('a data directory that is a file: exits non-zero naming it', async () => {
    const file = join(scratch('file'), 'data')
    writeFileSync(file, 'not a folder')
    const run = await runToExit({ NUXT_DATA_DIR: file })
    expect(run.code).toBe(1)
    expect(run.stderr).toContain(`Cannot use the data directory ${file}: the path (or a folder above it) is a file`)
  })

  it('a data directory that cannot be created (read-only parent): exits non-zero naming it', async () => {
    let parent: string
    if (root) parent = mountTmpfs('ro,size=1m')
    else {
      parent = scratch('ro')
      execFileSync('chmod', ['555', parent])
    }
    const dataDir = join(parent, 'shelfstead')
    const run = await runToExit({ NUXT_DATA_DIR: dataDir })
    expect(run.code).toBe(1)
    expect(run.stderr).toContain(`Cannot use the data directory ${dataDir}: this process may not write there`)
  })

  it.skipIf(!root)('a full disk: exits non-zero naming the directory, before creating a database (root: a 4 MB tmpfs)', async () => {
    const dataDir = join(mountTmpfs('size=4m'), 'data')
    const run = await runToExit({ NUXT_DATA_DIR: dataDir })
    expect(run.code).toBe(1)
    expect(run.stderr).toMatch(new RegExp(`The disk holding the data directory ${dataDir} is full: \\d+ MB free, and a new database needs at least 64 MB`))
    expect(existsSync(join(dataDir, 'pglite'))).toBe(false)
    expect(existsSync(join(dataDir, 'shelfstead.lock'))).toBe(false)
  })

  it('a damaged PGlite directory: exits non-zero naming the folder, and gives the lock back', async () => {
    const dataDir = scratch('damaged')
    const first = await startServer({ dataDir, env: { DATABASE_URL: '' } })
    await first.stop()
    const control = join(dataDir, 'pglite', 'global', 'pg_control')
    expect(existsSync(control)).toBe(true)
    writeFileSync(control, Buffer.alloc(8192, 0x5a))
    const run = await runToExit({ NUXT_DATA_DIR: dataDir })
    expect(run.code).toBe(1)
    expect(run.stderr).toContain(`The database in ${join(dataDir, 'pglite')} could not be opened`)
    expect(run.stderr).toContain('It may be damaged')
    expect(run.ms).toBeLessThan(20_000)
    expect(existsSync(join(dataDir, 'shelfstead.lock')), 'the lock is given back on the way out').toBe(false)
  })

  it('a lock left by a crash whose pid now belongs to another process does not block the start', async () => {
    const dataDir = scratch('stale')
    mkdirSync(dataDir, { recursive: true })
    // pid 1 always runs, and did not start at tick 1
    writeFileSync(join(dataDir, 'shelfstead.lock'), '1 1')
    const server = await startServer({ dataDir, env: { DATABASE_URL: '' } })
    try {
      expect((await fetch(`${server.url}/api/health`)).status).toBe(200)
    }
    finally {
      await server.stop()
    }
  })
})
