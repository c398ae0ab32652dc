import { existsSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { PGlite } from '@electric-sql/pglite'
import { serverSettings } from './settings'
import { drizzle as drizzlePglite, type PgliteDatabase } from 'drizzle-orm/pglite'
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator'
import { drizzle as drizzlePg } from 'drizzle-orm/node-postgres'
import { migrate as migratePg } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'
import * as schema from '../database/schema'

export const tables = schema

/**
 * Both drivers expose the same PgDatabase API; the PGlite type stands for both
 * (node-postgres differs only in its raw query-result type, which we never use).
 */
export type Database = PgliteDatabase<typeof schema>
/** A transaction handed to `db.transaction(tx => …)`. */
export type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]
/** Either: reads that run inside or outside a transaction. */
export type Db = Database | Tx

interface OpenDatabase {
  db: Database
  close: () => Promise<void>
}

/**
 * Any number for the PostgreSQL advisory lock that app servers starting at once on one database
 * take in turn, so migrations and seeding run once, whole, before the next server looks.
 */
const STARTUP_LOCK = 0x5E1F_57EA

let opening: Promise<OpenDatabase> | undefined
let ready = false

/** Where the drizzle-kit migrations are: copied next to the built server, or in the source tree. */
export function migrationsFolder(): string {
  const candidates = [
    serverSettings().migrationsDir,
    process.argv[1] ? join(dirname(resolve(process.argv[1])), 'migrations') : undefined,
    resolve('server/database/migrations'),
  ].filter((c): c is string => Boolean(c))
  const found = candidates.find(c => existsSync(join(c, 'meta', '_journal.json')))
  if (!found) throw new Error(`No database migrations found (looked in ${candidates.join(', ')}).`)
  return found
}

/** Open the database, and apply the migrations and `afterMigrate` (seeding) as one server at a time. */
async function open(options: { dataDir: string, databaseUrl?: string }, afterMigrate: (db: Database) => Promise<void>): Promise<OpenDatabase> {
  const folder = migrationsFolder()
  if (options.databaseUrl) {
    const pool = new pg.Pool({ connectionString: options.databaseUrl })
    const db = drizzlePg(pool, { schema, casing: 'snake_case' })
    const holder = await pool.connect()
    try {
      await holder.query('select pg_advisory_lock($1)', [STARTUP_LOCK])
      await migratePg(db, { migrationsFolder: folder })
      await afterMigrate(db as unknown as Database)
    }
    finally {
      await holder.query('select pg_advisory_unlock($1)', [STARTUP_LOCK]).catch(() => {})
      holder.release()
    }
    return { db: db as unknown as Database, close: () => pool.end() }
  }
  // PGlite is one process's (the data-directory lock keeps out a second server).
  const client = await PGlite.create(join(options.dataDir, 'pglite'))
  const db = drizzlePglite(client, { schema, casing: 'snake_case' })
  await migratePglite(db, { migrationsFolder: folder })
  await afterMigrate(db)
  return { db, close: () => client.close() }
}

/** Open the database once, apply migrations, then run `afterMigrate` (seeding) before anyone may use it. */
export function startDatabase(
  options: { dataDir: string, databaseUrl?: string },
  afterMigrate: (db: Database) => Promise<void>,
): Promise<OpenDatabase> {
  opening ??= open(options, afterMigrate).then((opened) => {
    ready = true
    return opened
  })
  return opening
}

/** The database, once migrations and seeding are done. Every route awaits this. */
export async function useDB(): Promise<Database> {
  if (!opening) throw new Error('The database has not been started.')
  return (await opening).db
}

export function isDatabaseReady(): boolean {
  return ready
}

export async function closeDatabase(): Promise<void> {
  if (!opening) return
  const opened = await opening.catch(() => undefined)
  opening = undefined
  ready = false
  await opened?.close()
}

/** The one row an `insert … returning()` or `update … returning()` wrote; a write that returned none is a defect. */
export function written<T>(rows: T[]): T {
  const row = rows[0]
  if (!row) throw new Error('The write returned no row')
  return row
}

/** A unique index said no (PostgreSQL 23505), through drizzle's wrapper or not. */
export function isUniqueViolation(error: unknown): boolean {
  const e = error as { code?: string, cause?: { code?: string } }
  return (e.code ?? e.cause?.code) === '23505'
}
