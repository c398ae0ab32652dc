import { and, asc, desc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm'
import { PlanningRefusal, type JarSize, type Recipe } from '../../utils/planning'
import { loadCode, loadShortfall, requiredProcess, sealWindow, type RequiredProcess } from '../../utils/after'
import type { LoadCreateInput, LoadListQuery, LoadUpdateInput } from '../../utils/schemas/logbook'
import { loadCatalogue } from './catalogue'
import { nextDay, startOfDayIn } from '../../utils/time'
import type { Database } from './database'
import { computePlan, requirePlan } from './plans'

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]
type Db = Database | Tx

/** A load of this household, or a 404 that reveals nothing about other households. */
export async function requireLoad(db: Db, householdId: string, loadId: string) {
  const [load] = await db.select().from(tables.canningLoads)
    .where(and(eq(tables.canningLoads.id, loadId), eq(tables.canningLoads.householdId, householdId)))
  if (!load) notFound('No such load in this household.')
  return load
}

/** Lock the household row so load numbers are handed out one at a time, then the next number. */
export async function nextLoadNumber(tx: Tx, householdId: string): Promise<number> {
  await tx.select({ id: tables.households.id }).from(tables.households).where(eq(tables.households.id, householdId)).for('update')
  const [row] = await tx.select({ max: sql<number>`coalesce(max(${tables.canningLoads.number}), 0)` })
    .from(tables.canningLoads).where(eq(tables.canningLoads.householdId, householdId))
  return Number(row?.max ?? 0) + 1
}

/** What the published tables require of these lines, or the refusal that says why nothing does. */
export function requiredFor(
  lines: ReadonlyArray<{ recipe: Recipe, jarSize: JarSize }>,
  jarSizes: readonly JarSize[],
  gaugeType: 'dial' | 'weighted',
  altitudeFt: number,
): { required: RequiredProcess | null, reason?: string } {
  try {
    return { required: requiredProcess(lines, jarSizes, gaugeType, altitudeFt) }
  }
  catch (error) {
    if (error instanceof PlanningRefusal) return { required: null, reason: error.message }
    throw error
  }
}

/**
 * Log a load that was run. The pressure and minutes it needed come from the published table
 * for its recipes, jar sizes, the canner's gauge and the household's altitude (and the plan's
 * load, when it was logged from a plan); a load run with less is flagged with what to do.
 * Filling the jars takes them out of the household's empty-jar stock (never below 0).
 */
export async function createLoad(db: Database, householdId: string, userId: string, body: LoadCreateInput) {
  const [{ catalogue, recipes }, [household], [canner]] = await Promise.all([
    loadCatalogue(db, householdId),
    db.select().from(tables.households).where(eq(tables.households.id, householdId)),
    db.select().from(tables.canners).where(and(eq(tables.canners.id, body.cannerId), eq(tables.canners.householdId, householdId))),
  ])
  if (!canner) badInput('cannerId', 'That canner is not one of this household\'s canners. Choose one from the list.')
  const lines = body.lines.map((line, i) => {
    const recipe = catalogue.recipes.find(r => r.id === line.recipeId)
    if (!recipe) badInput(`lines.${i}.recipeId`, 'That recipe is not in your Recipe book. Choose one from the list.')
    const jarSize = catalogue.jarSizes.find(j => j.id === line.jarSizeId)
    if (!jarSize) badInput(`lines.${i}.jarSizeId`, 'That jar size is not in the jar catalogue.')
    return { ...line, recipe, jarSize, product: line.product || recipes.find(r => r.id === recipe.id)!.name }
  })

  let planned: { psi: number, minutes: number } | null = null
  if (body.planId) {
    const plan = await requirePlan(db, householdId, body.planId)
    const result = await computePlan(db, householdId, plan.request).catch(() => null)
    const load = result?.loads.find(l => l.index === body.planLoad)
    if (result && !load) badInput('planLoad', `That plan has loads 1 to ${result.loads.length}.`)
    if (load) planned = { psi: load.pressurePsi, minutes: load.processMinutes }
  }
  const { required: table, reason } = requiredFor(lines, catalogue.jarSizes, canner.gaugeType, household!.altitudeFt)
  const required = table && planned
    ? { ...table, psi: Math.max(table.psi, planned.psi), minutes: Math.max(table.minutes, planned.minutes) }
    : table
  const shortfall = loadShortfall({ psi: body.pressurePsi, minutes: body.processMinutes }, required, reason)
  const endedAt = new Date(body.endedAt)

  const id = await db.transaction(async (tx) => {
    const number = await nextLoadNumber(tx, householdId)
    const [load] = await tx.insert(tables.canningLoads).values({
      householdId,
      number,
      status: 'done',
      planId: body.planId ?? null,
      planLoadIndex: body.planLoad ?? null,
      cannerId: canner.id,
      cannerName: canner.name,
      gaugeType: canner.gaugeType,
      altitudeFt: household!.altitudeFt,
      pressurePsi: body.pressurePsi,
      processMinutes: body.processMinutes,
      requiredPsi: required?.psi ?? null,
      requiredMinutes: required?.minutes ?? null,
      requiredSource: required ? (planned ? `${required.source}; and the saved plan` : required.source) : null,
      startedAt: new Date(body.startedAt),
      endedAt,
      shortfall,
      notes: body.notes,
      createdBy: userId,
    }).returning({ id: tables.canningLoads.id })
    await tx.insert(tables.loadLines).values(lines.map((line, i) => ({
      loadId: load!.id,
      householdId,
      lineIndex: i,
      recipeId: line.recipe.id,
      product: line.product,
      jarSizeId: line.jarSize.id,
      jars: line.jars,
    })))
    const bySize = new Map<string, number>()
    for (const line of lines) bySize.set(line.jarSize.id, (bySize.get(line.jarSize.id) ?? 0) + line.jars)
    for (const [jarSizeId, jars] of bySize) {
      await tx.update(tables.jarStock)
        .set({ count: sql`greatest(${tables.jarStock.count} - ${jars}, 0)`, updatedAt: serverNow() })
        .where(and(eq(tables.jarStock.householdId, householdId), eq(tables.jarStock.jarSizeId, jarSizeId)))
    }
    await scheduleSealReminder(tx, householdId, load!.id, endedAt)
    if (body.planId) {
      await tx.update(tables.plans).set({ status: 'in-progress', updatedAt: serverNow() })
        .where(and(eq(tables.plans.id, body.planId), eq(tables.plans.status, 'planned')))
    }
    return load!.id
  })
  return loadDetail(db, householdId, id)
}

