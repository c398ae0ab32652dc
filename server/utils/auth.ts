// The app's type check reaches this file through the inferred route types, and the app project
// excludes server/: the reference brings the session user's declaration along.
// eslint-disable-next-line @typescript-eslint/triple-slash-reference
/// <reference path="../types/auth.d.ts" />
import type { H3Event } from 'h3'
import { and, asc, eq, gt, isNull, ne } from 'drizzle-orm'
import type { ZodType, ZodTypeDef } from 'zod'
import { roleRank, type Role } from '~~/utils/vocabulary'
import { serverNow } from './clock'
import type { Db } from './database'

/**
 * Sessions. The sealed cookie (nuxt-auth-utils) carries the person for the client's display and
 * the id of a row in `sessions`; every request checks that row, so signing out, signing out
 * everywhere and a password reset end a session on the server, not only in one browser.
 */

/** Secure whenever the request came over HTTPS (behind a proxy: its X-Forwarded-Proto). */
export function sessionCookieConfig(event: H3Event) {
  const secure = getRequestProtocol(event, { xForwardedProto: true }) === 'https'
  return { cookie: { secure, httpOnly: true, sameSite: 'lax' as const, path: '/' } }
}

const SESSION_TOUCH_MS = 5 * 60_000

type UserRow = typeof tables.users.$inferSelect
type SessionRow = typeof tables.sessions.$inferSelect
export interface CurrentSession { user: ReturnType<typeof publicUser>, session: SessionRow }

export function publicUser(user: Pick<UserRow, 'id' | 'email' | 'name' | 'isAdmin'>) {
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin }
}

/** Open a session for `user` (after sign-in, sign-up, an accepted invitation or a reset). */
export async function startSession(event: H3Event, user: UserRow, activeHouseholdId: string | null) {
  const db = await useDB()
  const maxAgeSeconds = Number(useRuntimeConfig(event).session.maxAge)
  const now = serverNow()
  const [row] = await db.insert(tables.sessions).values({
    userId: user.id,
    activeHouseholdId,
    userAgent: (getRequestHeader(event, 'user-agent') ?? '').slice(0, 300),
    createdAt: now,
    lastSeenAt: now,
    expiresAt: new Date(now.getTime() + maxAgeSeconds * 1000),
  }).returning()
  await replaceUserSession(event, { user: publicUser(user), secure: { sessionId: row!.id } }, sessionCookieConfig(event))
  event.context.shelfsteadSession = { user: publicUser(user), session: row! } satisfies CurrentSession
}

/** The request's live session, or null (a cookie whose session has ended is cleared). */
export async function currentSession(event: H3Event): Promise<CurrentSession | null> {
  if (event.context.shelfsteadSession !== undefined) return event.context.shelfsteadSession as CurrentSession | null
  const cookie = await getUserSession(event)
  const sessionId = cookie.secure?.sessionId
  let found: CurrentSession | null = null
  if (sessionId && /^[0-9a-f-]{36}$/i.test(sessionId)) {
    const db = await useDB()
    const now = serverNow()
    const [row] = await db.select({ session: tables.sessions, user: tables.users })
      .from(tables.sessions)
      .innerJoin(tables.users, eq(tables.users.id, tables.sessions.userId))
      .where(and(eq(tables.sessions.id, sessionId), isNull(tables.sessions.endedAt), gt(tables.sessions.expiresAt, now)))
    if (row) {
      found = { user: publicUser(row.user), session: row.session }
      if (now.getTime() - row.session.lastSeenAt.getTime() > SESSION_TOUCH_MS) {
        await db.update(tables.sessions).set({ lastSeenAt: now }).where(eq(tables.sessions.id, sessionId))
      }
    }
  }
  if (!found && cookie.user) await clearUserSession(event, sessionCookieConfig(event))
  event.context.shelfsteadSession = found
  return found
}

/** 401 before anything of the request is read, so an anonymous caller learns nothing. */
export async function requireSession(event: H3Event): Promise<CurrentSession> {
  const current = await currentSession(event)
  if (!current) unauthorized('Please sign in.')
  return current
}

