import { and, asc, eq, isNotNull, isNull } from 'drizzle-orm'
import { dateIn, formatDateTime } from '~~/utils/time'
import { REPROCESS_WITHIN_HOURS, bestByDate, loadCode, sealRate, sealRatesBy, sealWindow } from '~~/utils/after'
import type { SealCheckInput } from '~~/utils/schemas/logbook'
import type { UnsealedAction } from '~~/utils/vocabulary'
import { recordActivity } from './activity'
import { serverNow } from './clock'
import type { Database, Tx } from './database'
import { loadDetail, requireLoad } from './logbook'
import { nextLoadNumber } from './logLoad'

type LoadRow = typeof tables.canningLoads.$inferSelect
type LineRow = typeof tables.loadLines.$inferSelect
interface OffShelf { line: LineRow, jars: number, action: UnsealedAction }

/**
 * Jars that may not go on the Shelf: to the refrigerator list, or into one new pending load for
 * reprocessing before `reprocessBy` with a new lid and the same process time.
 */
async function sendOffShelf(tx: Tx, ctx: { householdId: string, userId: string, load: LoadRow, now: Date, reprocessBy: Date }, jars: OffShelf[]) {
  const { householdId, userId, load, now } = ctx
  for (const { line, jars: n, action } of jars) {
    if (action === 'refrigerate') {
      await tx.insert(tables.fridgeItems).values({ householdId, loadId: load.id, loadLineId: line.id, product: line.product, jarSizeId: line.jarSizeId, jars: n, refrigeratedAt: now })
    }
  }
  const reprocess = jars.filter(j => j.action === 'reprocess')
  if (!reprocess.length) return
  const number = await nextLoadNumber(tx, householdId)
  const [again] = await tx.insert(tables.canningLoads).values({
    householdId, number, status: 'pending', reprocessOfId: load.id, planId: load.planId, planLoadIndex: load.planLoadIndex,
    cannerId: load.cannerId, cannerName: load.cannerName, gaugeType: load.gaugeType, altitudeFt: load.altitudeFt,
    requiredPsi: load.requiredPsi, requiredMinutes: load.requiredMinutes, requiredSource: load.requiredSource,
    deadlineAt: ctx.reprocessBy, createdBy: userId,
    notes: `Reprocessing ${reprocess.reduce((s, r) => s + r.jars, 0)} jars from load ${loadCode(load.number)}: remove the lids, check the rims, use new lids, and process for the same time.`,
  }).returning({ id: tables.canningLoads.id })
  await tx.insert(tables.loadLines).values(reprocess.map((r, i) => ({
    loadId: again!.id, householdId, lineIndex: i, recipeId: r.line.recipeId, product: r.line.product, jarSizeId: r.line.jarSizeId, jars: r.jars,
  })))
}

/**
 * Decide at once what happens to an under-processed load (it got less than its published
 * pressure or minutes): none of its jars may go on the Shelf, so there is no seal check to wait
 * for — all its jars go to the refrigerator list, or are reprocessed within 24 h of coming out.
 */
