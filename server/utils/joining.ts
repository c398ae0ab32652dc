import type { H3Event } from 'h3'
import { eq, sql } from 'drizzle-orm'
import type { AcceptInvitationInput } from '~~/utils/schemas/members'
import { recordActivity } from './activity'
import { serverNow } from './clock'
import type { Database, Tx } from './database'
import { invitationStatus, type InvitationStatus } from './members'
import { hashLinkToken } from './tokens'

const DEAD_INVITATION: Record<Exclude<InvitationStatus, 'open'>, string> = {
  expired: 'This invitation has expired (invitations last 7 days). Ask the person who invited you to send it again.',
  accepted: 'This invitation has already been used. Sign in to reach the household.',
  revoked: 'This invitation was withdrawn by the household. Ask them if you should have another.',
}

const UNKNOWN_LINK = 'That invitation link is not one we sent, or it was replaced by a newer one. Ask the household to send it again.'

async function byToken(db: Database | Tx, token: string) {
  const [row] = await db.select({ invitation: tables.invitations, household: tables.households.name, invitedBy: tables.users.name })
    .from(tables.invitations)
    .innerJoin(tables.households, eq(tables.households.id, tables.invitations.householdId))
    .leftJoin(tables.users, eq(tables.users.id, tables.invitations.invitedBy))
    .where(eq(tables.invitations.tokenHash, hashLinkToken(token)))
  return row
}

/** What an invitation link's page shows: whose household, which role, and whether it still works. */
export async function describeInvitation(event: H3Event, db: Database, token: string) {
  const row = await byToken(db, token)
  if (!row) notFound(UNKNOWN_LINK)
  const status = invitationStatus(row.invitation)
  const current = await currentSession(event)
  const [account] = await db.select({ id: tables.users.id }).from(tables.users).where(sql`lower(${tables.users.email}) = ${row.invitation.email}`)
  return {
    household: row.household,
    role: row.invitation.role,
    email: row.invitation.email,
    invitedBy: row.invitedBy,
    expiresAt: row.invitation.expiresAt,
    status,
    message: status === 'open' ? null : DEAD_INVITATION[status],
    hasAccount: Boolean(account),
    signedInAs: current?.user.email ?? null,
  }
}

/**
 * Accept an invitation: as the person signed in (their address must be the invited one), by
 * signing in, or with a new account for the invited address. Single use: the row is locked
 * and marked accepted in the same transaction that adds the membership.
 */
export async function acceptInvitation(event: H3Event, db: Database, token: string, body: AcceptInvitationInput) {
  const current = body.mode === 'signed-in' ? await requireSession(event) : null
  const found = await byToken(db, token)
  if (!found) notFound(UNKNOWN_LINK)
  if (body.mode === 'register') refuseCommonPassword('password', body.password)
  const newHash = body.mode === 'register' ? await hashPassword(body.password) : null
  const email = found.invitation.email.toLowerCase()
  if (body.mode === 'sign-in') {
    await spend(event, 'signInPerClient', clientAddress(event), 'sign-in attempts from this device')
    await refuseIfSpent(event, 'wrongPasswordPerAddress', email, 'wrong passwords for this address')
    // The password is checked, and a wrong one counted, before the transaction: the counts are in
    // the database too, and PGlite's one connection is the transaction's until it ends.
    const [account] = await db.select({ passwordHash: tables.users.passwordHash }).from(tables.users).where(sql`lower(${tables.users.email}) = ${email}`)
    if (!await passwordMatches(account?.passwordHash, body.password) || !account) {
      await spend(event, 'wrongPasswordPerAddress', email, 'wrong passwords for this address')
      unauthorized(`That password does not match the account for ${email}.`)
    }
  }

  const user = await db.transaction(async (tx) => {
    const [invitation] = await tx.select().from(tables.invitations).where(eq(tables.invitations.id, found.invitation.id)).for('update')
    const status = invitationStatus(invitation!)
    if (status !== 'open') conflict(DEAD_INVITATION[status])
    const [existing] = await tx.select().from(tables.users).where(sql`lower(${tables.users.email}) = ${email}`)
    let user: typeof tables.users.$inferSelect
    if (body.mode === 'signed-in') {
      if (current!.user.email.toLowerCase() !== email) {
        conflict(`This invitation is for ${email}, and you are signed in as ${current!.user.email}. Sign out, then open the link again.`)
      }
      user = existing!
    }
    else if (body.mode === 'sign-in') {
      // checked above; gone meanwhile only if the account was deleted in between
      if (!existing) unauthorized(`That password does not match the account for ${email}.`)
      user = existing
    }
    else {
      if (existing) conflict(`There is already an account for ${email}. Sign in with it to accept.`)
      const [created] = await tx.insert(tables.users).values({ email, name: body.name, passwordHash: newHash! }).returning()
      user = created!
    }
    const householdId = invitation!.householdId
    await tx.insert(tables.memberships).values({ userId: user.id, householdId, role: invitation!.role }).onConflictDoNothing()
    await tx.update(tables.invitations).set({ acceptedAt: serverNow(), acceptedBy: user.id }).where(eq(tables.invitations.id, invitation!.id))
    await recordActivity(tx, { householdId, userId: user.id, kind: 'member', summary: `Joined as ${invitation!.role}`, detail: { invitationId: invitation!.id } })
    return user
  })

  const householdId = found.invitation.householdId
  if (current) {
    await db.update(tables.sessions).set({ activeHouseholdId: householdId }).where(eq(tables.sessions.id, current.session.id))
    current.session.activeHouseholdId = householdId
  }
  else {
    await startSession(event, user, householdId)
  }
  return sessionAnswer(await requireSession(event))
}