/** End this request's session (sign out). */
export async function endSession(event: H3Event) {
  const current = await currentSession(event)
  if (current) {
    const db = await useDB()
    await db.update(tables.sessions).set({ endedAt: serverNow() }).where(eq(tables.sessions.id, current.session.id))
  }
  await clearUserSession(event, sessionCookieConfig(event))
  event.context.shelfsteadSession = null
}

/** End every session of a person, or every one but `keep` (sign out everywhere, a password reset). */
export async function endSessionsOf(db: Db, userId: string, keep?: string) {
  await db.update(tables.sessions).set({ endedAt: serverNow() })
    .where(and(eq(tables.sessions.userId, userId), isNull(tables.sessions.endedAt), ...(keep ? [ne(tables.sessions.id, keep)] : [])))
}

/** Who may do a thing, in words: "Only a canner or the household's owner may do this; you are a helper." */
const ROLE_REFUSAL: Record<Role, (role: Role) => string> = {
  helper: role => `Only members of this household may do this; you are a ${role}.`,
  canner: role => `Only a canner or the household's owner may do this; you are a ${role}.`,
  owner: role => `Only the household's owner may do this; you are a ${role}.`,
}

/**
 * The person's role in a household. Not a member: 404 (ids leak nothing, for a site admin too:
 * the admin curates the shared recipes, not other households). A member working in another
 * household: 409, switch first, so a screen never mixes two households. Below `minRole`: 403.
 */
export async function requireMembership(event: H3Event, householdId: string, minRole: Role) {
  const { user, session } = await requireSession(event)
  const db = await useDB()
  const [membership] = await db.select({ role: tables.memberships.role })
    .from(tables.memberships)
    .where(and(eq(tables.memberships.userId, user.id), eq(tables.memberships.householdId, householdId)))
  if (!membership) notFound('No such household.')
  if (session.activeHouseholdId !== householdId) {
    conflict('You are working in another household on this device. Switch to this one first (the household menu at the top).')
  }
  const role = membership.role
  if (roleRank[role] < roleRank[minRole]) forbidden(ROLE_REFUSAL[minRole](role))
  return { user, role, db, session }
}

/**
 * The one guard for routes under /api/households/:id: the session (401), then the route's
 * params (400), then the role in that household (404 / 409 / 403).
 */
export async function requireHouseholdRole<P extends { id: string }>(event: H3Event, paramsSchema: ZodType<P, ZodTypeDef, unknown>, minRole: Role) {
  await requireSession(event)
  const params = validParams(event, paramsSchema)
  return { params, ...(await requireMembership(event, params.id, minRole)) }
}

export async function requireAdmin(event: H3Event) {
  const { user } = await requireSession(event)
  if (!user.isAdmin) forbidden('Only a site admin may do this.')
  return user
}

export async function householdsOf(userId: string) {
  const db = await useDB()
  return db.select({ id: tables.households.id, name: tables.households.name, role: tables.memberships.role })
    .from(tables.memberships)
    .innerJoin(tables.households, eq(tables.households.id, tables.memberships.householdId))
    .where(eq(tables.memberships.userId, userId))
    .orderBy(asc(tables.households.name))
}

/**
 * Who the person is, their households and the one this session works in. A session whose
 * active household is gone (left, removed) moves to their first remaining one.
 */
export async function sessionAnswer(current: CurrentSession) {
  const households = await householdsOf(current.user.id)
  let activeHouseholdId = current.session.activeHouseholdId
  if (!households.some(h => h.id === activeHouseholdId)) {
    activeHouseholdId = households[0]?.id ?? null
    const db = await useDB()
    await db.update(tables.sessions).set({ activeHouseholdId }).where(eq(tables.sessions.id, current.session.id))
    current.session.activeHouseholdId = activeHouseholdId
  }
  return { user: current.user, households, activeHouseholdId }
}
