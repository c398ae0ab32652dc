import { and, asc, count, eq, gt, isNull, sql } from 'drizzle-orm'
import { INVITATION_DAYS } from '~~/utils/defaults'
import type { InviteInput } from '~~/utils/schemas/members'
import type { Role } from '~~/utils/vocabulary'
import { recordActivity } from './activity'
import { serverNow } from './clock'
import type { Database, Tx } from './database'
import { escapeHtml, publicUrl, sendMail } from './mail'
import { newLinkToken } from './tokens'

type InvitationRow = typeof tables.invitations.$inferSelect
export type InvitationStatus = 'open' | 'expired' | 'accepted' | 'revoked'

export function invitationStatus(row: Pick<InvitationRow, 'acceptedAt' | 'revokedAt' | 'expiresAt'>, now = serverNow()): InvitationStatus {
  if (row.acceptedAt) return 'accepted'
  if (row.revokedAt) return 'revoked'
  return row.expiresAt <= now ? 'expired' : 'open'
}

/** Lock the household row: membership changes of one household happen one at a time. */
async function lockHousehold(tx: Tx, householdId: string) {
  await tx.select({ id: tables.households.id }).from(tables.households).where(eq(tables.households.id, householdId)).for('update')
}

async function ownerCount(tx: Tx, householdId: string): Promise<number> {
  const [row] = await tx.select({ n: count() }).from(tables.memberships)
    .where(and(eq(tables.memberships.householdId, householdId), eq(tables.memberships.role, 'owner')))
  return Number(row?.n ?? 0)
}

export async function listMembers(db: Database, householdId: string) {
  return db.select({ userId: tables.users.id, name: tables.users.name, email: tables.users.email, role: tables.memberships.role, since: tables.memberships.createdAt })
    .from(tables.memberships)
    .innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
    .where(eq(tables.memberships.householdId, householdId))
    .orderBy(asc(tables.users.name))
}

async function memberOf(tx: Tx, householdId: string, userId: string) {
  const [row] = await tx.select({ role: tables.memberships.role, name: tables.users.name })
    .from(tables.memberships).innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
    .where(and(eq(tables.memberships.householdId, householdId), eq(tables.memberships.userId, userId)))
  if (!row) notFound('No such member in this household.')
  return row
}

const LAST_OWNER = 'A household needs at least one owner. Make another member an owner first.'

/** Change a member's role; the last owner cannot be demoted. */
export async function changeRole(db: Database, householdId: string, actorId: string, userId: string, role: Role) {
  await db.transaction(async (tx) => {
    await lockHousehold(tx, householdId)
    const member = await memberOf(tx, householdId, userId)
    if (member.role === role) return
    if (member.role === 'owner' && await ownerCount(tx, householdId) <= 1) conflict(LAST_OWNER, 'role')
    await tx.update(tables.memberships).set({ role, updatedAt: serverNow() })
      .where(and(eq(tables.memberships.householdId, householdId), eq(tables.memberships.userId, userId)))
    await recordActivity(tx, { householdId, userId: actorId, kind: 'member', summary: `Made ${member.name} ${role === 'owner' ? 'an owner' : `a ${role}`}`, detail: { userId, from: member.role, to: role } })
  })
  return listMembers(db, householdId)
}

/** Remove a member (an owner), or leave (anyone); the last owner can do neither. Their sessions here move on. */
export async function removeMember(db: Database, householdId: string, actorId: string, userId: string) {
  await db.transaction(async (tx) => {
    await lockHousehold(tx, householdId)
    const member = await memberOf(tx, householdId, userId)
    if (member.role === 'owner' && await ownerCount(tx, householdId) <= 1) {
      conflict(actorId === userId ? 'You are the last owner, so you cannot leave. Make another member an owner first.' : LAST_OWNER)
    }
    await tx.delete(tables.memberships).where(and(eq(tables.memberships.householdId, householdId), eq(tables.memberships.userId, userId)))
    await tx.update(tables.sessions).set({ activeHouseholdId: null })
      .where(and(eq(tables.sessions.userId, userId), eq(tables.sessions.activeHouseholdId, householdId)))
    await recordActivity(tx, { householdId, userId: actorId, kind: 'member', summary: actorId === userId ? 'Left the household' : `Removed ${member.name} from the household`, detail: { userId } })
  })
}

// ---------------------------------------------------------------------------
// Invitations

export async function listInvitations(db: Database, householdId: string) {
  const now = serverNow()
  const rows = await db.select({
    id: tables.invitations.id, email: tables.invitations.email, role: tables.invitations.role,
    sentAt: tables.invitations.sentAt, expiresAt: tables.invitations.expiresAt,
    acceptedAt: tables.invitations.acceptedAt, revokedAt: tables.invitations.revokedAt, invitedBy: tables.users.name,
  }).from(tables.invitations).leftJoin(tables.users, eq(tables.users.id, tables.invitations.invitedBy))
    .where(and(eq(tables.invitations.householdId, householdId), isNull(tables.invitations.acceptedAt), isNull(tables.invitations.revokedAt)))
    .orderBy(asc(tables.invitations.email))
  return rows.map(({ acceptedAt, revokedAt, ...row }) => ({ ...row, status: invitationStatus({ acceptedAt, revokedAt, expiresAt: row.expiresAt }, now) }))
}