export async function decideUnsafeLoad(db: Database, householdId: string, userId: string, loadId: string, action: UnsealedAction) {
  const now = serverNow()
  await db.transaction(async (tx) => {
    const [load] = await tx.select().from(tables.canningLoads)
      .where(and(eq(tables.canningLoads.id, loadId), eq(tables.canningLoads.householdId, householdId))).for('update')
    if (!load) notFound('No such load in this household.')
    if (!load.shortfall || load.status !== 'done' || !load.endedAt) refusal('This load got its published pressure and minutes: check its seals 12–24 hours after it came out instead.', 'loadId')
    const window = sealWindow(load.endedAt, now)
    if (action === 'reprocess' && now > window.reprocessBy) {
      refusal(`It is more than ${REPROCESS_WITHIN_HOURS} hours since load ${loadCode(load.number)} came out, too late to reprocess (USDA Complete Guide, "Reprocessing unsealed jars"). Refrigerate the jars and eat them within several days.`, 'action')
    }
    const [check] = await tx.insert(tables.sealChecks).values({
      loadId: load.id, householdId, checkedAt: now, checkedBy: userId,
      notes: `Under-processed: every jar ${action === 'refrigerate' ? 'went to the refrigerator' : 'is to be reprocessed'}, decided when it came out.`,
    }).onConflictDoNothing().returning()
    if (!check) conflict(`What happens to load ${loadCode(load.number)} is already decided.`)
    const lines = await tx.select().from(tables.loadLines).where(eq(tables.loadLines.loadId, load.id))
    for (const line of lines) await tx.update(tables.loadLines).set({ unsealedAction: action }).where(eq(tables.loadLines.id, line.id))
    await sendOffShelf(tx, { householdId, userId, load, now, reprocessBy: window.reprocessBy }, lines.map(line => ({ line, jars: line.jars, action })))
    await tx.update(tables.reminders).set({ cancelledAt: now, updatedAt: now })
      .where(and(eq(tables.reminders.loadId, load.id), eq(tables.reminders.kind, 'seal-check')))
    await recordActivity(tx, { householdId, userId, kind: 'seal-check', summary: `Load ${loadCode(load.number)} was under-processed: ${action === 'refrigerate' ? 'refrigerated its jars' : 'set its jars to be reprocessed'}`, detail: { loadId } })
  })
  return loadDetail(db, householdId, loadId)
}

/**
 * Record a load's seal check: 12 h or more after it came out (USDA CG "Cooling jars": cool
 * 12–24 h, then test the seals). Sealed jars go onto the Shelf as a lot with a best-by of the
 * household's months (12 by default). Jars that cannot go on the Shelf — unsealed ones, or
 * every jar of an under-processed load — go to the refrigerator list, or into one new pending
 * load for reprocessing within 24 h with a new lid and the same process time.
 */
export async function recordSealCheck(db: Database, householdId: string, userId: string, body: SealCheckInput) {
  const now = serverNow()
  const load = await requireLoad(db, householdId, body.loadId)
  if (load.status !== 'done' || !load.endedAt) refusal('This load has not been run yet: log its run first, then check its seals 12–24 hours after it comes out.', 'loadId')
  const [existing] = await db.select({ id: tables.sealChecks.id }).from(tables.sealChecks).where(eq(tables.sealChecks.loadId, load.id))
  if (existing) conflict(`The seal check of load ${loadCode(load.number)} is already recorded.`)
  const [household] = await db.select().from(tables.households).where(eq(tables.households.id, householdId))
  if (!household) notFound('No such household.')
  const window = sealWindow(load.endedAt, now)
  if (window.status === 'cooling') {
    refusal(`Let the jars cool undisturbed: test the seals from ${formatDateTime(window.dueAt, household.timeZone)}, 12 hours after the load came out (USDA Complete Guide, "Cooling jars").`, 'loadId')
  }

  const lines = await db.select().from(tables.loadLines).where(eq(tables.loadLines.loadId, load.id))
  const unsafe = load.shortfall !== null
  const plan = lines.map((line) => {
    const i = body.lines.findIndex(l => l.loadLineId === line.id)
    if (i < 0) badInput('lines', `Record every line of the load: ${line.product} is missing.`)
    return { line, input: body.lines[i]!, i }
  })
  body.lines.forEach((l, i) => {
    if (!lines.some(line => line.id === l.loadLineId)) badInput(`lines.${i}.loadLineId`, 'That line is not part of this load.')
  })
  for (const { line, input, i } of plan) {
    if (input.sealed + input.unsealed !== line.jars) {
      badInput(`lines.${i}.unsealed`, `Sealed and unsealed jars must add up to the ${line.jars} jars of ${line.product} in this load.`)
    }
    const offShelf = unsafe ? line.jars : input.unsealed
    if (offShelf > 0 && !input.action) {
      badInput(`lines.${i}.action`, unsafe
        ? 'This load was under-processed, so none of its jars may go on the shelf: choose refrigerate or reprocess.'
        : 'Choose what to do with the unsealed jars: refrigerate, or reprocess within 24 hours.')
    }
    if (offShelf > 0 && input.action === 'reprocess' && now > window.reprocessBy) {
      refusal(`It is more than ${REPROCESS_WITHIN_HOURS} hours since load ${loadCode(load.number)} came out, too late to reprocess (USDA Complete Guide, "Reprocessing unsealed jars"). Refrigerate the jars and eat them within several days.`, `lines.${i}.action`)
    }
  }

  const cannedOn = dateIn(load.startedAt ?? load.endedAt, household.timeZone)
  const bestBy = bestByDate(cannedOn, household.bestByMonths)
  const code = loadCode(load.number)
  await db.transaction(async (tx) => {
    const [check] = await tx.insert(tables.sealChecks).values({ loadId: load.id, householdId, checkedAt: now, checkedBy: userId, notes: body.notes })
      .onConflictDoNothing().returning()
    if (!check) conflict(`The seal check of load ${code} is already recorded.`)
    const offShelfJars: OffShelf[] = []
    for (const { line, input } of plan) {
      const offShelf = unsafe ? line.jars : input.unsealed
      const toShelf = line.jars - offShelf
      await tx.update(tables.loadLines).set({ sealed: input.sealed, unsealed: input.unsealed, unsealedAction: offShelf > 0 ? input.action! : null })
        .where(eq(tables.loadLines.id, line.id))
      if (toShelf > 0) {
        await tx.insert(tables.shelfLots).values({
          householdId, loadId: load.id, loadLineId: line.id, recipeId: line.recipeId, product: line.product, jarSizeId: line.jarSizeId,
          loadCode: code, cannedOn, bestBy, jarsIn: toShelf, jarsLeft: toShelf, source: 'seal-check', shelvedAt: now,
        })
      }
      if (offShelf > 0) offShelfJars.push({ line, jars: offShelf, action: input.action! })
    }
    await sendOffShelf(tx, { householdId, userId, load, now, reprocessBy: window.reprocessBy }, offShelfJars)
    await tx.update(tables.reminders).set({ cancelledAt: now, updatedAt: now })
      .where(and(eq(tables.reminders.loadId, load.id), eq(tables.reminders.kind, 'seal-check')))
  })
  return loadDetail(db, householdId, load.id)
}

