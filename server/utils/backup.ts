/**
 * A household's backup: one JSON file with every row the household owns, table by table as
 * PostgreSQL stores it (row_to_json, so timestamps, dates, jsonb and doubles come back exactly),
 * and its photos' bytes in base64. JSON rather than an archive: one file a person can open and
 * check, no packing library, and a household's season is a few megabytes.
 *
 * Imports are explicit (no Nitro auto-imports), so the restore command (scripts/) loads this too.
 */
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { sql, type SQL } from 'drizzle-orm'
import type { Storage } from 'unstorage'
import * as t from '~~/server/database/schema'
import { REFERENCE_VERSION } from '~~/server/database/seed/reference'
import { serverNow } from './clock'
import { migrationsFolder, type Db, type Database } from './database'
import { householdTables, keyColumns, tableName, userColumns } from './backupTables'

export const BACKUP_FORMAT = 'shelfstead-household-backup'
export const BACKUP_FORMAT_VERSION = 1

type Row = Record<string, unknown>

export interface HouseholdBackup {
  format: typeof BACKUP_FORMAT
  formatVersion: number
  madeAt: string
  /** The last database migration applied where it was made. */
  migration: { tag: string, when: number }
  referenceVersion: number
  household: { id: string, name: string }
  /** SQL table name → rows, columns by their SQL names. */
  tables: Record<string, Row[]>
  photos: Array<{ storageKey: string, base64: string }>
  /** Photo rows whose file was already missing from storage where the backup was made. */
  photosMissing: string[]
}

/** A restore that must not go ahead; the message says why and what to do. Nothing was changed. */
export class RestoreRefused extends Error {}

async function rows(db: Db, query: SQL): Promise<Row[]> {
  const result = await db.execute(query) as unknown as { rows: Row[] }
  return result.rows
}

/** The journal entry of the newest migration applied to this database. */
export async function currentMigration(db: Db): Promise<{ tag: string, when: number }> {
  const journal = JSON.parse(readFileSync(join(migrationsFolder(), 'meta', '_journal.json'), 'utf8')) as { entries: Array<{ tag: string, when: number }> }
  const [last] = await rows(db, sql`select created_at from drizzle.__drizzle_migrations order by created_at desc limit 1`)
  const when = Number(last?.created_at)
  const entry = journal.entries.find(e => e.when === when)
  return { tag: entry?.tag ?? 'unknown', when }
}

async function referenceVersionOf(db: Db): Promise<number> {
  const [row] = await rows(db, sql`select version from reference_data where name = 'published'`)
  return Number(row?.version ?? REFERENCE_VERSION)
}

function scopeFilter(scope: string, householdId: string, memberIds: string[]): SQL {
  switch (scope) {
    case 'household': return sql`id = ${householdId}`
    case 'houseRecipe': return sql`recipe_id in (select id from recipes where household_id = ${householdId})`
    case 'members': return memberIds.length ? sql`id in (${sql.join(memberIds.map(id => sql`${id}::uuid`), sql`, `)})` : sql`false`
    default: return sql`household_id = ${householdId}`
  }
}

/**
 * Everything the household owns. Members' accounts come with their password hashes, so each
 * member signs in on the restored site as before (the file is as private as the database:
 * owners only). A site admin's rights are the site's, not the household's: is_admin is false.
 * A person who has left keeps their account out of the file, and the rows naming them name
 * nobody, as when an account is deleted.
 */
export async function exportHousehold(database: Database, householdId: string, storage: Storage): Promise<HouseholdBackup> {
  return database.transaction(async (tx) => {
    await tx.execute(sql`set transaction isolation level repeatable read`)
    await tx.execute(sql`set local time zone 'UTC'`)
    const members = (await rows(tx, sql`select user_id from memberships where household_id = ${householdId}`)).map(r => String(r.user_id))
    const memberSet = new Set(members)
    const tables: Record<string, Row[]> = {}
    for (const { table, scope } of householdTables) {
      const name = tableName(table)
      const order = sql.join(keyColumns(table).map(c => sql.identifier(c)), sql`, `)
      const found = await rows(tx, sql`select row_to_json(r) as row from ${sql.identifier(name)} r where ${scopeFilter(scope, householdId, members)} order by ${order}`)
      const userCols = userColumns(table)
      tables[name] = found.map(({ row }) => {
        const copy = { ...(row as Row) }
        for (const col of userCols) if (copy[col] !== null && !memberSet.has(String(copy[col]))) copy[col] = null
        if (name === 'users') copy.is_admin = false
        return copy
      })
    }
    const photos: HouseholdBackup['photos'] = []
    const photosMissing: string[] = []
    for (const photo of tables.load_photos ?? []) {
      const key = String(photo.storage_key)
      const raw = await storage.getItemRaw(key)
      if (raw) photos.push({ storageKey: key, base64: Buffer.from(raw as ArrayBuffer).toString('base64') })
      else photosMissing.push(key)
    }
    const household = tables.households![0]!
    return {
      format: BACKUP_FORMAT,
      formatVersion: BACKUP_FORMAT_VERSION,
      madeAt: serverNow().toISOString(),
      migration: await currentMigration(tx),
      referenceVersion: await referenceVersionOf(tx),
      household: { id: String(household.id), name: String(household.name) },
      tables,
      photos,
      photosMissing,
    }
  })
}

