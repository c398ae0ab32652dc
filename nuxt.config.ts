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
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils', '@nuxt/eslint', '@vite-pwa/nuxt'],
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
      link: [
        { rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' },
        { rel: 'apple-touch-icon', href: '/apple-touch-icon.png' },
        { rel: 'manifest', href: '/manifest.webmanifest' },
      ],
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
  // Installable on a phone's home screen, and the Canning day keeps working in a kitchen without
  // Wi-Fi: the service worker (/sw.js) keeps the app's files, and the last answers of the pages
  // and the day it needs, read from the network first and from the cache when it is gone.
  pwa: {
    registerType: 'autoUpdate',
    manifest: {
      name: 'Shelfstead',
      short_name: 'Shelfstead',
      description: 'Plan, can, check and shelve home-canned beans safely.',
      start_url: '/',
      scope: '/',
      display: 'standalone',
      background_color: '#f3f6f1',
      theme_color: '#f3f6f1',
      icons: [
        { src: '/icon-192.png', sizes: '192x192', type: 'image/png' },
        { src: '/icon-512.png', sizes: '512x512', type: 'image/png' },
        { src: '/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      ],
    },
    workbox: {
      globPatterns: ['**/*.{js,css,woff,woff2,png,svg,ico}'],
      navigateFallback: null,
      cleanupOutdatedCaches: true,
      runtimeCaching: [
        {
          urlPattern: ({ request, url }) => request.mode === 'navigate' && !url.pathname.startsWith('/api/'),
          handler: 'NetworkFirst',
          options: { cacheName: 'shelfstead-pages', networkTimeoutSeconds: 4, expiration: { maxEntries: 40 } },
        },
        {
          // What the Canning day needs to open again offline: the person, the household, the day.
          urlPattern: ({ url, request }) => request.method === 'GET' && /^\/api\/(auth\/me|_auth\/session|jar-sizes|households\/[^/]+(\/plans\/[^/]+\/day)?)$/.test(url.pathname),
          handler: 'NetworkFirst',
          options: { cacheName: 'shelfstead-api', networkTimeoutSeconds: 4, expiration: { maxEntries: 60 } },
        },
      ],
    },
    client: { installPrompt: false },
    devOptions: { enabled: false },
  },
  // main.css holds the @tailwind directives; stop the module from injecting a second copy.
  tailwindcss: { cssPath: false },
})
