#!/usr/bin/env node
// The one test command: build the server once, run every vitest project against it on PGlite,
// then the server and browser tests (the e2e project) a second time on a throwaway PostgreSQL
// cluster, and end with the plain line "N passed, N failed" that CI reads, counting both passes.
//   npm test                 both passes
//   npm test -- <filters>    both passes, only the matching files (vitest filters)
//   SHELFSTEAD_TEST_PASSES=pglite npm test    the first pass only (a quicker local run)
import { spawnSync } from 'node:child_process'
import { mkdirSync, readFileSync } from 'node:fs'
import { postgresBin } from './lib/postgres-cluster.mjs'

const env = { ...process.env, NUXT_TELEMETRY_DISABLED: '1' }
const run = (cmd, args, extraEnv = {}) => spawnSync(cmd, args, { stdio: 'inherit', env: { ...env, ...extraEnv } })
const filters = process.argv.slice(2)
const passes = (process.env.SHELFSTEAD_TEST_PASSES ?? 'pglite,postgres').split(',')

// The linter and the type checker count as one check each: a failure is a failed test.
const checks = [['npx', ['eslint', '.']], ['npx', ['nuxt', 'typecheck']]].map(([cmd, args]) => run(cmd, args).status === 0)
const checksFailed = checks.filter(ok => !ok).length

const build = run('npx', ['nuxt', 'build'])
if (build.status !== 0) {
  console.log(`0 passed, ${1 + checksFailed} failed`)
  process.exit(1)
}

mkdirSync('test-results', { recursive: true })

/** One vitest run; its counts from the JSON report. */
function pass(name, args, extraEnv) {
  const report = `test-results/vitest-${name}.json`
  console.log(`\n=== ${name}: vitest run ${args.join(' ')} ===\n`)
  const tests = run('npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...args, ...filters], extraEnv)
  const counts = { passed: 0, failed: 0, skipped: 0 }
  try {
    const result = JSON.parse(readFileSync(report, 'utf8'))
    counts.passed = result.numPassedTests
    // A file that fails outside any test (an error in a hook or at import) counts as one failure.
    const brokenFiles = result.testResults.filter(f => f.status === 'failed' && !f.assertionResults.some(t => t.status === 'failed')).length
    counts.failed = result.numFailedTests + brokenFiles
    counts.skipped = result.numPendingTests + result.numTodoTests
  }
  catch {
    counts.failed = 1
  }
  if (tests.status !== 0 && counts.failed === 0) counts.failed = 1
  console.log(`${name}: ${counts.passed} passed, ${counts.failed} failed${counts.skipped ? `, ${counts.skipped} skipped` : ''}`)
  return counts
}

const hasPostgres = Boolean(postgresBin())

const results = []
if (passes.includes('pglite')) results.push(pass('pglite', [], {}))
if (passes.includes('postgres')) {
  if (hasPostgres) results.push(pass('postgres', ['--project', 'e2e', ...(filters.length ? ['--passWithNoTests'] : [])], { SHELFSTEAD_TEST_DATABASE: 'postgres' }))
  else {
    console.log('The PostgreSQL pass needs Debian\'s PostgreSQL server: apt-get install -y postgresql')
    results.push({ passed: 0, failed: 1, skipped: 0 })
  }
}

const total = results.reduce((a, r) => ({ passed: a.passed + r.passed, failed: a.failed + r.failed, skipped: a.skipped + r.skipped }), { passed: 0, failed: 0, skipped: 0 })
total.passed += checks.length - checksFailed
total.failed += checksFailed
console.log(`${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`)
process.exit(total.failed > 0 ? 1 : 0)
