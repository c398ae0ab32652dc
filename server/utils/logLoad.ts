/**
 * Writing the Logbook: logging a load that was run, correcting one, and the seal-check reminder
 * that goes with it. Reads are in logbook.ts.
 */
import { and, eq, inArray, isNotNull, isNull, sql } from 'drizzle-orm'
import { NO_ALTITUDE, PlanningRefusal, countOf, perJarFill, type JarSize, type Recipe } from '~~/utils/planning'
import { formatDateTime } from '~~/utils/time'
import { loadCode, loadShortfall, overCapacity, requiredProcess, sealWindow, type RequiredProcess } from '~~/utils/after'
import type { LoadCreateInput, LoadUpdateInput } from '~~/utils/schemas/logbook'
import type { PlanRequestBody } from '~~/utils/schemas/plan'
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
  const [{ catalogue, recipes, ingredients }, [household], [canner]] = await Promise.all([
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
  refuseOverCapacity(canner, lines)
  refuseFuture(body)

  let planned: { psi: number, minutes: number } | null = null
  let planResult: Awaited<ReturnType<typeof computePlan>> | null = null
  let planRequest: PlanRequestBody | null = null
  if (body.planId) {
    const plan = await requirePlan(db, householdId, body.planId)
    planRequest = plan.request
    planResult = await computePlan(db, householdId, plan.request).catch(() => null)
    const load = planResult?.loads.find(l => l.index === body.planLoad)
    if (planResult && !load) badInput('planLoad', `That plan has loads 1 to ${planResult.loads.length}.`)
    if (load) planned = { psi: load.pressurePsi, minutes: load.processMinutes }
    const [already] = await db.select({ number: tables.canningLoads.number }).from(tables.canningLoads)
      .where(and(eq(tables.canningLoads.householdId, householdId), eq(tables.canningLoads.planId, body.planId), eq(tables.canningLoads.planLoadIndex, body.planLoad!), isNull(tables.canningLoads.reprocessOfId)))
    if (already) refusal(`Load ${body.planLoad} of this plan is already logged as ${loadCode(already.number)}. Correct that entry instead, or log this run without the plan.`, 'planLoad')
  }
  // The dry beans each line used, so the pantry's dry goods go down by them: the plan's own
  // amount per jar and bean for a load of a plan, else the recipe's for the jar and the bean the
  // product names (a recipe for any variety), else the recipe's own bean.
  const dryUse = lines.map((line) => {
    const fromPlan = planResult?.lines.find(l => l.recipeId === line.recipe.id && l.jarSizeId === line.jarSize.id)
    if (fromPlan) {
      const ingredientId = planRequest?.lines[fromPlan.lineIndex]?.ingredientId ?? line.recipe.ingredientId
      return { ingredientId, grams: fromPlan.perJar.dryGrams * line.jars }
    }
    const bean = ingredients.find(g => line.product.toLowerCase().startsWith(g.name.toLowerCase())) ?? ingredients.find(g => g.id === line.recipe.ingredientId)
    const ingredient = catalogue.ingredients.find(g => g.id === bean?.id)
    if (!ingredient) return null
    try {
      return { ingredientId: ingredient.id, grams: perJarFill(line.recipe, line.jarSize, ingredient, catalogue.jarSizes, {}, 'lines').dryGrams * line.jars }
    }
    catch (error) {
      if (error instanceof PlanningRefusal) return null
      throw error
    }
  })
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
    // Filling the jars takes them out of the empty-jar stock and the beans out of the pantry;
    // each line keeps what it took, so a correction or a delete gives back exactly that.
    const taken: Array<{ jarsFromStock: number, dryGramsFromStock: number, dryGoodsIngredientId: string | null }> = []
    for (const [i, line] of lines.entries()) {
      const jarsFromStock = await drawStock(tx, householdId, 'jars', line.jarSize.id, line.jars)
      const use = dryUse[i]
      const dryGramsFromStock = use ? await drawStock(tx, householdId, 'dry', use.ingredientId, use.grams) : 0
      taken.push({ jarsFromStock, dryGramsFromStock, dryGoodsIngredientId: use && dryGramsFromStock > 0 ? use.ingredientId : null })
    }
    await tx.insert(tables.loadLines).values(lines.map((line, i) => ({
      loadId: load!.id,
      householdId,
      lineIndex: i,
      recipeId: line.recipe.id,
      product: line.product,
      jarSizeId: line.jarSize.id,
      jars: line.jars,
      ...taken[i],
    })))
    await scheduleSealReminder(tx, householdId, load!.id, endedAt)
    if (body.planId) await settlePlanStatus(tx, householdId, body.planId)
    // The Canning day records its own words for the load, in its own transaction.
    if (!day) await recordActivity(tx, { householdId, userId, kind: 'load', summary: `Logged load ${loadCode(number)}`, detail: { loadId: load!.id } })
    return load!.id
  })
  return loadDetail(db, householdId, id)
}

