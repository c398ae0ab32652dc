import { and, asc, eq, gt, inArray, isNotNull, isNull, or } from 'drizzle-orm'
import { planBatch, PlanningRefusal, type PlanLineRequest, type PlanProgress, type PlanResult } from '~~/utils/planning'
import type { Currency } from '~~/utils/vocabulary'
import type { PlanLineBody, PlanRequestBody } from '~~/utils/schemas/plan'
import { loadCanners, loadCatalogue, loadHouseholdSettings, toPlanningCanner } from './catalogue'
import type { Database, Db } from './database'

function amountOf(line: PlanLineBody): PlanLineRequest['amount'] {
  if (line.jars !== undefined) return { mode: 'jars', jars: line.jars }
  if (line.dryGrams !== undefined) return { mode: 'dryGrams', grams: line.dryGrams }
  if (line.packages !== undefined) return { mode: 'packages', packages: line.packages }
  return { mode: 'consumption', jarsPerMonth: line.jarsPerMonth!, months: line.months!, jarsOnShelf: line.jarsOnShelf }
}

/**
 * Compute a plan for a household from current data. A request the planning model refuses
 * becomes a 422 whose message says what to change; unknown recipes, jar sizes, ingredients or
 * canners (including another household's) are refused the same way, naming the field.
 */
export async function computePlan(db: Database, householdId: string, body: PlanRequestBody, saved?: { planId: string }): Promise<PlanResult & { household: { name: string, altitudeFt: number | null, unitSystem: 'us' | 'metric', currency: Currency } }> {
  const [{ catalogue, recipes, ingredients }, household, cannerRows, progress] = await Promise.all([
    loadCatalogue(db, householdId),
    loadHouseholdSettings(db, householdId),
    loadCanners(db, householdId),
    saved ? planProgress(db, householdId, saved.planId) : undefined,
  ])
  const cannerIds = body.cannerIds ?? [body.cannerId!]
  const canners = cannerIds.map((id, i) => {
    const row = cannerRows.find(c => c.id === id)
    if (!row) refusal('That canner is not one of this household\'s canners. Choose one from the list.', body.cannerIds ? `cannerIds.${i}` : 'cannerId')
    return toPlanningCanner(row)
  })

  // A line may name the bean for a recipe that takes any variety: plan with that ingredient.
  const planningRecipes = [...catalogue.recipes]
  const lines: PlanLineRequest[] = body.lines.map((line, i) => {
    const recipe = recipes.find(r => r.id === line.recipeId)
    if (!recipe) refusal('That recipe is not in your Recipe book. Choose one from the list.', `lines.${i}.recipeId`)
    if (!catalogue.jarSizes.some(j => j.id === line.jarSizeId)) refusal('That jar size is not in the jar catalogue.', `lines.${i}.jarSizeId`)
    let recipeId = recipe.id
    if (line.ingredientId && line.ingredientId !== recipe.ingredientId) {
      const ingredient = ingredients.find(g => g.id === line.ingredientId)
      if (!ingredient) refusal('That bean is not in the ingredient list.', `lines.${i}.ingredientId`)
      const base = ingredients.find(g => g.id === recipe.ingredientId)
      if (ingredient.form !== base?.form) refusal(`${recipe.name} is for ${base?.form ?? 'its own'} beans; ${ingredient.name} cannot be used with it.`, `lines.${i}.ingredientId`)
      recipeId = `${recipe.id}~${ingredient.id}`
      if (!planningRecipes.some(r => r.id === recipeId)) {
        planningRecipes.push({ ...recipe, id: recipeId, name: `${recipe.name} — ${ingredient.name}`, ingredientId: ingredient.id })
      }
    }
    return {
      recipeId,
      jarSizeId: line.jarSizeId,
      amount: amountOf(line),
      ...(line.saltTsp !== undefined ? { saltTsp: line.saltTsp } : {}),
      ...(line.dryMlPerJar !== undefined ? { dryMlPerJar: line.dryMlPerJar } : {}),
    }
  })

  // What the household eats of a recipe counts once, on the first line planning it (by any bean).
  const baseOf = (id: string) => id.split('~')[0]!
  const eaten = (household.jarsEatenPerMonth ?? []).flatMap((e) => {
    const line = lines.find(l => baseOf(l.recipeId) === e.recipeId)
    return line ? [{ recipeId: line.recipeId, jarsPerMonth: e.jarsPerMonth }] : []
  })

  try {
    const result = planBatch(
      { lines, canners, startAt: body.startAt, soak: body.soak, altitudeFt: body.altitudeFt ?? household.altitudeFt, today: householdToday(household.timeZone), progress },
      { ...catalogue, recipes: planningRecipes },
      { ...household, jarsEatenPerMonth: eaten },
    )
    // Report the recipe ids the household knows, not the per-bean variants made above.
    const baseId = baseOf
    for (const line of result.lines) line.recipeId = baseId(line.recipeId)
    for (const load of result.loads) {
      load.recipeIds = [...new Set(load.recipeIds.map(baseId))]
      for (const c of load.contents) c.recipeId = baseId(c.recipeId)
    }
    for (const step of result.schedule.steps) if (step.recipeId) step.recipeId = baseId(step.recipeId)
    return { ...result, household: { name: household.name, altitudeFt: household.altitudeFt, unitSystem: household.unitSystem, currency: household.currency } }
  }
  catch (error) {
    if (error instanceof PlanningRefusal) refusal(error.message, requestField(error.field, body))
    throw error
  }
}

