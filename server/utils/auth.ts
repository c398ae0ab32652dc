// The app type check reaches this file through the inferred route types, and the app project
// excludes server/: the reference brings the session user declaration along.
// eslint-disable-next-line @typescript-eslint/triple-slash-reference
/// <reference path="../types/auth.d.ts" />
import type { H3Event } from 'h3'
import { and, eq } from 'drizzle-orm'
import { roleRank, type HouseholdRole } from '../../utils/schemas/household'

/**
 * The one guard for household-scoped routes: 401 without a session, 404 when the household is
 * not one of the user's (ids leak nothing), 403 when the user's role is below `minRole`.
 * A site admin counts as an owner everywhere.
 */
export async function requireHouseholdRole(event: H3Event, householdId: string, minRole: HouseholdRole) {
  const { user } = await requireUserSession(event, { message: 'Please sign in.' })
  const db = await useDB()
  const [membership] = await db.select({ role: tables.memberships.role })
    .from(tables.memberships)
    .where(and(eq(tables.memberships.userId, user.id), eq(tables.memberships.householdId, householdId)))
  if (!membership && !user.isAdmin) {
    throw createError({ statusCode: 404, message: 'No such household.' })
  }
  const role: HouseholdRole = membership?.role ?? 'owner'
  if (roleRank[role] < roleRank[minRole]) {
    throw createError({ statusCode: 403, message: `Only a household ${minRole} or above may do this; you are a ${role}.` })
  }
  return { user, role, db }
}

export async function requireAdmin(event: H3Event) {
  const { user } = await requireUserSession(event, { message: 'Please sign in.' })
  if (!user.isAdmin) throw createError({ statusCode: 403, message: 'Only a site admin may do this.' })
  return user
}

export async function householdsOf(userId: string) {
  const db = await useDB()
  return db.select({ id: tables.households.id, name: tables.households.name, role: tables.memberships.role })
    .from(tables.memberships)
    .innerJoin(tables.households, eq(tables.households.id, tables.memberships.householdId))
    .where(eq(tables.memberships.userId, userId))
    .orderBy(tables.households.name)
}