/**
 * Record how a pending reprocessing load was run, correct a logged load, change a load's notes,
 * or confirm a load the Canning day logged. Every change goes into the activity record in the
 * same transaction, a correction with what it was and what it became.
 */
export async function updateLoad(db: Database, householdId: string, loadId: string, body: LoadUpdateInput, userId: string) {
  const load = await requireLoad(db, householdId, loadId)
  const code = loadCode(load.number)
  const run = body.pressurePsi !== undefined || body.processMinutes !== undefined || body.startedAt !== undefined || body.endedAt !== undefined
  refuseFuture(body)
  if (load.status === 'pending') {
    if (body.lines) refusal('Record how this reprocessing load was run first; its jars are those sent to it at the seal check.', 'lines')
    if (run) {
      for (const field of ['pressurePsi', 'processMinutes', 'startedAt', 'endedAt'] as const) {
        if (body[field] === undefined) badInput(field, 'Give the pressure, the minutes, the start and the end of the run.')
      }
      return recordRun(db, householdId, load, body, userId)
    }
  }
  else if (run || body.lines) {
    return correctLoad(db, householdId, load, body, userId)
  }
  await db.transaction(async (tx) => {
    const confirm = body.confirmed && !load.confirmedAt ? { confirmedAt: serverNow(), confirmedBy: userId } : {}
    await tx.update(tables.canningLoads).set({ notes: body.notes ?? load.notes, ...confirm, updatedAt: serverNow() }).where(eq(tables.canningLoads.id, load.id))
    const what = body.confirmed ? `Confirmed load ${code} as the Canning day logged it` : `Changed the notes of load ${code}`
    await recordActivity(tx, { householdId, userId, kind: 'load', summary: what, detail: { loadId } })
  })
  return loadDetail(db, householdId, load.id)
}

type LoadRow = typeof tables.canningLoads.$inferSelect

/** A reprocessing run started after its deadline (CG "Reprocessing unsealed jars": within 24 hours). */
const LATE_REPROCESS = { kind: 'under-processed' as const, message: 'Reprocessed more than 24 hours after the first unloading, later than the USDA Complete Guide allows. Do not shelve these jars: refrigerate and eat within several days.' }

/** How a pending reprocessing load was run: it becomes a logged load with its seal reminder. */
async function recordRun(db: Database, householdId: string, load: LoadRow, body: LoadUpdateInput, userId: string) {
  const required = load.requiredPsi !== null && load.requiredMinutes !== null ? { psi: load.requiredPsi, minutes: load.requiredMinutes } : null
  let shortfall = loadShortfall({ psi: body.pressurePsi!, minutes: body.processMinutes! }, required)
  const startedAt = new Date(body.startedAt!)
  if (!shortfall && load.deadlineAt && startedAt > load.deadlineAt) shortfall = LATE_REPROCESS
  const endedAt = new Date(body.endedAt!)
  await db.transaction(async (tx) => {
    const [done] = await tx.update(tables.canningLoads).set({
      status: 'done',
      pressurePsi: body.pressurePsi!,
      processMinutes: body.processMinutes!,
      startedAt,
      endedAt,
      shortfall,
      notes: body.notes ?? load.notes,
      confirmedAt: serverNow(),
      confirmedBy: userId,
      updatedAt: serverNow(),
    }).where(and(eq(tables.canningLoads.id, load.id), eq(tables.canningLoads.status, 'pending'))).returning({ id: tables.canningLoads.id })
    if (!done) conflict('Someone recorded this run meanwhile; reload the load.')
    await scheduleSealReminder(tx, householdId, load.id, endedAt)
    await recordActivity(tx, { householdId, userId, kind: 'load', summary: `Recorded the run of load ${loadCode(load.number)}`, detail: { loadId: load.id } })
  })
  return loadDetail(db, householdId, load.id)
}

const MAX_LOAD_MS = 24 * 3_600_000
const when = (d: Date | null, zone: string) => (d ? formatDateTime(d.toISOString(), zone) : 'not recorded')

