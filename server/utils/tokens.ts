import { createHash, randomBytes } from 'node:crypto'

/** A single-use link token: 32 random bytes, url-safe; only its SHA-256 is ever stored. */
export function newLinkToken(): { token: string, hash: string } {
  const token = randomBytes(32).toString('base64url')
  return { token, hash: hashLinkToken(token) }
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}
