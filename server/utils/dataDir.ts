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

class DataDirLockedError extends Error {}

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
 * Take the data directory for this process. PGlite has no lock of its own: two servers on one
 * directory each see only their own writes and the last to close wins, so a second server must
 * refuse to start. The lock file holds the owner's pid; a lock left by a dead process is taken over.
 * Written by hand because the well-known lock packages do not record the holder's pid, which
 * the refusal message must name.
 */
export function lockDataDir(dataDir: string): () => void {
  mkdirSync(dataDir, { recursive: true })
  const lockPath = join(dataDir, 'shelfstead.lock')
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      writeFileSync(lockPath, String(process.pid), { flag: 'wx' })
      const release = () => {
        try {
          if (readFileSync(lockPath, 'utf8').trim() === String(process.pid)) rmSync(lockPath)
        }
        catch { /* already gone */ }
      }
      process.once('exit', release)
      return release
    }
    catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error
      const holder = Number.parseInt(readFileSync(lockPath, 'utf8').trim(), 10)
      if (holder === process.pid) return () => rmSync(lockPath, { force: true })
      if (Number.isInteger(holder) && isAlive(holder)) {
        throw new DataDirLockedError(
          `The data directory ${dataDir} is in use by another Shelfstead server (pid ${holder}). `
          + 'Stop that server first, or give this one its own directory with NUXT_DATA_DIR.',
        )
      }
      rmSync(lockPath, { force: true })
    }
  }
  throw new DataDirLockedError(`Could not take the lock on the data directory ${dataDir}.`)
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