/**
 * Correct a logged load: its times, pressure and minutes at any time; the jars of its lines
 * until the seal check counts them. Empty jars and dry goods follow a change of jars in the same
 * transaction. A correction that makes the load under-processed is taken before its seal check
 * (the page then asks to refrigerate or reprocess at once) and refused once jars are on the
 * Shelf, with what to do instead.
 */
async function correctLoad(db: Database, householdId: string, load: LoadRow, body: LoadUpdateInput, userId: string) {
  const code = loadCode(load.number)
  const zone = await householdTimeZone(db, householdId)
  const startedAt = body.startedAt ? new Date(body.startedAt) : load.startedAt
  const endedAt = body.endedAt ? new Date(body.endedAt) : load.endedAt
  const psi = body.pressurePsi ?? load.pressurePsi
  const minutes = body.processMinutes ?? load.processMinutes
  if (startedAt && endedAt) {
    const span = endedAt.getTime() - startedAt.getTime()
    if (span <= 0) badInput(body.endedAt ? 'endedAt' : 'startedAt', `The load must come out after it went in: it started ${when(startedAt, zone)} and came out ${when(endedAt, zone)}.`)
    if (span > MAX_LOAD_MS) badInput(body.endedAt ? 'endedAt' : 'startedAt', 'One load does not take more than 24 hours: check the start and end.')
  }
  const [lines, [check], [canner], jarSizes] = await Promise.all([
    db.select().from(tables.loadLines).where(eq(tables.loadLines.loadId, load.id)),
    db.select({ id: tables.sealChecks.id }).from(tables.sealChecks).where(eq(tables.sealChecks.loadId, load.id)),
    load.cannerId ? db.select().from(tables.canners).where(and(eq(tables.canners.id, load.cannerId), eq(tables.canners.householdId, householdId))) : Promise.resolve([]),
    db.select().from(tables.jarSizes),
  ])
  const edits = (body.lines ?? []).map((edit, i) => {
    const line = lines.find(l => l.id === edit.id)
    if (!line) badInput(`lines.${i}.id`, `That line is not part of load ${code}.`)
    return { line, jars: edit.jars }
  }).filter(e => e.jars !== e.line.jars)
  if (edits.length && check) {
    refusal(`The seal check of load ${code} has already counted its jars. Correct the lot on the Shelf instead, or delete this load and log it again.`, 'lines')
  }
  const jarsAfter = lines.map(l => ({ line: l, jars: edits.find(e => e.line.id === l.id)?.jars ?? l.jars }))
  if (canner && edits.length) {
    const why = overCapacity(canner, jarsAfter.map(l => ({ jar: jarSizes.find(j => j.id === l.line.jarSizeId)!, jars: l.jars })))
    if (why) badInput('lines', why)
  }
  const required = load.requiredPsi !== null && load.requiredMinutes !== null ? { psi: load.requiredPsi, minutes: load.requiredMinutes } : null
  let shortfall = required && psi !== null && minutes !== null ? loadShortfall({ psi, minutes }, required) : load.shortfall
  if (!shortfall && load.deadlineAt && startedAt && startedAt > load.deadlineAt) shortfall = LATE_REPROCESS
  // Once the seal check (or the decision on an under-processed load) has sent jars to the Shelf,
  // the refrigerator or reprocessing, a correction may not turn the load safe or unsafe.
  if (check && Boolean(shortfall) !== Boolean(load.shortfall)) {
    if (shortfall) {
      refusal(`With ${psi} psi for ${minutes} minutes load ${code} would be under-processed, and its jars have been checked and put away. Do not eat them: take them off the Shelf as a correction (they cannot be kept), then correct the log. Within 24 hours of unloading they could still be reprocessed.`, 'processMinutes')
    }
    refusal(`Load ${code} was under-processed and its jars have already gone to the refrigerator or to reprocessing; that decision stands, so the log cannot now say it got its full process.`, 'processMinutes')
  }

  const changes: string[] = []
  if (body.startedAt && startedAt?.getTime() !== load.startedAt?.getTime()) changes.push(`start ${when(load.startedAt, zone)} → ${when(startedAt, zone)}`)
  if (body.endedAt && endedAt?.getTime() !== load.endedAt?.getTime()) changes.push(`out ${when(load.endedAt, zone)} → ${when(endedAt, zone)}`)
  if (body.pressurePsi !== undefined && psi !== load.pressurePsi) changes.push(`pressure ${load.pressurePsi ?? '—'} → ${psi} psi`)
  if (body.processMinutes !== undefined && minutes !== load.processMinutes) changes.push(`process ${load.processMinutes ?? '—'} → ${minutes} min`)
  for (const e of edits) changes.push(`${e.line.product} ${e.line.jars} → ${countOf(e.jars, 'jar')}`)

  await db.transaction(async (tx) => {
    const [locked] = await tx.select({ updatedAt: tables.canningLoads.updatedAt }).from(tables.canningLoads).where(eq(tables.canningLoads.id, load.id)).for('update')
    if (!locked || locked.updatedAt.getTime() !== load.updatedAt.getTime()) conflict(`Load ${code} was changed meanwhile; reload it and correct it again.`)
    if (edits.length) {
      const [late] = await tx.select({ id: tables.sealChecks.id }).from(tables.sealChecks).where(eq(tables.sealChecks.loadId, load.id))
      if (late) conflict(`The seal check of load ${code} was recorded meanwhile; reload it.`)
    }
    for (const { line, jars } of edits) {
      // Dry goods follow at the grams a jar took from the pantry when the load was logged.
      const gramsPerJar = line.jars > 0 ? line.dryGramsFromStock / line.jars : 0
      let jarsFromStock = line.jarsFromStock
      let dryGramsFromStock = line.dryGramsFromStock
      if (jars > line.jars) {
        jarsFromStock += await drawStock(tx, householdId, 'jars', line.jarSizeId, jars - line.jars)
        if (line.dryGoodsIngredientId) dryGramsFromStock += await drawStock(tx, householdId, 'dry', line.dryGoodsIngredientId, gramsPerJar * (jars - line.jars))
      }
      else {
        const back = Math.min(jarsFromStock, line.jars - jars)
        await returnStock(tx, householdId, 'jars', line.jarSizeId, back)
        jarsFromStock -= back
        const grams = Math.min(dryGramsFromStock, gramsPerJar * (line.jars - jars))
        if (line.dryGoodsIngredientId) await returnStock(tx, householdId, 'dry', line.dryGoodsIngredientId, grams)
        dryGramsFromStock -= grams
      }
      await tx.update(tables.loadLines).set({ jars, jarsFromStock, dryGramsFromStock }).where(eq(tables.loadLines.id, line.id))
    }
    await tx.update(tables.canningLoads).set({
      startedAt, endedAt, pressurePsi: psi, processMinutes: minutes, shortfall,
      notes: body.notes ?? load.notes, updatedAt: serverNow(),
    }).where(eq(tables.canningLoads.id, load.id))
    if (endedAt && endedAt.getTime() !== load.endedAt?.getTime()) {
      // The reminder follows the new time unless it has gone out already.
      await tx.update(tables.reminders).set({ dueAt: sealWindow(endedAt, endedAt).dueAt, updatedAt: serverNow() })
        .where(and(eq(tables.reminders.loadId, load.id), isNull(tables.reminders.sentAt)))
    }
    await recordActivity(tx, {
      householdId, userId, kind: 'load',
      summary: changes.length ? `Corrected load ${code}: ${changes.join('; ')}` : `Corrected load ${code} (no values changed)`,
      detail: { loadId: load.id, changes },
    })
  })
  return loadDetail(db, householdId, load.id)
}

