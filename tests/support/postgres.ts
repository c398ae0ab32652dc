/** A throwaway PostgreSQL cluster on 127.0.0.1 (shared with the benchmarks). */
export { postgresBin, startPostgres } from '~~/scripts/lib/postgres-cluster.mjs'
