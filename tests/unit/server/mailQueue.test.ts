/** Queued mail's backoff: bounded exponential, as README.md promises. */
import { describe, expect, it } from 'vitest'
import { retryDelayMs } from '~~/server/utils/mailQueue'

describe('mail retry backoff', () => {
  it('doubles from the first wait and stops at an hour', () => {
    expect([1, 2, 3, 4].map(n => retryDelayMs(n, 30_000))).toEqual([30_000, 60_000, 120_000, 240_000])
    expect(retryDelayMs(8, 30_000)).toBe(3_600_000)
    expect(retryDelayMs(40, 30_000)).toBe(3_600_000)
  })
})