/** Seal success per recipe, per canner and for the household, from every recorded check. */
export async function sealRates(db: Database, householdId: string) {
  const rows = await db.select({
    recipeId: tables.loadLines.recipeId,
    product: tables.loadLines.product,
    sealed: tables.loadLines.sealed,
    unsealed: tables.loadLines.unsealed,
    cannerId: tables.canningLoads.cannerId,
    cannerName: tables.canningLoads.cannerName,
    recipeName: tables.recipes.name,
  })
    .from(tables.loadLines)
    .innerJoin(tables.canningLoads, eq(tables.canningLoads.id, tables.loadLines.loadId))
    .leftJoin(tables.recipes, eq(tables.recipes.id, tables.loadLines.recipeId))
    .where(and(eq(tables.loadLines.householdId, householdId), isNotNull(tables.loadLines.sealed)))
  return {
    household: sealRate(rows),
    byRecipe: sealRatesBy(rows, r => ({ id: r.recipeId ?? `product:${r.product}`, name: r.recipeName ?? r.product })),
    byCanner: sealRatesBy(rows, r => ({ id: r.cannerId ?? `canner:${r.cannerName}`, name: r.cannerName })),
  }
}

export async function fridgeList(db: Database, householdId: string) {
  const rows = await db.select({
    id: tables.fridgeItems.id, product: tables.fridgeItems.product, jarSizeId: tables.fridgeItems.jarSizeId, jars: tables.fridgeItems.jars,
    refrigeratedAt: tables.fridgeItems.refrigeratedAt, loadId: tables.fridgeItems.loadId, loadNumber: tables.canningLoads.number,
  }).from(tables.fridgeItems)
    .innerJoin(tables.canningLoads, eq(tables.canningLoads.id, tables.fridgeItems.loadId))
    .where(and(eq(tables.fridgeItems.householdId, householdId), isNull(tables.fridgeItems.clearedAt)))
    .orderBy(asc(tables.fridgeItems.refrigeratedAt))
  return rows.map(r => ({ ...r, loadCode: loadCode(r.loadNumber) }))
}