/** Record how a pending reprocessing load was run, or change a load's notes. */
export async function updateLoad(db: Database, householdId: string, loadId: string, body: LoadUpdateInput) {
  const load = await requireLoad(db, householdId, loadId)
  const run = body.pressurePsi !== undefined || body.processMinutes !== undefined || body.startedAt !== undefined || body.endedAt !== undefined
  if (run && load.status !== 'pending') refusal('This load is already logged; only its notes can change. Log a new load for another run.')
  if (run) {
    for (const field of ['pressurePsi', 'processMinutes', 'startedAt', 'endedAt'] as const) {
      if (body[field] === undefined) badInput(field, 'Give the pressure, the minutes, the start and the end of the run.')
    }
  }
  await db.transaction(async (tx) => {
    if (!run) {
      await tx.update(tables.canningLoads).set({ notes: body.notes ?? load.notes, updatedAt: serverNow() }).where(eq(tables.canningLoads.id, load.id))
      return
    }
    const required = load.requiredPsi !== null && load.requiredMinutes !== null ? { psi: load.requiredPsi, minutes: load.requiredMinutes } : null
    let shortfall = loadShortfall({ psi: body.pressurePsi!, minutes: body.processMinutes! }, required)
    const startedAt = new Date(body.startedAt!)
    if (!shortfall && load.deadlineAt && startedAt > load.deadlineAt) {
      shortfall = { kind: 'under-processed', message: 'Reprocessed more than 24 hours after the first unloading, later than the USDA Complete Guide allows. Do not shelve these jars: refrigerate and eat within several days.' }
    }
    const endedAt = new Date(body.endedAt!)
    await tx.update(tables.canningLoads).set({
      status: 'done',
      pressurePsi: body.pressurePsi!,
      processMinutes: body.processMinutes!,
      startedAt,
      endedAt,
      shortfall,
      notes: body.notes ?? load.notes,
      updatedAt: serverNow(),
    }).where(and(eq(tables.canningLoads.id, load.id), eq(tables.canningLoads.status, 'pending')))
    await scheduleSealReminder(tx, householdId, load.id, endedAt)
  })
  return loadDetail(db, householdId, load.id)
}

export async function scheduleSealReminder(tx: Db, householdId: string, loadId: string, endedAt: Date) {
  await tx.insert(tables.reminders).values({
    householdId,
    kind: 'seal-check',
    loadId,
    dueAt: sealWindow(endedAt, endedAt).dueAt,
  }).onConflictDoNothing()
}

type LoadRow = typeof tables.canningLoads.$inferSelect

/** The fields every load answer carries: its code, its seal window and its status in words. */
export function loadSummary(load: LoadRow, now: Date, checked: boolean) {
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
