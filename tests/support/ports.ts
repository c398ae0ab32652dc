/** A loopback port that was free a moment ago (shared with the benchmarks). */
export { freePort } from '~~/scripts/lib/ports.mjs'
