import { cpSync } from 'node:fs'
import { join, resolve } from 'node:path'

// Root layout: pages/, components/, composables/, stores/, utils/ sit beside server/ at the top level.
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  srcDir: '.',
  dir: { app: 'app' },
  serverDir: 'server',
  // Separate build and output folders let several builds run side by side (tests, benchmarks).
  ...(process.env.SHELFSTEAD_BUILD_DIR ? { buildDir: process.env.SHELFSTEAD_BUILD_DIR } : {}),
  telemetry: false,
  devtools: { enabled: false },
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils'],
  css: ['~/assets/css/main.css'],
  // main.css holds the @tailwind directives; stop the module from injecting a second copy.
  tailwindcss: { cssPath: false },
  typescript: { strict: true },
  imports: { dirs: ['stores'] },
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
  nitro: {
    output: { dir: process.env.SHELFSTEAD_OUTPUT_DIR || '.output' },
  },
  runtimeConfig: {
    dataDir: '',
    databaseUrl: '',
    demo: '',
    session: { maxAge: 60 * 60 * 24 * 14 },
  },
  hooks: {
    // `nuxt build` does not carry the SQL migrations into .output: copy them beside the server.
    'nitro:init'(nitro) {
      nitro.hooks.hook('compiled', () => {
        cpSync(resolve('server/database/migrations'), join(nitro.options.output.serverDir, 'migrations'), { recursive: true })
      })
    },
  },
})
