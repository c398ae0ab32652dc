/**
 * Writing the Logbook: logging a load that was run, correcting one, and the seal-check reminder
 * that goes with it. Reads are in logbook.ts.
 */
import { and, eq, sql } from 'drizzle-orm'
import { NO_ALTITUDE, PlanningRefusal, type JarSize, type Recipe } from '~~/utils/planning'
import { loadShortfall, requiredProcess, sealWindow, type RequiredProcess } from '~~/utils/after'
import type { LoadCreateInput, LoadUpdateInput } from '~~/utils/schemas/logbook'
import { loadCatalogue } from './catalogue'
import type { Database, Db, Tx } from './database'
import { loadDetail, requireLoad } from './logbook'
import { computePlan, requirePlan } from './plans'

/** Lock the household row so load numbers are handed out one at a time, then the next number. */
export async function nextLoadNumber(tx: Tx, householdId: string): Promise<number> {
  await tx.select({ id: tables.households.id }).from(tables.households).where(eq(tables.households.id, householdId)).for('update')
  const [row] = await tx.select({ max: sql<number>`coalesce(max(${tables.canningLoads.number}), 0)` })
    .from(tables.canningLoads).where(eq(tables.canningLoads.householdId, householdId))
  return Number(row?.max ?? 0) + 1
}

/** What the published tables require of these lines, or the refusal that says why nothing does. */
function requiredFor(
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
/** The times the Canning day recorded for a load as it ran; such a load waits for the canner to confirm it. */
export interface DayRecord {
  ventStartedAt: Date | null
  pressureReachedAt: Date | null
  processStartedAt: Date | null
  processEndedAt: Date | null
  pressureDrops: string[]
}

export async function createLoad(db: Db, householdId: string, userId: string, body: LoadCreateInput, day?: DayRecord) {
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
  // The altitude is stored with the load; without one there is no published pressure to check it against.
  const altitudeFt = household!.altitudeFt
  if (altitudeFt === null) refusal(NO_ALTITUDE)
  const { required: table, reason } = requiredFor(lines, catalogue.jarSizes, canner.gaugeType, altitudeFt)
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
      altitudeFt,
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
      ...(day ?? {}),
      confirmedAt: day ? null : serverNow(),
      confirmedBy: day ? null : userId,
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

/** Record how a pending reprocessing load was run, change a load's notes, or confirm a load the Canning day logged. */
export async function updateLoad(db: Database, householdId: string, loadId: string, body: LoadUpdateInput, userId?: string) {
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
      const confirm = body.confirmed && !load.confirmedAt ? { confirmedAt: serverNow(), confirmedBy: userId ?? null } : {}
      await tx.update(tables.canningLoads).set({ notes: body.notes ?? load.notes, ...confirm, updatedAt: serverNow() }).where(eq(tables.canningLoads.id, load.id))
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
      confirmedAt: serverNow(),
      updatedAt: serverNow(),
    }).where(and(eq(tables.canningLoads.id, load.id), eq(tables.canningLoads.status, 'pending')))
    await scheduleSealReminder(tx, householdId, load.id, endedAt)
  })
  return loadDetail(db, householdId, load.id)
}

async function scheduleSealReminder(tx: Db, householdId: string, loadId: string, endedAt: Date) {
  await tx.insert(tables.reminders).values({
    householdId,
    kind: 'seal-check',
    loadId,
    dueAt: sealWindow(endedAt, endedAt).dueAt,
  }).onConflictDoNothing()
}
