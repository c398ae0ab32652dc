import { chmodSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { basename, dirname, join, resolve } from 'node:path'
import { serverSettings } from './settings'

/**
 * The absolute data directory: NUXT_DATA_DIR when set, else `.data/` in the project.
 * A built server (`.output/server/index.mjs`) counts the folder holding `.output` as the project,
 * so `nuxt preview` and `node .output/server/index.mjs` share the data of `nuxt dev`.
 */
export function resolveDataDir(configured = serverSettings().dataDir): string {
  if (configured) return configured
  const entry = process.argv[1] ? resolve(process.argv[1]) : ''
  const outputDir = dirname(dirname(entry))
  if (basename(outputDir) === '.output') return join(dirname(outputDir), '.data')
  return resolve('.data')
}

/** A reason not to start that a person can fix; the message names the directory or port. */
export class StartupRefusal extends Error {}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0)
    return true
  }
  catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM'
  }
}

/**
 * When the process `pid` started, in clock ticks since boot (field 22 of /proc/<pid>/stat), or
 * null where there is no /proc (not Linux) or no such process. A pid is reused after its process
 * ends; the pair pid + start time names one process.
 */
export function processStartTime(pid: number): string | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8')
    // "pid (comm) state ppid …": comm may hold spaces and parentheses, so count from the last ")".
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ')
    return fields[19] ?? null // field 3 (state) is fields[0], so field 22 is fields[19]
  }
  catch {
    return null
  }
}

interface LockHolder { pid: number, startTime: string | null }

/** The lock file's holder: "pid start-time" (or a bare pid, as written before start times were kept). */
export function readLockHolder(text: string): LockHolder | null {
  const [pidText, startTime] = text.trim().split(/\s+/)
  const pid = Number(pidText)
  if (!Number.isInteger(pid) || pid <= 0) return null
  return { pid, startTime: startTime ?? null }
}

/** The holder still runs: its pid is alive and, where start times can be read, it is the same process. */
function holderRuns(holder: LockHolder): boolean {
  if (!isAlive(holder.pid)) return false
  if (holder.startTime === null) return true
  const now = processStartTime(holder.pid)
  return now === null || now === holder.startTime
}

/** An error from the file system about the data directory, in words that say what to do. */
export function dataDirProblem(dataDir: string, error: unknown): StartupRefusal {
  const code = (error as NodeJS.ErrnoException).code
  const why = code === 'EACCES' || code === 'EPERM' || code === 'EROFS'
    ? 'this process may not write there'
    : code === 'ENOTDIR' || code === 'EEXIST'
      ? 'the path (or a folder above it) is a file, not a folder'
      : code === 'ENOSPC' || code === 'EDQUOT'
        ? 'the disk is full'
        : `the system said ${code ?? (error as Error).message}`
  return new StartupRefusal(
    `Cannot use the data directory ${dataDir}: ${why}. `
    + 'Set NUXT_DATA_DIR to a folder this server may create and write, or fix the permissions or free some space.',
  )
}

/**
 * Take the data directory for this process. PGlite has no lock of its own: two servers on one
 * directory each see only their own writes and the last to close wins, so a second server must
 * refuse to start. The lock file holds the owner's pid and the start time of that process
 * (Linux), so a lock left by a crash is taken over even when its pid has since been given to
 * another process. Written by hand because the well-known lock packages (proper-lockfile: a
 * directory and its mtime) do not record the holder's pid, which the refusal message must name.
 * Writing the lock is also the check that the directory can be written.
 */
export function lockDataDir(dataDir: string, pid = process.pid): () => void {
  try {
    mkdirSync(dataDir, { recursive: true })
  }
  catch (error) {
    // A recursive mkdir reports a read-only parent as ENOENT; a plain one says EROFS or EACCES.
    let reason = error
    try {
      mkdirSync(dataDir)
    }
    catch (plain) {
      if ((plain as NodeJS.ErrnoException).code !== 'ENOENT') reason = plain
    }
    throw dataDirProblem(dataDir, reason)
  }
  const lockPath = join(dataDir, 'shelfstead.lock')
  const mine = `${pid} ${processStartTime(pid) ?? ''}`.trim()
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      writeFileSync(lockPath, mine, { flag: 'wx' })
      const release = () => {
        try {
          if (readFileSync(lockPath, 'utf8').trim() === mine) rmSync(lockPath)
        }
        catch { /* already gone */ }
      }
      process.once('exit', release)
      return release
    }
    catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw dataDirProblem(dataDir, error)
      const holder = readLockHolder(readFileSync(lockPath, 'utf8'))
      if (holder?.pid === pid) return () => rmSync(lockPath, { force: true })
      if (holder && holderRuns(holder)) {
        throw new StartupRefusal(
          `The data directory ${dataDir} is in use by another Shelfstead server (pid ${holder.pid}). `
          + 'Stop that server first, or give this one its own directory with NUXT_DATA_DIR.',
        )
      }
      rmSync(lockPath, { force: true })
    }
  }
  throw new StartupRefusal(`Could not take the lock on the data directory ${dataDir}; another server may be starting on it. Try again.`)
}

/**
 * nuxt-auth-utils seals session cookies with NUXT_SESSION_PASSWORD (at least 32 characters).
 * A self-hosted start without one gets a random secret kept in the data directory (owner-only),
 * so sessions survive restarts and no sign-in ever fails for want of a secret.
 */
// The one write to the environment: nuxt-auth-utils reads its secret from NUXT_SESSION_PASSWORD.
export function ensureSessionPassword(dataDir: string, env: NodeJS.ProcessEnv = process.env): 'env' | 'file' | 'generated' {
  const given = env.NUXT_SESSION_PASSWORD
  if (given) {
    if (given.length < 32) throw new Error('NUXT_SESSION_PASSWORD must be at least 32 characters long.')
    return 'env'
  }
  const secretPath = join(dataDir, 'session-secret')
  let source: 'file' | 'generated' = 'file'
  if (!existsSync(secretPath)) {
    writeFileSync(secretPath, randomBytes(48).toString('base64url'), { mode: 0o600, flag: 'wx' })
    source = 'generated'
  }
  chmodSync(secretPath, 0o600)
  env.NUXT_SESSION_PASSWORD = readFileSync(secretPath, 'utf8').trim()
  return source
}