/**
 * Delete a load logged by mistake, as if it had never been logged: its lines, seal check,
 * reminder and photos go, its lots leave the Shelf (with their take-offs), and the household's
 * stock gets back what the load took — its empty jars less those already returned by take-offs
 * and eaten refrigerator jars, and its dry goods. A plan it belonged to is set from the loads that
 * remain. A load that was reprocessed cannot go before its reprocessing load.
 */
export async function deleteLoad(db: Database, householdId: string, loadId: string, userId: string) {
  const load = await requireLoad(db, householdId, loadId)
  const code = loadCode(load.number)
  const photoKeys = await db.transaction(async (tx) => {
    const [locked] = await tx.select({ id: tables.canningLoads.id }).from(tables.canningLoads)
      .where(and(eq(tables.canningLoads.id, load.id), eq(tables.canningLoads.householdId, householdId))).for('update')
    if (!locked) notFound('No such load in this household.')
    const [again] = await tx.select({ number: tables.canningLoads.number }).from(tables.canningLoads)
      .where(and(eq(tables.canningLoads.reprocessOfId, load.id), eq(tables.canningLoads.householdId, householdId)))
    if (again) refusal(`Jars of load ${code} went to reprocessing load ${loadCode(again.number)}; delete that load first.`, 'loadId')
    const lines = await tx.select().from(tables.loadLines).where(eq(tables.loadLines.loadId, load.id))
    const lots = await tx.select({ id: tables.shelfLots.id, jarSizeId: tables.shelfLots.jarSizeId }).from(tables.shelfLots)
      .where(and(eq(tables.shelfLots.loadId, load.id), eq(tables.shelfLots.householdId, householdId)))
    const moves = lots.length
      ? await tx.select({ lotId: tables.shelfMovements.lotId, returned: tables.shelfMovements.jarsReturned }).from(tables.shelfMovements)
          .where(and(inArray(tables.shelfMovements.lotId, lots.map(l => l.id)), isNull(tables.shelfMovements.undoneAt)))
      : []
    const eaten = await tx.select({ jarSizeId: tables.fridgeItems.jarSizeId, jars: tables.fridgeItems.jars }).from(tables.fridgeItems)
      .where(and(eq(tables.fridgeItems.loadId, load.id), isNotNull(tables.fridgeItems.clearedAt)))
    // Empties already back in stock from this load's jars: by jar size.
    const backAlready = new Map<string, number>()
    for (const m of moves) {
      const size = lots.find(l => l.id === m.lotId)!.jarSizeId
      backAlready.set(size, (backAlready.get(size) ?? 0) + m.returned)
    }
    for (const f of eaten) backAlready.set(f.jarSizeId, (backAlready.get(f.jarSizeId) ?? 0) + f.jars)
    const fromStock = new Map<string, number>()
    for (const l of lines) fromStock.set(l.jarSizeId, (fromStock.get(l.jarSizeId) ?? 0) + l.jarsFromStock)
    for (const size of new Set([...fromStock.keys(), ...backAlready.keys()])) {
      const net = (fromStock.get(size) ?? 0) - (backAlready.get(size) ?? 0)
      if (net > 0) await returnStock(tx, householdId, 'jars', size, net)
      else if (net < 0) await drawStock(tx, householdId, 'jars', size, -net)
    }
    for (const l of lines) if (l.dryGoodsIngredientId) await returnStock(tx, householdId, 'dry', l.dryGoodsIngredientId, l.dryGramsFromStock)
    const photos = await tx.select({ key: tables.loadPhotos.storageKey }).from(tables.loadPhotos).where(eq(tables.loadPhotos.loadId, load.id))
    if (lots.length) await tx.delete(tables.shelfLots).where(inArray(tables.shelfLots.id, lots.map(l => l.id)))
    await tx.delete(tables.canningLoads).where(eq(tables.canningLoads.id, load.id))
    if (load.planId) await settlePlanStatus(tx, householdId, load.planId, 'delete')
    const jars = lines.reduce((s, l) => s + l.jars, 0)
    await recordActivity(tx, {
      householdId, userId, kind: 'load',
      summary: `Deleted load ${code} (${countOf(jars, 'jar')} of ${[...new Set(lines.map(l => l.product))].join(', ')}, logged by mistake)${lots.length ? `; its ${countOf(lots.length, 'lot')} left the Shelf` : ''}`,
      detail: { loadId: load.id, number: load.number },
    })
    return photos.map(p => p.key)
  })
  // The files go once the rows are gone; a file left by a failure here is only unused storage.
  for (const key of photoKeys) await usePhotoStorage().removeItem(key).catch(() => {})
  return { deleted: code }
}

