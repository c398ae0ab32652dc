/** The server's environment, read in one place: what each variable does, and what an empty or malformed one does not. */
import { describe, expect, it } from 'vitest'
import { readSettings } from '~~/server/utils/settings'

describe('server settings from the environment', () => {
  it('mail: an explicit mode wins; SMTP settings mean smtp; demo and development use the fake; production is off', () => {
    expect(readSettings({ SHELFSTEAD_MAIL: 'off', SMTP_HOST: 'mail.example' }).mail).toBe('off')
    expect(readSettings({ SMTP_URL: 'smtp://mail.example:587' }).mail).toBe('smtp')
    expect(readSettings({ SHELFSTEAD_DEMO: '1' }).mail).toBe('fake')
    expect(readSettings({}, true).mail).toBe('fake')
    expect(readSettings({}).mail).toBe('off')
    expect(readSettings({ SHELFSTEAD_DEMO: '0' }, true).mail).toBe('fake')
  })

  it('demo data: on in development unless switched off, off in production unless switched on', () => {
    expect(readSettings({}, true).demo).toBe(true)
    expect(readSettings({ SHELFSTEAD_DEMO: 'no' }, true).demo).toBe(false)
    expect(readSettings({}).demo).toBe(false)
    expect(readSettings({ SHELFSTEAD_DEMO: 'yes' }).demo).toBe(true)
  })

  it('an empty or malformed number falls back to the default instead of becoming 0', () => {
    expect(readSettings({ SHELFSTEAD_REMINDER_INTERVAL_MS: '' }).reminderIntervalMs).toBe(60_000)
    expect(readSettings({ SHELFSTEAD_REMINDER_INTERVAL_MS: 'soon' }).reminderIntervalMs).toBe(60_000)
    expect(readSettings({ SHELFSTEAD_REMINDER_INTERVAL_MS: '50' }).reminderIntervalMs).toBe(200)
    expect(readSettings({ SMTP_PORT: ' ' }).smtp.port).toBe(587)
    expect(readSettings({ SHELFSTEAD_NOW_OFFSET_MS: '' }).nowOffsetMs).toBeUndefined()
    expect(readSettings({ SHELFSTEAD_NOW_OFFSET_MS: '3600000' }).nowOffsetMs).toBe(3_600_000)
  })

  it('the clock moves only under the test flag or in development', () => {
    expect(readSettings({ SHELFSTEAD_NOW_OFFSET_MS: '1000' }).clockAdjustable).toBe(false)
    expect(readSettings({ SHELFSTEAD_TEST_CLOCK: '1' }).clockAdjustable).toBe(true)
    expect(readSettings({}, true).clockAdjustable).toBe(true)
  })

  it('links in mail point at the public address without a trailing slash, else the local port', () => {
    expect(readSettings({ SHELFSTEAD_PUBLIC_URL: 'https://jars.example/' }).publicUrl).toBe('https://jars.example')
    expect(readSettings({ PORT: '4100' }).publicUrl).toBe('http://localhost:4100')
    expect(readSettings({ SHELFSTEAD_PUBLIC_URL: 'https://jars.example/' }).publicUrlSet).toBe(true)
    expect(readSettings({ PORT: '4100' }).publicUrlSet).toBe(false)
  })
})
