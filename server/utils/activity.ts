import { count, desc, eq } from 'drizzle-orm'
import type { ActivityKind } from '~~/utils/vocabulary'
import { serverNow } from './clock'
import type { Db } from './database'

export const ACTIVITY_PAGE_SIZE = 25

/** Note who did what in a household; written in the same transaction as the change itself. */
export async function recordActivity(db: Db, entry: { householdId: string, userId: string | null, kind: ActivityKind, summary: string, detail?: Record<string, unknown> }) {
  await db.insert(tables.activity).values({ ...entry, detail: entry.detail ?? {}, at: serverNow() })
}

/** One page of the household's activity, newest first, with who did it. */
export async function activityPage(db: Db, householdId: string, page: number) {
  const [rows, [total]] = await Promise.all([
    db.select({ id: tables.activity.id, at: tables.activity.at, kind: tables.activity.kind, summary: tables.activity.summary, by: tables.users.name })
      .from(tables.activity).leftJoin(tables.users, eq(tables.users.id, tables.activity.userId))
      .where(eq(tables.activity.householdId, householdId))
      .orderBy(desc(tables.activity.at), desc(tables.activity.id))
      .limit(ACTIVITY_PAGE_SIZE).offset((page - 1) * ACTIVITY_PAGE_SIZE),
    db.select({ n: count() }).from(tables.activity).where(eq(tables.activity.householdId, householdId)),
  ])
  const entries = Number(total?.n ?? 0)
  return { page, pageSize: ACTIVITY_PAGE_SIZE, total: entries, pages: Math.max(1, Math.ceil(entries / ACTIVITY_PAGE_SIZE)), items: rows }
}
