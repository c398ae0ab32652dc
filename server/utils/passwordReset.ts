import type { H3Event } from 'h3'
import { and, eq, isNull, sql } from 'drizzle-orm'
import { RESET_LINK_MINUTES } from '~~/utils/defaults'
import { serverNow } from './clock'
import type { Database } from './database'
import { escapeHtml, mailMode, publicUrl, sendMail } from './mail'
import { hashLinkToken, newLinkToken } from './tokens'

export const RESET_SENT = `If an account uses that address, it has been sent a link to choose a new password. The link works once, within ${RESET_LINK_MINUTES} minutes.`

/**
 * Ask for a reset link. The answer is the same for every address, and the link is made and sent
 * after the answer, so neither the words nor the time tell whether the address has an account.
 */
export async function requestReset(event: H3Event, db: Database, email: string) {
  if (mailMode() === 'off') unavailable('E-mail is not set up on this server, so no reset link can be sent. Ask the person who runs it.')
  const [user] = await db.select({ id: tables.users.id, email: tables.users.email, name: tables.users.name })
    .from(tables.users).where(sql`lower(${tables.users.email}) = ${email}`)
  if (user) {
    const work = sendResetLink(db, user).catch(error => console.error('[shelfstead] Password reset mail failed:', error))
    event.waitUntil?.(work)
  }
  return { message: RESET_SENT }
}

async function sendResetLink(db: Database, user: { id: string, email: string, name: string }) {
  const { token, hash } = newLinkToken()
  const now = serverNow()
  await db.insert(tables.passwordResets).values({ userId: user.id, tokenHash: hash, createdAt: now, expiresAt: new Date(now.getTime() + RESET_LINK_MINUTES * 60_000) })
  const link = `${publicUrl()}/reset/${token}`
  const text = [
    `Someone (we hope you, ${user.name}) asked to choose a new Shelfstead password for ${user.email}.`,
    '',
    `Choose it here; the link works once, within ${RESET_LINK_MINUTES} minutes:`,
    link,
    '',
    'Choosing a new password signs you out on every other device.',
    'If you did not ask, ignore this e-mail: your password stays as it is.',
  ].join('\n')
  const html = `<p>Someone (we hope you, ${escapeHtml(user.name)}) asked to choose a new Shelfstead password for ${escapeHtml(user.email)}.</p>`
    + `<p><a href="${escapeHtml(link)}">Choose a new password</a> (the link works once, within ${RESET_LINK_MINUTES} minutes).</p>`
    + '<p>Choosing a new password signs you out on every other device. If you did not ask, ignore this e-mail: your password stays as it is.</p>'
  await sendMail({ to: [user.email], subject: 'Choose a new Shelfstead password', text, html })
}

export type ResetLinkStatus = 'open' | 'expired' | 'used' | 'unknown'

export async function resetLinkStatus(db: Database, token: string): Promise<ResetLinkStatus> {
  const [row] = await db.select().from(tables.passwordResets).where(eq(tables.passwordResets.tokenHash, hashLinkToken(token)))
  if (!row) return 'unknown'
  if (row.usedAt) return 'used'
  return row.expiresAt <= serverNow() ? 'expired' : 'open'
}

const DEAD_LINK = {
  unknown: 'That reset link is not one we sent, or it was replaced by a newer one. Ask for a new link from the sign-in page.',
  used: 'That reset link was already used. If you still cannot sign in, ask for a new link from the sign-in page.',
  expired: `That reset link has expired (links last ${RESET_LINK_MINUTES} minutes). Ask for a new one from the sign-in page.`,
}

/** Set a new password with a reset link: single use, ends every session of the person, and signs them in here. */
export async function resetPassword(db: Database, token: string, password: string) {
  const passwordHash = await hashPassword(password)
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(tables.passwordResets).where(eq(tables.passwordResets.tokenHash, hashLinkToken(token))).for('update')
    const now = serverNow()
    const status: ResetLinkStatus = !row ? 'unknown' : row.usedAt ? 'used' : row.expiresAt <= now ? 'expired' : 'open'
    if (status !== 'open') badInput('token', DEAD_LINK[status])
    await tx.update(tables.users).set({ passwordHash, updatedAt: now }).where(eq(tables.users.id, row!.userId))
    // This link and every other open one of the person stop working.
    await tx.update(tables.passwordResets).set({ usedAt: now })
      .where(and(eq(tables.passwordResets.userId, row!.userId), isNull(tables.passwordResets.usedAt)))
    await endSessionsOf(tx, row!.userId)
    const [user] = await tx.select().from(tables.users).where(eq(tables.users.id, row!.userId))
    return user!
  })
}
