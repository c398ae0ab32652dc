import { ensureSessionPassword, lockDataDir, resolveDataDir } from '../utils/dataDir'
import { closeDatabase, startDatabase } from '../utils/database'
import { serverSettings } from '../utils/settings'
import { seedDemoIfEmpty, seedReference } from '../database/seed'
import { DEMO_PASSWORD, demoSignIns } from '../database/seed/demo'

/**
 * Start-up: lock the data directory, make sure sessions can be sealed, open the database,
 * apply migrations and seed. Nitro does not await plugins, so routes await `useDB()` and
 * GET /api/health answers 200 only once this has finished.
 */
export default defineNitroPlugin((nitroApp) => {
  const dataDir = resolveDataDir()
  const { databaseUrl, demo } = serverSettings()
  let release: (() => void) | undefined
  try {
    // PGlite is single-process; a real PostgreSQL server does its own locking.
    if (!databaseUrl) release = lockDataDir(dataDir)
    const secret = ensureSessionPassword(dataDir)
    if (secret === 'generated') {
      console.info(`[shelfstead] No NUXT_SESSION_PASSWORD given: generated a session secret in ${dataDir}/session-secret (owner-only).`)
    }
  }
  catch (error) {
    const message = error instanceof Error ? error.message : String(error)
    console.error(`[shelfstead] Cannot start: ${message}`)
    process.exit(1)
  }

  startDatabase({ dataDir, databaseUrl }, async (db) => {
    await seedReference(db)
    if (demo && await seedDemoIfEmpty(db, hashPassword)) {
      console.info(`[shelfstead] Demo household created. Sign in with ${demoSignIns.map(s => s.email).join(', ')} — password ${DEMO_PASSWORD}`)
    }
  }).then(
    () => console.info(`[shelfstead] Database ready (${databaseUrl ? 'PostgreSQL server' : `PGlite in ${dataDir}`}).`),
    (error) => {
      console.error('[shelfstead] Database start failed:', error)
      process.exit(1)
    },
  )

  nitroApp.hooks.hook('close', async () => {
    await closeDatabase()
    release?.()
  })
})
