import type { H3Event } from 'h3'
import { RateLimiterDrizzle, RateLimiterRes, type RateLimiterAbstract } from 'rate-limiter-flexible'
import { serverSettings } from './settings'

/**
 * Guessing is slowed with rate-limiter-flexible: wrong sign-in passwords per address and sign-in
 * attempts per client, reset requests per address and per client. Above a limit the answer is a
 * 429 with Retry-After and a message saying when to try again. The counts are held in the
 * database (its RateLimiterDrizzle store, table rate_limits), so several app servers on one
 * PostgreSQL server share them and a restart forgets nothing.
 */
const LIMITS = {
  wrongPasswordPerAddress: { keyPrefix: 'pw-address', points: 5, duration: 60 },
  signInPerClient: { keyPrefix: 'sign-in-client', points: 30, duration: 60 },
  resetPerAddress: { keyPrefix: 'reset-address', points: 3, duration: 15 * 60 },
  resetPerClient: { keyPrefix: 'reset-client', points: 10, duration: 15 * 60 },
}
type LimiterName = keyof typeof LIMITS

let made: Promise<Record<LimiterName, RateLimiterAbstract>> | undefined
function limiters(): Promise<Record<LimiterName, RateLimiterAbstract>> {
  made ??= useDB().then((db) => {
    const store = (name: LimiterName) => new RateLimiterDrizzle({ ...LIMITS[name], storeClient: db, schema: tables.rateLimits })
    return {
      wrongPasswordPerAddress: store('wrongPasswordPerAddress'),
      signInPerClient: store('signInPerClient'),
      resetPerAddress: store('resetPerAddress'),
      resetPerClient: store('resetPerClient'),
    }
  })
  return made
}

/** The client's address: the socket's, or the first X-Forwarded-For hop behind a trusted proxy. */
export function clientAddress(event: H3Event): string {
  return getRequestIP(event, { xForwardedFor: serverSettings().trustProxy }) ?? 'unknown'
}

function inWords(seconds: number): string {
  if (seconds < 90) return `${seconds} second${seconds === 1 ? '' : 's'}`
  const minutes = Math.ceil(seconds / 60)
  return `${minutes} minutes`
}

function tooMany(event: H3Event, what: string, msBeforeNext: number): never {
  const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000))
  setResponseHeader(event, 'Retry-After', seconds)
  rateLimited(`Too many ${what}. Try again in ${inWords(seconds)}.`)
}

/** 429 when the key has already used up its points (nothing is counted). */
export async function refuseIfSpent(event: H3Event, name: LimiterName, key: string, what: string) {
  const limiter = (await limiters())[name]
  const state = await limiter.get(key)
  if (state && state.consumedPoints >= limiter.points) tooMany(event, what, state.msBeforeNext)
}

/** Count one against the key; 429 when that goes past its points. */
export async function spend(event: H3Event, name: LimiterName, key: string, what: string) {
  try {
    await (await limiters())[name].consume(key)
  }
  catch (error) {
    if (error instanceof RateLimiterRes) tooMany(event, what, error.msBeforeNext)
    throw error
  }
}

/** Forget the wrong passwords of an address after a correct sign-in. */
export async function forgive(name: LimiterName, key: string) {
  await (await limiters())[name].delete(key)
}