async function sendInvitation(db: Database, invitation: { email: string, role: Role, householdId: string, expiresAt: Date }, token: string, inviterName: string) {
  const [household] = await db.select({ name: tables.households.name }).from(tables.households).where(eq(tables.households.id, invitation.householdId))
  const link = `${publicUrl()}/invite/${token}`
  const role = invitation.role === 'owner' ? 'an owner' : `a ${invitation.role}`
  const until = invitation.expiresAt.toUTCString()
  const what = {
    owner: 'plan, can, keep the shelf and manage the household',
    canner: 'plan batches, log loads and keep the shelf',
    helper: 'see the plans and the shelf, check off the shopping list, record seal checks and take jars off the shelf',
  }[invitation.role]
  const text = [
    `${inviterName} invites you to join the household "${household!.name}" on Shelfstead as ${role}: you will ${what}.`,
    '',
    `Accept here (the link works once, until ${until}):`,
    link,
    '',
    'If you did not expect this, ignore this e-mail; nothing happens unless you open the link.',
  ].join('\n')
  const html = `<p>${escapeHtml(inviterName)} invites you to join the household <strong>${escapeHtml(household!.name)}</strong> on Shelfstead as ${role}: you will ${what}.</p>`
    + `<p><a href="${escapeHtml(link)}">Accept the invitation</a> (the link works once, until ${escapeHtml(until)}).</p>`
    + '<p>If you did not expect this, ignore this e-mail; nothing happens unless you open the link.</p>'
  await sendMail({ to: [invitation.email], subject: `Join ${household!.name} on Shelfstead`, text, html }).catch((error) => {
    if ((error as { statusCode?: number }).statusCode) throw error
    upstreamFailed(`The mail server did not take the invitation: ${(error as Error).message}`)
  })
}

/** Invite a person by address. A member or an open invitation for the address is refused; the mail must go out, or nothing is kept. */
export async function invite(db: Database, householdId: string, inviter: { id: string, name: string }, body: InviteInput) {
  const { token, hash } = newLinkToken()
  const now = serverNow()
  const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 86_400_000)
  const created = await db.transaction(async (tx) => {
    await lockHousehold(tx, householdId)
    const [member] = await tx.select({ id: tables.users.id }).from(tables.memberships)
      .innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
      .where(and(eq(tables.memberships.householdId, householdId), sql`lower(${tables.users.email}) = ${body.email}`))
    if (member) conflict('That person is already a member of this household.', 'email')
    const [open] = await tx.select({ id: tables.invitations.id }).from(tables.invitations)
      .where(and(eq(tables.invitations.householdId, householdId), sql`lower(${tables.invitations.email}) = ${body.email}`,
        isNull(tables.invitations.acceptedAt), isNull(tables.invitations.revokedAt), gt(tables.invitations.expiresAt, now)))
    if (open) conflict('That address already has an invitation waiting. Resend it from the list instead.', 'email')
    const [row] = await tx.insert(tables.invitations).values({ householdId, email: body.email, role: body.role, tokenHash: hash, invitedBy: inviter.id, createdAt: now, sentAt: now, expiresAt }).returning()
    await recordActivity(tx, { householdId, userId: inviter.id, kind: 'invitation', summary: `Invited ${body.email} as ${body.role}`, detail: { invitationId: row!.id } })
    return row!
  })
  try {
    await sendInvitation(db, created, token, inviter.name)
  }
  catch (error) {
    await db.delete(tables.invitations).where(eq(tables.invitations.id, created.id))
    throw error
  }
  return listInvitations(db, householdId)
}

async function openInvitation(db: Database, householdId: string, invitationId: string) {
  const [row] = await db.select().from(tables.invitations)
    .where(and(eq(tables.invitations.id, invitationId), eq(tables.invitations.householdId, householdId)))
  if (!row) notFound('No such invitation in this household.')
  const status = invitationStatus(row)
  if (status === 'accepted' || status === 'revoked') conflict(`That invitation was already ${status}.`)
  return row
}

/** Send the invitation again with a new link and a fresh 7 days; the old link stops working. */
export async function resendInvitation(db: Database, householdId: string, actor: { id: string, name: string }, invitationId: string) {
  const row = await openInvitation(db, householdId, invitationId)
  const { token, hash } = newLinkToken()
  const now = serverNow()
  const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 86_400_000)
  await sendInvitation(db, { ...row, expiresAt }, token, actor.name)
  await db.transaction(async (tx) => {
    await tx.update(tables.invitations).set({ tokenHash: hash, sentAt: now, expiresAt }).where(eq(tables.invitations.id, row.id))
    await recordActivity(tx, { householdId, userId: actor.id, kind: 'invitation', summary: `Resent the invitation to ${row.email}`, detail: { invitationId } })
  })
  return listInvitations(db, householdId)
}

export async function revokeInvitation(db: Database, householdId: string, actorId: string, invitationId: string) {
  const row = await openInvitation(db, householdId, invitationId)
  await db.transaction(async (tx) => {
    await tx.update(tables.invitations).set({ revokedAt: serverNow() }).where(eq(tables.invitations.id, row.id))
    await recordActivity(tx, { householdId, userId: actorId, kind: 'invitation', summary: `Withdrew the invitation to ${row.email}`, detail: { invitationId } })
  })
  return listInvitations(db, householdId)
}