/**
 * The planning core names fields of its own input ("lines[0].amount.jars", "canners[1]");
 * answer with the request's field instead ("lines.0.jars", "cannerIds.1" or "cannerId").
 */
function requestField(field: string | undefined, body: PlanRequestBody): string | undefined {
  if (!field) return undefined
  const dotted = field.replace(/\[(\d+)\]/g, '.$1').replace('.amount.', '.')
  return dotted.replace(/^canners\.(\d+)/, (_, k: string) => (body.cannerIds ? `cannerIds.${k}` : 'cannerId'))
}

/**
 * How far a saved plan has got: the plan loads logged (a reprocessing run is not a new load of
 * the plan), what their lines took out of the household's stock, and the Market list items
 * marked as already at home.
 */
export async function planProgress(db: Db, householdId: string, planId: string): Promise<PlanProgress> {
  const [loads, taken, marks] = await Promise.all([
    db.selectDistinct({ index: tables.canningLoads.planLoadIndex }).from(tables.canningLoads)
      .where(and(eq(tables.canningLoads.householdId, householdId), eq(tables.canningLoads.planId, planId), isNull(tables.canningLoads.reprocessOfId), isNotNull(tables.canningLoads.planLoadIndex))),
    db.select({ jarSizeId: tables.loadLines.jarSizeId, jars: tables.loadLines.jarsFromStock, grams: tables.loadLines.dryGramsFromStock, ingredientId: tables.loadLines.dryGoodsIngredientId })
      .from(tables.loadLines).innerJoin(tables.canningLoads, eq(tables.canningLoads.id, tables.loadLines.loadId))
      .where(and(eq(tables.canningLoads.householdId, householdId), eq(tables.canningLoads.planId, planId), isNull(tables.canningLoads.reprocessOfId))),
    db.select({ itemKey: tables.marketChecks.itemKey }).from(tables.marketChecks)
      .where(and(eq(tables.marketChecks.planId, planId), eq(tables.marketChecks.householdId, householdId), eq(tables.marketChecks.state, 'at-home'))),
  ])
  return {
    loggedLoads: loads.map(l => l.index!),
    jarsTaken: taken.filter(t => t.jars > 0).map(t => ({ jarSizeId: t.jarSizeId, count: t.jars })),
    dryGramsTaken: taken.filter(t => t.grams > 0 && t.ingredientId).map(t => ({ ingredientId: t.ingredientId!, grams: t.grams })),
    atHome: marks.map(m => m.itemKey),
  }
}

/** A saved plan of this household, or a 404 that reveals nothing about other households. */
export async function requirePlan(db: Db, householdId: string, planId: string) {
  const [plan] = await db.select().from(tables.plans)
    .where(and(eq(tables.plans.id, planId), eq(tables.plans.householdId, householdId)))
  if (!plan) notFound('No such plan in this household.')
  return plan
}

export function planSummary(result: PlanResult) {
  return {
    jars: result.totals.jars,
    loads: result.totals.loads,
    recipes: [...new Set(result.lines.map(l => l.recipeName))],
  }
}

/**
 * Published values corrected since a plan was last saved that touch its recipes (or every
 * recipe: a jar size, an ingredient), by a reference version or a site admin, so the plan can
 * say what changed when it is opened.
 */
export async function referenceChangesSince(db: Database, plan: { updatedAt: Date, request: PlanRequestBody }): Promise<string[]> {
  const recipeIds = plan.request.lines.map(l => l.recipeId)
  const rows = await db.select({ what: tables.referenceChanges.what, reason: tables.referenceChanges.reason }).from(tables.referenceChanges)
    .where(and(gt(tables.referenceChanges.appliedAt, plan.updatedAt), or(isNull(tables.referenceChanges.recipeId), inArray(tables.referenceChanges.recipeId, recipeIds))))
    .orderBy(asc(tables.referenceChanges.appliedAt))
  // A site admin's change says why it was made.
  return rows.map(r => (r.reason ? `${r.what} (${r.reason.replace(/[\s.]+$/, '')})` : r.what))
}
