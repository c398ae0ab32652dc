import { cpSync } from 'node:fs'
import { join, resolve } from 'node:path'

// Root layout: pages/, components/, composables/, stores/, utils/ sit beside server/ at the top level.
export default defineNuxtConfig({
  dir: { app: 'app' },
  srcDir: '.',
  serverDir: 'server',
  compatibilityDate: '2026-11-01',
  // Separate build and output folders let several builds run side by side (tests, benchmarks).
  ...(process.env.SHELFSTEAD_BUILD_DIR ? { buildDir: process.env.SHELFSTEAD_BUILD_DIR } : {}),
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils', '@nuxt/eslint'],
  imports: { dirs: ['stores'] },
  devtools: { enabled: false },
  app: {
    head: {
      htmlAttrs: { lang: 'en' },
      title: 'Shelfstead',
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1' },
        { name: 'description', content: 'Plan, can, check and shelve home-canned beans safely.' },
        { name: 'theme-color', content: '#f3f6f1' },
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  css: ['~/assets/css/main.css'],
  // Only what modules read themselves; the server's own settings come from server/utils/settings.ts.
  runtimeConfig: {
    session: { maxAge: 60 * 60 * 24 * 14 },
  },
  nitro: {
    output: { dir: process.env.SHELFSTEAD_OUTPUT_DIR || '.output' },
  },
  typescript: { strict: true },
  telemetry: false,
  hooks: {
    // `nuxt build` does not carry the SQL migrations into .output: copy them beside the server.
    'nitro:init'(nitro) {
      nitro.hooks.hook('compiled', () => {
        cpSync(resolve('server/database/migrations'), join(nitro.options.output.serverDir, 'migrations'), { recursive: true })
      })
    },
  },
  // The linter's flat config is generated into .nuxt/ (eslint.config.mjs extends it).
  eslint: { config: { stylistic: true } },
  // main.css holds the @tailwind directives; stop the module from injecting a second copy.
  tailwindcss: { cssPath: false },
})
