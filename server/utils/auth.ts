// The app's type check reaches this file through the inferred route types, and the app project
// excludes server/: the reference brings the session user's declaration along.
// eslint-disable-next-line @typescript-eslint/triple-slash-reference
/// <reference path="../types/auth.d.ts" />
import type { H3Event } from 'h3'
import { and, eq } from 'drizzle-orm'
import type { ZodType, ZodTypeDef } from 'zod'
import { roleRank, type HouseholdRole } from '~~/utils/schemas/household'

/** 401 before anything of the request is read, so an anonymous caller learns nothing. */
export async function requireSession(event: H3Event) {
  const { user } = await requireUserSession(event, { message: 'Please sign in.' })
  return user
}

/**
 * The user's role in a household: 404 when it is not one of theirs (ids leak nothing), 403
 * when the role is below `minRole`. A site admin counts as an owner everywhere.
 */
export async function requireMembership(event: H3Event, householdId: string, minRole: HouseholdRole) {
  const user = await requireSession(event)
  const db = await useDB()
  const [membership] = await db.select({ role: tables.memberships.role })
    .from(tables.memberships)
    .where(and(eq(tables.memberships.userId, user.id), eq(tables.memberships.householdId, householdId)))
  if (!membership && !user.isAdmin) notFound('No such household.')
  const role: HouseholdRole = membership?.role ?? 'owner'
  if (roleRank[role] < roleRank[minRole]) forbidden(`Only a household ${minRole} or above may do this; you are a ${role}.`)
  return { user, role, db }
}

/**
 * The one guard for routes under /api/households/:id: the session (401), then the route's
 * params (400), then the role in that household (404 / 403).
 */
export async function requireHouseholdRole<P extends { id: string }>(event: H3Event, paramsSchema: ZodType<P, ZodTypeDef, unknown>, minRole: HouseholdRole) {
  await requireSession(event)
  const params = validParams(event, paramsSchema)
  return { params, ...(await requireMembership(event, params.id, minRole)) }
}

export async function requireAdmin(event: H3Event) {
  const user = await requireSession(event)
  if (!user.isAdmin) forbidden('Only a site admin may do this.')
  return user
}

export function publicUser(user: { id: string, email: string, name: string, isAdmin: boolean }) {
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin }
}

export async function householdsOf(userId: string) {
  const db = await useDB()
  return db.select({ id: tables.households.id, name: tables.households.name, role: tables.memberships.role })
    .from(tables.memberships)
    .innerJoin(tables.households, eq(tables.households.id, tables.memberships.householdId))
    .where(eq(tables.memberships.userId, userId))
    .orderBy(tables.households.name)
}