/**
 * Take up to `amount` out of the household's empty jars of a size ('jars') or dry goods of an
 * ingredient ('dry'), never below 0; answers what was taken.
 */
export async function drawStock(tx: Tx, householdId: string, what: 'jars' | 'dry', id: string, amount: number): Promise<number> {
  if (!(amount > 0)) return 0
  if (what === 'jars') {
    const [row] = await tx.select({ count: tables.jarStock.count }).from(tables.jarStock)
      .where(and(eq(tables.jarStock.householdId, householdId), eq(tables.jarStock.jarSizeId, id))).for('update')
    const take = Math.min(row?.count ?? 0, Math.round(amount))
    if (take > 0) {
      await tx.update(tables.jarStock).set({ count: sql`${tables.jarStock.count} - ${take}`, updatedAt: serverNow() })
        .where(and(eq(tables.jarStock.householdId, householdId), eq(tables.jarStock.jarSizeId, id)))
    }
    return take
  }
  const [row] = await tx.select({ grams: tables.dryGoodsStock.grams }).from(tables.dryGoodsStock)
    .where(and(eq(tables.dryGoodsStock.householdId, householdId), eq(tables.dryGoodsStock.ingredientId, id))).for('update')
  const take = Math.min(row?.grams ?? 0, amount)
  if (take > 0) {
    await tx.update(tables.dryGoodsStock).set({ grams: sql`greatest(${tables.dryGoodsStock.grams} - ${take}, 0)`, updatedAt: serverNow() })
      .where(and(eq(tables.dryGoodsStock.householdId, householdId), eq(tables.dryGoodsStock.ingredientId, id)))
  }
  return take
}

