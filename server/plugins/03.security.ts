import { createHash } from 'node:crypto'

/**
 * Security headers on every answer, and a Content-Security-Policy for pages that allows only
 * this site's scripts plus the inline scripts Nuxt writes into that very page (by their
 * SHA-256), so an injected script would not run. Not under `nuxt dev`, whose HMR needs more.
 */
const INLINE_SCRIPT = /<script(?![^>]*\bsrc=)([^>]*)>([\s\S]*?)<\/script>/gi

function pagePolicy(html: string): string {
  const hashes = new Set<string>()
  for (const [, attributes, body] of html.matchAll(INLINE_SCRIPT)) {
    if (/type\s*=\s*["']?application\/json/i.test(attributes!)) continue
    hashes.add(`'sha256-${createHash('sha256').update(body!).digest('base64')}'`)
  }
  return [
    `default-src 'self'`,
    `script-src 'self' ${[...hashes].join(' ')}`.trim(),
    `style-src 'self' 'unsafe-inline'`,
    `img-src 'self' data: blob:`,
    `font-src 'self'`,
    `connect-src 'self'`,
    `object-src 'none'`,
    `base-uri 'self'`,
    `form-action 'self'`,
    `frame-ancestors 'none'`,
  ].join('; ')
}

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('request', (event) => {
    setResponseHeaders(event, {
      'x-content-type-options': 'nosniff',
      'referrer-policy': 'same-origin',
      'x-frame-options': 'DENY',
      'cross-origin-opener-policy': 'same-origin',
      'permissions-policy': 'camera=(self), microphone=(), geolocation=()',
    })
    if (import.meta.dev) return
    // The service worker runs under its own script's policy: it fetches and caches the app's own files.
    const worker = /^\/(sw|workbox-[\w-]+)\.js$/.test(event.path)
    setResponseHeader(event, 'content-security-policy', worker ? `default-src 'self'; script-src 'self'; connect-src 'self'` : `default-src 'none'; frame-ancestors 'none'`)
  })
  nitroApp.hooks.hook('render:response', (response) => {
    if (import.meta.dev || typeof response.body !== 'string') return
    response.headers ??= {}
    response.headers['content-security-policy'] = pagePolicy(response.body)
  })
})
