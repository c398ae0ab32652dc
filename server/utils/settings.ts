/**
 * Every environment variable the server reads, in one place (README.md lists them for people).
 * Nothing else in server/ reads process.env: it asks `serverSettings()`. Functions that tests drive with
 * a made-up environment take a `readSettings(env)` result instead.
 *
 * Nuxt's runtimeConfig is used only for what modules read themselves (nuxt-auth-utils' session).
 */
import { resolve } from 'node:path'

const truthy = (value: string | undefined) => value !== undefined && ['1', 'true', 'on', 'yes'].includes(value.toLowerCase())

/** A whole number from the environment, or the fallback when unset, empty or not a number. */
function integer(value: string | undefined, fallback: number): number {
  if (value === undefined || value.trim() === '') return fallback
  const n = Number(value)
  return Number.isInteger(n) ? n : fallback
}

export type MailMode = 'smtp' | 'fake' | 'off'

export interface ServerSettings {
  /** NUXT_DATA_DIR made absolute, or undefined for the default beside the project. */
  dataDir: string | undefined
  databaseUrl: string | undefined
  migrationsDir: string | undefined
  /** Where Nitro's node server listens: NITRO_PORT or PORT (3000), NITRO_HOST or HOST, NITRO_UNIX_SOCKET. */
  listen: { port: number, host: string | undefined, socket: string | undefined }
  /** SHELFSTEAD_DEMO: on in development unless set, on with `npm start` and in tests. */
  demo: boolean
  mail: MailMode
  mailFrom: string
  smtp: { url?: string, host?: string, port: number, secure: boolean, user?: string, pass: string }
  fakeSmtpPort: number
  publicUrl: string
  /** SHELFSTEAD_PUBLIC_URL was given: links printed for phones (jar labels) use it rather than the address the page was opened at. */
  publicUrlSet: boolean
  reminderIntervalMs: number
  /** Queued mail: the first retry after SHELFSTEAD_MAIL_RETRY_MS (30 s), doubling up to mailRetryMaxMs. */
  mailRetryMs: number
  storage: 'fs' | 's3'
  s3: { endpoint?: string, bucket?: string, region: string, accessKeyId?: string, secretAccessKey?: string }
  /** SHELFSTEAD_TRUST_PROXY=1: behind a reverse proxy, read the client address from X-Forwarded-For. */
  trustProxy: boolean
  /** SHELFSTEAD_ADMIN_EMAIL: the account with this address is made a site admin at start. */
  adminEmail: string | undefined
  /** SHELFSTEAD_TEST_CLOCK=1 (or `nuxt dev`) lets the clock be moved; the offset it starts with. */
  clockAdjustable: boolean
  nowOffsetMs: number | undefined
}

export function readSettings(env: NodeJS.ProcessEnv, dev = Boolean(import.meta.dev)): ServerSettings {
  const demo = env.SHELFSTEAD_DEMO === undefined ? dev : truthy(env.SHELFSTEAD_DEMO)
  const mailFlag = env.SHELFSTEAD_MAIL?.toLowerCase()
  const mail: MailMode = mailFlag === 'smtp' || mailFlag === 'fake' || mailFlag === 'off'
    ? mailFlag
    : env.SMTP_URL || env.SMTP_HOST ? 'smtp' : demo || dev ? 'fake' : 'off'
  const offset = env.SHELFSTEAD_NOW_OFFSET_MS
  return {
    dataDir: env.NUXT_DATA_DIR ? resolve(env.NUXT_DATA_DIR) : undefined,
    databaseUrl: env.DATABASE_URL || undefined,
    migrationsDir: env.SHELFSTEAD_MIGRATIONS_DIR || undefined,
    listen: {
      port: integer(env.NITRO_PORT || env.PORT, 3000),
      host: env.NITRO_HOST || env.HOST || undefined,
      socket: env.NITRO_UNIX_SOCKET || undefined,
    },
    demo,
    mail,
    mailFrom: env.MAIL_FROM || 'Shelfstead <shelfstead@localhost>',
    smtp: {
      url: env.SMTP_URL || undefined,
      host: env.SMTP_HOST || undefined,
      port: integer(env.SMTP_PORT, 587),
      secure: env.SMTP_SECURE === '1',
      user: env.SMTP_USER || undefined,
      pass: env.SMTP_PASS ?? '',
    },
    fakeSmtpPort: integer(env.SHELFSTEAD_FAKE_SMTP_PORT, 0),
    publicUrl: (env.SHELFSTEAD_PUBLIC_URL || `http://localhost:${env.PORT || 3000}`).replace(/\/$/, ''),
    publicUrlSet: Boolean(env.SHELFSTEAD_PUBLIC_URL),
    reminderIntervalMs: Math.max(200, integer(env.SHELFSTEAD_REMINDER_INTERVAL_MS, 60_000)),
    mailRetryMs: Math.max(100, integer(env.SHELFSTEAD_MAIL_RETRY_MS, 30_000)),
    storage: env.SHELFSTEAD_STORAGE?.toLowerCase() === 's3' ? 's3' : 'fs',
    s3: {
      endpoint: env.S3_ENDPOINT || undefined,
      bucket: env.S3_BUCKET || undefined,
      region: env.S3_REGION || 'us-east-1',
      accessKeyId: env.S3_ACCESS_KEY_ID || undefined,
      secretAccessKey: env.S3_SECRET_ACCESS_KEY || undefined,
    },
    trustProxy: truthy(env.SHELFSTEAD_TRUST_PROXY),
    adminEmail: env.SHELFSTEAD_ADMIN_EMAIL?.trim().toLowerCase() || undefined,
    clockAdjustable: dev || env.SHELFSTEAD_TEST_CLOCK === '1',
    nowOffsetMs: offset === undefined || offset.trim() === '' || !Number.isFinite(Number(offset)) ? undefined : Number(offset),
  }
}

/**
 * Free space a data directory needs at start: a new PGlite database takes about 41 MB, and an
 * existing one needs room for its write-ahead log. Below this the server refuses to start
 * rather than failing half-way through creating the database.
 */
export const minFreeBytes = { newDatabase: 64 * 1024 * 1024, existingDatabase: 16 * 1024 * 1024 }

/** Queued mail waits at most an hour between attempts, and a claimed send is given back after 5 minutes (a crash mid-send). */
export const mailRetryMaxMs = 60 * 60_000
export const mailClaimMs = 5 * 60_000
/**
 * How long one SMTP attempt may wait (nodemailer's own defaults are 2 and 10 minutes): a mail
 * server that does not answer fails the attempt soon, and the queue retries it later.
 */
export const smtpTimeoutsMs = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 60_000 }

let current: ServerSettings | undefined

/** This process's settings, read once. */
export function serverSettings(): ServerSettings {
  current ??= readSettings(process.env)
  return current
}
