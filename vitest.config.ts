import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'
import { defineVitestProject } from '@nuxt/test-utils/config'

// The same root alias Nuxt gives app and server code (`~~/utils/…`), for the plain node projects.
const alias = { '~~': fileURLToPath(new URL('.', import.meta.url)) }

// Three projects: pure unit tests (node), component tests (nuxt environment),
// and end-to-end tests against the built server in .output (see scripts/test.mjs).
export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
          benchmark: { include: ['tests/bench/**/*.bench.ts'] },
        },
      },
      await defineVitestProject({
        test: {
          name: 'nuxt',
          include: ['tests/nuxt/**/*.test.ts'],
          environment: 'nuxt',
        },
      }),
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          // the PostgreSQL pass (SHELFSTEAD_TEST_DATABASE=postgres) starts one throwaway cluster
          globalSetup: ['tests/support/postgres-global.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
})
