import type { TestProject } from 'vitest/node'
import { startPostgres } from './postgres'

declare module 'vitest' {
  export interface ProvidedContext {
    postgresUrl: string
  }
}

/**
 * Global set-up of the server and browser tests: on the PostgreSQL pass
 * (SHELFSTEAD_TEST_DATABASE=postgres) one throwaway cluster of Debian's PostgreSQL on
 * 127.0.0.1 for the whole run, run as the postgres user, removed at the end.
 */
export default async function setup(project: TestProject) {
  if (process.env.SHELFSTEAD_TEST_DATABASE !== 'postgres') {
    project.provide('postgresUrl', '')
    return
  }
  const cluster = await startPostgres()
  project.provide('postgresUrl', cluster.url)
  console.info(`[tests] PostgreSQL pass: every server gets its own database on ${cluster.url}`)
  return async () => { await cluster.stop() }
}
