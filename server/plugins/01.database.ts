import { dataDirProblem, ensureSessionPassword, lockDataDir, resolveDataDir } from '../utils/dataDir'
import { checkFreeSpace, checkPortFree, describeDatabaseFailure, exitOnListenError } from '../utils/startup'
import { closeDatabase, startDatabase } from '../utils/database'
import { serverSettings } from '../utils/settings'
import { seedDemoIfEmpty, seedReference } from '../database/seed'
import { DEMO_PASSWORD, demoSignIns } from '../database/seed/demo'

/**
 * Start-up: check the port is free, lock the data directory (which also checks it can be
 * created and written) and its free space, make sure sessions can be sealed, open the database,
 * apply migrations and seed. Nitro does not await plugins, so routes await `useDB()` and
 * GET /api/health answers 200 only once this has finished.
 */
export default defineNitroPlugin((nitroApp) => {
  const dataDir = resolveDataDir()
  const { databaseUrl, demo, listen } = serverSettings()
  let release: (() => void) | undefined
  try {
    // Under `nuxt dev` the dev server owns the port and Nitro does not listen on it.
    if (!import.meta.dev) checkPortFree(listen)
    // PGlite is single-process; a real PostgreSQL server does its own locking.
    if (!databaseUrl) {
      release = lockDataDir(dataDir)
      checkFreeSpace(dataDir)
    }
    let secret: ReturnType<typeof ensureSessionPassword>
    try {
      secret = ensureSessionPassword(dataDir)
    }
    catch (error) {
      throw (error as NodeJS.ErrnoException).code ? dataDirProblem(dataDir, error) : error
    }
    if (secret === 'generated') {
      console.info(`[shelfstead] No NUXT_SESSION_PASSWORD given: generated a session secret in ${dataDir}/session-secret (owner-only).`)
    }
  }
  catch (error) {
    const message = error instanceof Error ? error.message : String(error)
    console.error(`[shelfstead] Cannot start: ${message}`)
    process.exit(1)
  }
  if (!import.meta.dev) exitOnListenError(listen)

  startDatabase({ dataDir, databaseUrl }, async (db) => {
    await seedReference(db)
    if (demo && await seedDemoIfEmpty(db, hashPassword)) {
      console.info(`[shelfstead] Demo household created. Sign in with ${demoSignIns.map(s => s.email).join(', ')} — password ${DEMO_PASSWORD}`)
    }
  }).then(
    () => console.info(`[shelfstead] Database ready (${databaseUrl ? 'PostgreSQL server' : `PGlite in ${dataDir}`}).`),
    (error) => {
      console.error(`[shelfstead] Cannot start: ${describeDatabaseFailure(error, { dataDir, databaseUrl })}`)
      console.error(error)
      process.exit(1)
    },
  )

  nitroApp.hooks.hook('close', async () => {
    await closeDatabase()
    release?.()
  })
})
