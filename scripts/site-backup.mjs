#!/usr/bin/env node
// npm run backup -- FILE   /   npm run restore -- FILE
// The whole site in one .tar.gz: the database (PGlite's own data-directory dump, or pg_dump's
// custom format for DATABASE_URL), the photos kept in the data directory, and a small header.
// PGlite is backed up and restored with the server stopped (the data-directory lock says so);
// PostgreSQL may be backed up while the server runs, and is restored into an empty database.
import { execFileSync } from 'node:child_process'
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { PGlite } from '@electric-sql/pglite'
import pg from 'pg'
import * as tar from 'tar'
import { refuse, serverCode } from './lib/server-code.mjs'

const FORMAT = 'shelfstead-site-backup'
const FORMAT_VERSION = 1
const [mode, target] = process.argv.slice(2)
if (!['backup', 'restore'].includes(mode) || !target) refuse('Usage: npm run backup -- FILE.tar.gz, or npm run restore -- FILE.tar.gz')
const file = resolve(target)

const { serverSettings } = await serverCode('server/utils/settings.ts')
const { lockDataDir, resolveDataDir } = await serverCode('server/utils/dataDir.ts')
const { databaseUrl, storage } = serverSettings()
const dataDir = resolveDataDir()
const pgliteDir = join(dataDir, 'pglite')
const photosDir = join(dataDir, 'photos')
const work = mkdtempSync(join(tmpdir(), 'shelfstead-site-'))
const notEmpty = dir => existsSync(dir) && readdirSync(dir).length > 0

let release
let failure
try {
  if (!databaseUrl) release = lockDataDir(dataDir)
  if (mode === 'backup') await backup()
  else await restore()
}
catch (error) {
  failure = error
}
finally {
  release?.()
  rmSync(work, { recursive: true, force: true })
}
if (failure) refuse(failure.message)

/** Run a PostgreSQL tool; its own message goes to stderr, and the error never repeats the URL (it may hold a password). */
function pgTool(command, args) {
  try {
    execFileSync(command, args, { stdio: ['ignore', 'ignore', 'inherit'] })
  }
  catch {
    throw new Error(`${command} failed (its message is above); nothing more was done.`)
  }
}

async function backup() {
  if (databaseUrl) {
    pgTool('pg_dump', ['--format=custom', '--no-owner', '--no-privileges', '--file', join(work, 'database.pgdump'), '--dbname', databaseUrl])
  }
  else {
    if (!notEmpty(pgliteDir)) throw new Error(`There is no database in ${dataDir} to back up (set NUXT_DATA_DIR to the server's data directory).`)
    const db = await PGlite.create(pgliteDir)
    const dump = await db.dumpDataDir('gzip')
    await db.close()
    writeFileSync(join(work, 'pglite-data.tar.gz'), Buffer.from(await dump.arrayBuffer()))
  }
  const entries = [databaseUrl ? 'database.pgdump' : 'pglite-data.tar.gz']
  if (storage === 'fs' && notEmpty(photosDir)) {
    cpSync(photosDir, join(work, 'photos'), { recursive: true })
    entries.push('photos')
  }
  writeFileSync(join(work, 'shelfstead-site-backup.json'), JSON.stringify({ format: FORMAT, formatVersion: FORMAT_VERSION, madeAt: new Date().toISOString(), database: databaseUrl ? 'postgresql' : 'pglite' }, null, 2))
  await tar.c({ gzip: true, file, cwd: work }, ['shelfstead-site-backup.json', ...entries])
  console.log(`[shelfstead] Site backup written to ${file} (${databaseUrl ? 'PostgreSQL, pg_dump' : `PGlite from ${dataDir}`}${entries.includes('photos') ? ', with the photos' : ''}).`)
  if (storage === 's3') console.log('[shelfstead] Photos are kept in the S3 bucket: back the bucket up with its own tools.')
}

async function restore() {
  if (!existsSync(file)) throw new Error(`No such file: ${file}`)
  await tar.x({ file, cwd: work })
  const header = JSON.parse(readFileSync(join(work, 'shelfstead-site-backup.json'), 'utf8'))
  if (header.format !== FORMAT) throw new Error(`${file} is not a Shelfstead site backup.`)
  if (header.formatVersion > FORMAT_VERSION) throw new Error(`${file} is site backup format ${header.formatVersion}, made by a newer Shelfstead; update this one first.`)
  const wanted = databaseUrl ? 'postgresql' : 'pglite'
  if (header.database !== wanted) {
    throw new Error(`${file} holds a ${header.database === 'pglite' ? 'PGlite (embedded)' : 'PostgreSQL'} database; this site uses ${wanted === 'pglite' ? 'PGlite (no DATABASE_URL)' : 'DATABASE_URL'}. Restore it where it came from, or move a household across with its household backup.`)
  }
  if (databaseUrl) {
    const client = new pg.Client({ connectionString: databaseUrl })
    await client.connect()
    const { rows } = await client.query(`select count(*)::int as n from information_schema.tables where table_schema not in ('pg_catalog', 'information_schema')`)
    await client.end()
    if (rows[0].n > 0) throw new Error('The database of DATABASE_URL is not empty. Restore into a new, empty database (createdb), then point the server at it.')
    pgTool('pg_restore', ['--no-owner', '--no-privileges', '--exit-on-error', '--dbname', databaseUrl, join(work, 'database.pgdump')])
  }
  else {
    if (notEmpty(pgliteDir)) throw new Error(`${dataDir} already holds a database. Restore into a new data directory (NUXT_DATA_DIR), or move that one away first.`)
    const db = await PGlite.create(pgliteDir, { loadDataDir: new Blob([readFileSync(join(work, 'pglite-data.tar.gz'))]) })
    await db.query('select 1')
    await db.close()
  }
  if (existsSync(join(work, 'photos'))) cpSync(join(work, 'photos'), photosDir, { recursive: true, force: false })
  console.log(`[shelfstead] Restored the site from ${file} into ${databaseUrl ? 'the database of DATABASE_URL' : dataDir}. Start the server as usual; people sign in again.`)
}
