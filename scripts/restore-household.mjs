#!/usr/bin/env node
// npm run restore-household -- FILE
// Puts a household backup (GET /api/households/:id/backup) into this site's database: PGlite in
// NUXT_DATA_DIR (default .data/, with the server stopped) or the PostgreSQL of DATABASE_URL.
// Migrations and the published reference data are applied first, as the server does at start.
import { readFileSync } from 'node:fs'
import { refuse, serverCode } from './lib/server-code.mjs'

const path = process.argv[2]
if (!path) refuse('Name the backup file: npm run restore-household -- shelfstead-backup-….json')

let file
try {
  file = JSON.parse(readFileSync(path, 'utf8'))
}
catch (error) {
  refuse(`Cannot read ${path} as a household backup: ${error.message}`)
}

const { serverSettings } = await serverCode('server/utils/settings.ts')
const { lockDataDir, resolveDataDir } = await serverCode('server/utils/dataDir.ts')
const { startDatabase, closeDatabase } = await serverCode('server/utils/database.ts')
const { seedReference } = await serverCode('server/database/seed/index.ts')
const { restoreHousehold, RestoreRefused } = await serverCode('server/utils/backup.ts')
const { usePhotoStorage } = await serverCode('server/utils/storage.ts')

const { databaseUrl } = serverSettings()
const dataDir = resolveDataDir()
let release
try {
  // PGlite is one process at a time: refuse while a server holds the directory.
  if (!databaseUrl) release = lockDataDir(dataDir)
}
catch (error) {
  refuse(error.message)
}

let status = 0
try {
  const { db } = await startDatabase({ dataDir, databaseUrl }, seedReference)
  const report = await restoreHousehold(db, file, usePhotoStorage())
  const rows = Object.values(report.rows).reduce((a, b) => a + b, 0)
  console.log(`[shelfstead] Restored the household “${report.household.name}” (id ${report.household.id}) into ${databaseUrl ? 'the PostgreSQL database of DATABASE_URL' : `PGlite in ${dataDir}`}: ${rows} rows and ${report.photos} photos.`)
  for (const [table, n] of Object.entries(report.rows)) if (n) console.log(`  ${table}: ${n}`)
  if (report.reusedAccounts.length) {
    console.log(`[shelfstead] These accounts were already here (the same people): kept as they were, with their passwords: ${report.reusedAccounts.join(', ')}.`)
  }
}
catch (error) {
  status = 1
  console.error(`[shelfstead] ${error instanceof RestoreRefused ? error.message : `Restore failed: ${error?.stack ?? error}`}`)
}
finally {
  await closeDatabase()
  release?.()
}
process.exit(status)