/** Refuse a file this site cannot restore exactly; the message names what does not fit. */
async function checkFile(db: Db, file: HouseholdBackup) {
  if (!file || typeof file !== 'object' || file.format !== BACKUP_FORMAT) {
    throw new RestoreRefused('This file is not a Shelfstead household backup (its "format" is not shelfstead-household-backup).')
  }
  if (!Number.isInteger(file.formatVersion) || file.formatVersion < 1) throw new RestoreRefused('This backup has no valid formatVersion; it cannot be read.')
  if (file.formatVersion > BACKUP_FORMAT_VERSION) {
    throw new RestoreRefused(`This backup is format ${file.formatVersion}, made by a newer Shelfstead; this site reads format ${BACKUP_FORMAT_VERSION}. Update this site first.`)
  }
  const here = await currentMigration(db)
  if (!(file.migration?.when <= here.when)) {
    throw new RestoreRefused(`This backup was made at database migration ${file.migration?.tag ?? 'unknown'}, newer than this site's ${here.tag}. Update this site first.`)
  }
  const reference = await referenceVersionOf(db)
  if (!(file.referenceVersion <= reference)) {
    throw new RestoreRefused(`This backup names reference data version ${file.referenceVersion}; this site has version ${reference}. Update this site first.`)
  }
  const known = new Set(householdTables.map(h => tableName(h.table)))
  const unknown = Object.keys(file.tables ?? {}).filter(name => !known.has(name))
  if (unknown.length || !file.tables?.households?.length) {
    throw new RestoreRefused(unknown.length ? `This backup has tables this site does not know: ${unknown.join(', ')}.` : 'This backup holds no household.')
  }
}

/**
 * Which accounts of the file the site already has. The same person (same id and e-mail) is
 * kept as they are, password included, and the household joins them: exact, because every row
 * names them by that id. An e-mail taken by another account, or an id with another e-mail,
 * cannot be made exact and is refused.
 */
async function matchAccounts(db: Db, users: Row[]) {
  const reused: string[] = []
  const clashes: string[] = []
  for (const user of users) {
    const [byEmail] = await rows(db, sql`select id, email from users where lower(email) = lower(${String(user.email)})`)
    const [byId] = await rows(db, sql`select id, email from users where id = ${String(user.id)}`)
    if (byEmail && byId && byEmail.id === byId.id) reused.push(String(user.email))
    else if (byEmail || byId) clashes.push(String(user.email))
  }
  return { reused, clashes }
}

export interface RestoreReport {
  household: { id: string, name: string }
  rows: Record<string, number>
  photos: number
  /** Accounts the site already had (the same people): kept as they were. */
  reusedAccounts: string[]
}

/** Put a household backup into this site, in one transaction; refuses (and changes nothing) when it clashes. */
export async function restoreHousehold(database: Database, file: HouseholdBackup, storage: Storage): Promise<RestoreReport> {
  await checkFile(database, file)
  const { id, name } = file.household
  const [existing] = await rows(database, sql`select name from households where id = ${id}`)
  if (existing) {
    throw new RestoreRefused(`This site already has the household “${String(existing.name)}” (id ${id}). A backup is restored only into a site without that household; nothing was changed.`)
  }
  const users = file.tables.users ?? []
  const { reused, clashes } = await matchAccounts(database, users)
  if (clashes.length) {
    throw new RestoreRefused(`This site already has a different account with the e-mail ${clashes.join(', ')}. Restore into a site without those accounts, or remove them first; nothing was changed.`)
  }
  const written: string[] = []
  try {
    for (const photo of file.photos ?? []) {
      await storage.setItemRaw(photo.storageKey, Buffer.from(photo.base64, 'base64'))
      written.push(photo.storageKey)
    }
    const counts: Record<string, number> = {}
    await database.transaction(async (tx) => {
      for (const { table } of householdTables) {
        const tname = tableName(table)
        const all = file.tables[tname] ?? []
        const list = tname === 'users' ? all.filter(u => !reused.includes(String(u.email))) : all
        counts[tname] = all.length
        if (!list.length) continue
        const columns = sql.join([...new Set(list.flatMap(r => Object.keys(r)))].map(c => sql.identifier(c)), sql`, `)
        const overriding = tname === tableName(t.dayEvents) ? sql`overriding system value` : sql``
        await tx.execute(sql`insert into ${sql.identifier(tname)} (${columns}) ${overriding}
          select ${columns} from json_populate_recordset(null::${sql.identifier(tname)}, ${JSON.stringify(list)}::json)`)
      }
      // Day events are ordered by a site-wide sequence: later events must come after the restored ones.
      await tx.execute(sql`select setval(pg_get_serial_sequence('day_events', 'seq'), greatest((select coalesce(max(seq), 1) from day_events), (select last_value from day_events_seq_seq)))`)
    })
    return { household: { id, name }, rows: counts, photos: written.length, reusedAccounts: reused }
  }
  catch (error) {
    for (const key of written) await storage.removeItem(key).catch(() => {})
    if (error instanceof RestoreRefused) throw error
    const e = error as { message?: string, detail?: string, cause?: { message?: string, detail?: string } }
    const why = e.cause?.detail ?? e.detail ?? e.cause?.message ?? e.message
    throw new RestoreRefused(`The backup could not be put in this site's database (${why}); nothing was changed.`)
  }
}

/** "shelfstead-backup-quill-pantry-2026-12-04.json": the household and the day it was made. */
export function backupFileName(backup: Pick<HouseholdBackup, 'household' | 'madeAt'>): string {
  const slug = backup.household.name.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'household'
  return `shelfstead-backup-${slug.slice(0, 40)}-${backup.madeAt.slice(0, 10)}.json`
}
