/** Reading the Logbook: one load in full, the paged and filtered list, the CSV rows, loads awaiting a seal check. */
import { and, asc, desc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm'
import { loadCode, sealWindow } from '~~/utils/after'
import type { LoadListQuery } from '~~/utils/schemas/logbook'
import { nextDay, startOfDayIn } from '~~/utils/time'
import type { Database, Db } from './database'

/** A load of this household, or a 404 that reveals nothing about other households. */
export async function requireLoad(db: Db, householdId: string, loadId: string) {
  const [load] = await db.select().from(tables.canningLoads)
    .where(and(eq(tables.canningLoads.id, loadId), eq(tables.canningLoads.householdId, householdId)))
  if (!load) notFound('No such load in this household.')
  return load
}

type LoadRow = typeof tables.canningLoads.$inferSelect

/** The fields every load answer carries: its code, its seal window and its status in words. */
function loadSummary(load: LoadRow, now: Date, checked: boolean) {
  const window = load.endedAt && !checked ? sealWindow(load.endedAt, now) : null
  return {
    ...load,
    code: loadCode(load.number),
    sealCheck: window ? { status: window.status, dueAt: window.dueAt, byAt: window.byAt, reprocessBy: window.reprocessBy } : null,
  }
}

export async function loadDetail(db: Db, householdId: string, loadId: string) {
  const now = serverNow()
  const load = await requireLoad(db, householdId, loadId)
  const [lines, [check], photos, reprocessing, original] = await Promise.all([
    db.select().from(tables.loadLines).where(eq(tables.loadLines.loadId, load.id)).orderBy(asc(tables.loadLines.lineIndex)),
    db.select({ id: tables.sealChecks.id, checkedAt: tables.sealChecks.checkedAt, notes: tables.sealChecks.notes, checkedBy: tables.users.name })
      .from(tables.sealChecks).leftJoin(tables.users, eq(tables.users.id, tables.sealChecks.checkedBy))
      .where(eq(tables.sealChecks.loadId, load.id)),
    db.select({ id: tables.loadPhotos.id, contentType: tables.loadPhotos.contentType, bytes: tables.loadPhotos.bytes, originalName: tables.loadPhotos.originalName, createdAt: tables.loadPhotos.createdAt })
      .from(tables.loadPhotos).where(eq(tables.loadPhotos.loadId, load.id)).orderBy(asc(tables.loadPhotos.createdAt)),
    db.select({ id: tables.canningLoads.id, number: tables.canningLoads.number, status: tables.canningLoads.status })
      .from(tables.canningLoads).where(and(eq(tables.canningLoads.reprocessOfId, load.id), eq(tables.canningLoads.householdId, householdId))),
    load.reprocessOfId
      ? db.select({ id: tables.canningLoads.id, number: tables.canningLoads.number }).from(tables.canningLoads)
          .where(and(eq(tables.canningLoads.id, load.reprocessOfId), eq(tables.canningLoads.householdId, householdId)))
      : Promise.resolve([]),
  ])
  return {
    ...loadSummary(load, now, Boolean(check)),
    now,
    lines,
    check: check ?? null,
    photos,
    reprocessedIn: reprocessing.map(r => ({ ...r, code: loadCode(r.number) })),
    reprocessOf: original[0] ? { id: original[0].id, code: loadCode(original[0].number) } : null,
  }
}

const jarsOfLoad = sql<number>`(select coalesce(sum(${tables.loadLines.jars}), 0) from ${tables.loadLines} where ${tables.loadLines.loadId} = ${tables.canningLoads.id})`
const loadTime = sql`coalesce(${tables.canningLoads.startedAt}, ${tables.canningLoads.createdAt})`

function loadFilters(householdId: string, zone: string, query: Pick<LoadListQuery, 'recipeId' | 'cannerId' | 'from' | 'to'>): SQL {
  const where: SQL[] = [eq(tables.canningLoads.householdId, householdId)]
  if (query.cannerId) where.push(eq(tables.canningLoads.cannerId, query.cannerId))
  if (query.recipeId) {
    where.push(sql`exists (select 1 from ${tables.loadLines} where ${tables.loadLines.loadId} = ${tables.canningLoads.id} and ${tables.loadLines.recipeId} = ${query.recipeId})`)
  }
  // Date range by the household's calendar date the load started (inclusive at both ends).
  if (query.from) where.push(sql`${loadTime} >= ${startOfDayIn(query.from, zone).toISOString()}::timestamptz`)
  if (query.to) where.push(sql`${loadTime} < ${startOfDayIn(nextDay(query.to), zone).toISOString()}::timestamptz`)
  return and(...where)!
}

const sortColumns = {
  startedAt: loadTime,
  code: sql`${tables.canningLoads.number}`,
  canner: sql`${tables.canningLoads.cannerName}`,
  jars: jarsOfLoad,
  pressurePsi: sql`${tables.canningLoads.pressurePsi}`,
  processMinutes: sql`${tables.canningLoads.processMinutes}`,
} as const

/** One page of the Logbook, filtered and sorted by the database, with each load's lines. */
export async function listLoads(db: Database, householdId: string, query: LoadListQuery) {
  const now = serverNow()
  const where = loadFilters(householdId, await householdTimeZone(db, householdId), query)
  const descending = query.sort.startsWith('-')
  const key = query.sort.replace(/^-/, '') as keyof typeof sortColumns
  const order = descending ? sql`${sortColumns[key]} desc nulls last` : sql`${sortColumns[key]} asc nulls last`
  const [[total], rows] = await Promise.all([
    db.select({ n: sql<number>`count(*)` }).from(tables.canningLoads).where(where),
    db.select().from(tables.canningLoads).where(where)
      .orderBy(order, descending ? desc(tables.canningLoads.number) : asc(tables.canningLoads.number))
      .limit(query.pageSize).offset((query.page - 1) * query.pageSize),
  ])
  const ids = rows.map(r => r.id)
  const [lines, checks, photos] = ids.length
    ? await Promise.all([
        db.select().from(tables.loadLines).where(inArray(tables.loadLines.loadId, ids)).orderBy(asc(tables.loadLines.lineIndex)),
        db.select({ loadId: tables.sealChecks.loadId, checkedAt: tables.sealChecks.checkedAt }).from(tables.sealChecks).where(inArray(tables.sealChecks.loadId, ids)),
        db.select({ loadId: tables.loadPhotos.loadId, n: sql<number>`count(*)` }).from(tables.loadPhotos).where(inArray(tables.loadPhotos.loadId, ids)).groupBy(tables.loadPhotos.loadId),
      ])
    : [[], [], []]
  return {
    page: query.page,
    pageSize: query.pageSize,
    total: Number(total?.n ?? 0),
    sort: query.sort,
    now,
    rows: rows.map((load) => {
      const own = lines.filter(l => l.loadId === load.id)
      const check = checks.find(c => c.loadId === load.id)
      return {
        ...loadSummary(load, now, Boolean(check)),
        jars: own.reduce((s, l) => s + l.jars, 0),
        lines: own,
        checkedAt: check?.checkedAt ?? null,
        sealed: check ? own.reduce((s, l) => s + (l.sealed ?? 0), 0) : null,
        unsealed: check ? own.reduce((s, l) => s + (l.unsealed ?? 0), 0) : null,
        photos: Number(photos.find(p => p.loadId === load.id)?.n ?? 0),
      }
    }),
  }
}

/** Every load matching the filters (no paging), oldest first, for the CSV export. */
export async function loadsForExport(db: Database, householdId: string, query: Pick<LoadListQuery, 'recipeId' | 'cannerId' | 'from' | 'to'>) {
  const where = loadFilters(householdId, await householdTimeZone(db, householdId), query)
  const rows = await db.select().from(tables.canningLoads).where(where).orderBy(asc(loadTime), asc(tables.canningLoads.number))
  const ids = rows.map(r => r.id)
  const lines = ids.length ? await db.select().from(tables.loadLines).where(inArray(tables.loadLines.loadId, ids)).orderBy(asc(tables.loadLines.lineIndex)) : []
  return rows.flatMap(load => lines.filter(l => l.loadId === load.id).map(line => ({ load, line })))
}

/** Loads that came out and have no seal check yet, soonest due first. */
export async function loadsAwaitingCheck(db: Database, householdId: string) {
  const now = serverNow()
  const rows = await db.select().from(tables.canningLoads)
    .leftJoin(tables.sealChecks, eq(tables.sealChecks.loadId, tables.canningLoads.id))
    .where(and(eq(tables.canningLoads.householdId, householdId), eq(tables.canningLoads.status, 'done'), isNull(tables.sealChecks.id)))
    .orderBy(asc(tables.canningLoads.endedAt))
  const ids = rows.map(r => r.canning_loads.id)
  const lines = ids.length ? await db.select().from(tables.loadLines).where(inArray(tables.loadLines.loadId, ids)) : []
  const pending = await db.select().from(tables.canningLoads)
    .where(and(eq(tables.canningLoads.householdId, householdId), eq(tables.canningLoads.status, 'pending')))
    .orderBy(asc(tables.canningLoads.deadlineAt))
  const pendingLines = pending.length ? await db.select().from(tables.loadLines).where(inArray(tables.loadLines.loadId, pending.map(p => p.id))) : []
  return {
    now,
    due: rows.map(({ canning_loads: load }) => ({
      ...loadSummary(load, now, false),
      lines: lines.filter(l => l.loadId === load.id),
    })),
    reprocessing: pending.map(load => ({ ...loadSummary(load, now, false), lines: pendingLines.filter(l => l.loadId === load.id) })),
  }
}
