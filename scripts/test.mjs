#!/usr/bin/env node
// The one test command: build the server once, run every vitest project against it,
// and end with the plain line "N passed, N failed" that CI reads.
import { spawnSync } from 'node:child_process'
import { mkdirSync, readFileSync } from 'node:fs'

const env = { ...process.env, NUXT_TELEMETRY_DISABLED: '1' }
const run = (cmd, args) => spawnSync(cmd, args, { stdio: 'inherit', env })

// The linter and the type checker count as one check each: a failure is a failed test.
const checks = [['npx', ['eslint', '.']], ['npx', ['nuxt', 'typecheck']]].map(([cmd, args]) => run(cmd, args).status === 0)
const checksFailed = checks.filter(ok => !ok).length

const build = run('npx', ['nuxt', 'build'])
if (build.status !== 0) {
  console.log(`0 passed, ${1 + checksFailed} failed`)
  process.exit(1)
}

mkdirSync('test-results', { recursive: true })
const report = 'test-results/vitest.json'
const tests = run('npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...process.argv.slice(2)])

let passed = 0
let failed = 0
let skipped = 0
try {
  const result = JSON.parse(readFileSync(report, 'utf8'))
  passed = result.numPassedTests
  // A file that fails outside any test (an error in a hook or at import) counts as one failure.
  const brokenFiles = result.testResults.filter(f => f.status === 'failed' && !f.assertionResults.some(t => t.status === 'failed')).length
  failed = result.numFailedTests + brokenFiles
  skipped = result.numPendingTests + result.numTodoTests
}
catch {
  failed = 1
}
if (tests.status !== 0 && failed === 0) failed = 1
passed += checks.length - checksFailed
failed += checksFailed
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`)
process.exit(failed > 0 || tests.status !== 0 ? 1 : 0)
