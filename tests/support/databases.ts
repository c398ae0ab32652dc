import { createHash } from 'node:crypto'
import { join } from 'node:path'
import { inject } from 'vitest'
import pg from 'pg'
import { PGlite } from '@electric-sql/pglite'

/**
 * Which database the servers of this test run use. The test command runs the server and
 * browser tests twice: on PGlite (each server's data directory), then with
 * SHELFSTEAD_TEST_DATABASE=postgres, where each data directory gets its own database on one
 * throwaway PostgreSQL cluster (started by tests/support/postgres-global.ts).
 */
export const onPostgres = process.env.SHELFSTEAD_TEST_DATABASE === 'postgres'

function clusterUrl(): string {
  const url = inject('postgresUrl')
  if (!url) throw new Error('SHELFSTEAD_TEST_DATABASE=postgres, but no PostgreSQL cluster was started for this run.')
  return url
}

/** The cluster URL with another database name. */
function withDatabase(url: string, name: string): string {
  const u = new URL(url)
  u.pathname = `/${name}`
  return u.toString()
}

/**
 * The DATABASE_URL for a server on `dataDir` in this run: undefined on the PGlite pass; on the
 * PostgreSQL pass a database of its own, created on first use and kept for a restart on the
 * same directory (so tests that restart a server see the same data, as with PGlite).
 */
export async function databaseFor(dataDir: string): Promise<string | undefined> {
  if (!onPostgres) return undefined
  const admin = clusterUrl()
  const name = `t_${createHash('sha256').update(dataDir).digest('hex').slice(0, 20)}`
  const client = new pg.Client({ connectionString: admin })
  await client.connect()
  try {
    await client.query(`create database ${name}`)
  }
  catch (error) {
    if ((error as { code?: string }).code !== '42P04') throw error // 42P04: it already exists
  }
  finally {
    await client.end()
  }
  return withDatabase(admin, name)
}

/**
 * Run SQL against a stopped (PGlite) or running (PostgreSQL) server's database, for tests that
 * set up a state no route can make (an older release's data, say).
 */
export async function queryDatabase(server: { dataDir: string, databaseUrl?: string }, sql: string, params: unknown[] = []): Promise<unknown[]> {
  if (server.databaseUrl) {
    const client = new pg.Client({ connectionString: server.databaseUrl })
    await client.connect()
    try {
      return (await client.query(sql, params)).rows
    }
    finally {
      await client.end()
    }
  }
  const db = await PGlite.create(join(server.dataDir, 'pglite'))
  try {
    return (await db.query(sql, params)).rows
  }
  finally {
    await db.close()
  }
}