/** Give back to the household's stock what a load line took (a correction, or a deleted load). */
export async function returnStock(tx: Tx, householdId: string, what: 'jars' | 'dry', id: string, amount: number) {
  if (!(amount > 0)) return
  if (what === 'jars') {
    await tx.insert(tables.jarStock).values({ householdId, jarSizeId: id, count: amount })
      .onConflictDoUpdate({ target: [tables.jarStock.householdId, tables.jarStock.jarSizeId], set: { count: sql`${tables.jarStock.count} + ${amount}`, updatedAt: serverNow() } })
    return
  }
  await tx.insert(tables.dryGoodsStock).values({ householdId, ingredientId: id, grams: amount })
    .onConflictDoUpdate({ target: [tables.dryGoodsStock.householdId, tables.dryGoodsStock.ingredientId], set: { grams: sql`${tables.dryGoodsStock.grams} + ${amount}`, updatedAt: serverNow() } })
}

/**
 * A plan's status follows its loads: planned until one is logged, in progress until every load
 * of the plan is, then done. Logging only moves it forward (a plan marked done by hand stays
 * done); deleting a logged load (`after: 'delete'`) sets it from the loads that remain.
 */
const statusRank = { 'planned': 0, 'in-progress': 1, 'done': 2 } as const
export async function settlePlanStatus(tx: Tx, householdId: string, planId: string, after: 'log' | 'delete' = 'log') {
  const [plan] = await tx.select().from(tables.plans).where(and(eq(tables.plans.id, planId), eq(tables.plans.householdId, householdId))).for('update')
  if (!plan) return
  const logged = await tx.selectDistinct({ index: tables.canningLoads.planLoadIndex }).from(tables.canningLoads)
    .where(and(eq(tables.canningLoads.householdId, householdId), eq(tables.canningLoads.planId, planId), isNull(tables.canningLoads.reprocessOfId), isNotNull(tables.canningLoads.planLoadIndex)))
  const total = plan.summary.loads
  const status = logged.length === 0 ? 'planned' : logged.length >= total ? 'done' : 'in-progress'
  if (status !== plan.status && (after === 'delete' || statusRank[status] > statusRank[plan.status])) {
    await tx.update(tables.plans).set({ status, updatedAt: serverNow() }).where(eq(tables.plans.id, planId))
  }
}

/** Times in the future are a typing slip (a minute or two of clock drift is allowed). */
const FUTURE_SLACK_MS = 5 * 60_000
export function refuseFuture(body: { startedAt?: string, endedAt?: string }) {
  const latest = serverNow().getTime() + FUTURE_SLACK_MS
  for (const field of ['startedAt', 'endedAt'] as const) {
    const at = body[field]
    if (at && Date.parse(at) > latest) badInput(field, `That time is in the future; log a load once it has ${field === 'startedAt' ? 'started' : 'come out'}.`)
  }
}

/** More jars than the canner holds for their sizes is a typing slip: refused with the capacity. */
export function refuseOverCapacity(canner: typeof tables.canners.$inferSelect, lines: ReadonlyArray<{ jarSize: JarSize, jars: number }>) {
  const why = overCapacity(canner, lines.map(l => ({ jar: l.jarSize, jars: l.jars })))
  if (why) badInput(lines.length === 1 ? 'lines.0.jars' : 'lines', why)
}

async function scheduleSealReminder(tx: Db, householdId: string, loadId: string, endedAt: Date) {
  await tx.insert(tables.reminders).values({
    householdId,
    kind: 'seal-check',
    loadId,
    dueAt: sealWindow(endedAt, endedAt).dueAt,
  }).onConflictDoNothing()
}
