import { execFileSync } from 'node:child_process'
import { existsSync, statfsSync } from 'node:fs'
import { join } from 'node:path'
import { StartupRefusal } from './dataDir'
import { minFreeBytes, type ServerSettings } from './settings'

/**
 * Start-up refusals: each names the port or the directory and says what to do, and the server
 * exits non-zero before it opens the database, rather than sitting half-alive.
 */

type Listen = ServerSettings['listen']

function portWords(listen: Listen): string {
  return `port ${listen.port}${listen.host ? ` on ${listen.host}` : ''}`
}

function portTaken(listen: Listen, code: string): StartupRefusal {
  const why = code === 'EADDRINUSE' ? 'is already in use by another program' : code === 'EACCES' ? 'may not be used by this user' : `cannot be listened on (${code})`
  return new StartupRefusal(`The ${portWords(listen)} ${why}. Stop that program, or give this server another port with PORT.`)
}

// Run in a child so that the check is synchronous: Nitro listens right after the plugins run,
// and a probe in this process would hold the port against Nitro itself.
const probe = `const s=require('node:net').createServer();s.once('error',e=>{process.stdout.write(String(e.code));process.exit(3)});`
  + `s.listen({port:Number(process.argv[1]),host:process.argv[2]||undefined},()=>s.close(()=>process.exit(0)))`

/** Refuse when the port Nitro is about to listen on is taken (checked before the database opens). */
export function checkPortFree(listen: Listen): void {
  if (listen.socket || listen.port === 0) return
  try {
    execFileSync(process.execPath, ['-e', probe, String(listen.port), listen.host ?? ''], { stdio: ['ignore', 'pipe', 'ignore'], timeout: 10_000 })
  }
  catch (error) {
    const code = String((error as { stdout?: Buffer }).stdout ?? '').trim()
    if (code) throw portTaken(listen, code)
    // the probe itself could not run: leave it to Nitro's listen and the handler below
  }
}

/** A port taken between the check and Nitro's listen: Nitro only logs it, so exit here. */
export function exitOnListenError(listen: Listen): void {
  process.on('uncaughtException', (error: NodeJS.ErrnoException) => {
    if (error.syscall !== 'listen') return
    console.error(`[shelfstead] Cannot start: ${portTaken(listen, error.code ?? 'unknown').message}`)
    process.exit(1)
  })
}

/** Refuse a data directory on a disk too full to create or run the database. */
export function checkFreeSpace(dataDir: string): void {
  const fresh = !existsSync(join(dataDir, 'pglite', 'PG_VERSION'))
  const needed = fresh ? minFreeBytes.newDatabase : minFreeBytes.existingDatabase
  let free: number
  try {
    const stats = statfsSync(dataDir)
    free = stats.bavail * stats.bsize
  }
  catch {
    return // no statfs here: PGlite's own error is mapped by describeDatabaseFailure
  }
  if (free < needed) {
    const mb = (n: number) => `${Math.floor(n / 1024 / 1024)} MB`
    throw new StartupRefusal(
      `The disk holding the data directory ${dataDir} is full: ${mb(free)} free, and ${fresh ? 'a new database' : 'the database'} needs at least ${mb(needed)}. `
      + 'Free some space, or set NUXT_DATA_DIR to a folder on another disk.',
    )
  }
}

/** Emscripten's errno numbers (PGlite's file system), for the failures a person can fix. */
const emscriptenErrno: Record<number, string> = { 51: 'ENOSPC', 69: 'EROFS', 2: 'EACCES' }

/** Why the database did not open, naming the directory (PGlite) or the server (PostgreSQL). */
export function describeDatabaseFailure(error: unknown, options: { dataDir: string, databaseUrl?: string }): string {
  const e = error as { code?: string, errno?: number, name?: string, message?: string }
  if (options.databaseUrl) {
    let where = 'the server named by DATABASE_URL'
    try {
      const url = new URL(options.databaseUrl)
      where = `the PostgreSQL server at ${url.hostname}:${url.port || 5432} (DATABASE_URL)`
    }
    catch { /* not a URL: keep the general words */ }
    return `Could not open the database on ${where}: ${e.message ?? String(error)}. Check that it runs and that DATABASE_URL is right.`
  }
  const folder = join(options.dataDir, 'pglite')
  const code = e.code ?? (e.name === 'ErrnoError' && e.errno !== undefined ? emscriptenErrno[e.errno] : undefined)
  if (code === 'ENOSPC' || /no space left/i.test(e.message ?? '')) {
    return `The disk holding the data directory ${options.dataDir} is full. Free some space, or set NUXT_DATA_DIR to a folder on another disk.`
  }
  if (code === 'EROFS' || code === 'EACCES' || code === 'EPERM') {
    return `The database folder ${folder} cannot be written by this server. Fix its permissions, or set NUXT_DATA_DIR to a folder this server may write.`
  }
  return `The database in ${folder} could not be opened (${e.message ?? String(error)}). It may be damaged: `
    + 'restore the data directory from a backup, or move it aside to start with an empty one.'
}
