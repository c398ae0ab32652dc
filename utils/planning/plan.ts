/**
 * planBatch: from "what to can" to the fill card, loads, canner map, market list, run sheet and
 * money. Pure: plain data in, plain data out; throws PlanningRefusal when it must refuse.
 *
 * Order of work: check the request; plan each line (fill, jars, time, pressure); build the loads
 * and the day; buy what is missing; price the batch; add the standing cautions.
 */
import { costSummary } from './cost'
import { PlanningRefusal, info, type PlanWarning } from './errors'
import { buildLoads } from './loads'
import { planLine } from './lines'
import { DEFAULT_CLEARANCE_MM, layersFor, layoutLayer } from './packing'
import { bandAltitude } from './process'
import type { CannerLayout, LineResult, LoadResult, PlanResult } from './results'
import { MAX_JARS_PER_PLAN } from './scaling'
import { DEFAULT_STEP_MINUTES, buildSchedule, coolDownMinutes, loadMinutes, parseStart } from './schedule'
import { buildShopping } from './shopping'
import type { Canner, Catalogue, HouseholdSettings, JarSize, PlanOptions, PlanRequest, Recipe, UnitSystem } from './types'
import { formatVolume } from './units'
import { validateHousehold, validateOptions, validateRequest } from './validate'
import { standingWarnings } from './warnings'

/** Rim-wiping vinegar per jar: a splash on a clean cloth (our estimate; no published figure). */
const DEFAULT_VINEGAR_ML_PER_JAR = 5

/** Water for the canner's depth over its floor, its inside taken as a cylinder (mL). */
const cannerWaterMl = (c: Canner): number => (Math.PI * (c.innerDiameterMm / 2) ** 2 * c.waterDepthMm) / 1000

/** Sum `value` over items by `key`. */
function sumBy<T>(items: readonly T[], key: (t: T) => string, value: (t: T) => number): Map<string, number> {
  const out = new Map<string, number>()
  for (const t of items) out.set(key(t), (out.get(key(t)) ?? 0) + value(t))
  return out
}

/**
 * Plan a canning batch. Lines sharing a jar size and pressure share loads; each canner in
 * `request.canners` runs its loads back to back and canners run side by side. Throws a
 * PlanningRefusal (with the field at fault) when the plan has no published or household basis
 * or the request contradicts itself; otherwise every warning the plan needs is in `warnings`.
 */
/** "9 × Dried beans or peas, hot pack — Black beans": the recipe and its bean (a variant's name already ends with it). */
function contentLabel(recipe: Recipe, jars: number, catalogue: Catalogue): string {
  const bean = catalogue.ingredients.find(g => g.id === recipe.ingredientId)?.name
  return `${jars} × ${recipe.name.includes(' — ') || !bean ? recipe.name : `${recipe.name} — ${bean}`}`
}

export function planBatch(
  request: PlanRequest,
  catalogue: Catalogue,
  household: HouseholdSettings,
  options: PlanOptions = {},
): PlanResult {
  validateRequest(request)
  validateHousehold(household)
  validateOptions(options)
  const system: UnitSystem = household.unitSystem === 'metric' ? 'metric' : 'us'
  const clearanceMm = options.clearanceMm ?? DEFAULT_CLEARANCE_MM
  const steps = { ...DEFAULT_STEP_MINUTES, ...options.stepMinutes }
  const today = request.today
  const start = parseStart(request.startAt, today)
  const altitude = bandAltitude(request.altitudeFt, 'altitudeFt')
  const canners = request.canners

  const fits = new Map<string, CannerLayout>()
  const fit = (c: Canner, jar: JarSize): CannerLayout => {
    const key = `${c.id}|${jar.id}`
    const known = fits.get(key)
    if (known) return known
    const layer = layoutLayer(c.innerDiameterMm, jar.outsideDiameterMm, clearanceMm)
    const layers = layersFor(c.usableHeightMm, c.rackThicknessMm, jar.heightMm, c.maxLayers)
    const made = { ...layer, cannerId: c.id, jarSizeId: jar.id, layers }
    fits.set(key, made)
    return made
  }

  const context = { catalogue, canners, feet: altitude.feet, clearanceMm, system, fit }
  const planned = request.lines.map((line, i) => planLine(line, i, context))
  const lines = planned.map(p => p.result)
  const totalJars = lines.reduce((s, l) => s + l.jars, 0)
  if (totalJars > MAX_JARS_PER_PLAN) {
    throw new PlanningRefusal(
      `${totalJars} jars is more than one plan can hold (${MAX_JARS_PER_PLAN}); split it into several canning days.`,
      'lines',
    )
  }

  const jarOf = (id: string): JarSize => catalogue.jarSizes.find(j => j.id === id)!
  const cannerOf = (id: string): Canner => canners.find(c => c.id === id)!
  const cool = (jarSizeId: string): number => coolDownMinutes(jarOf(jarSizeId).capacityMl, household.coolDownMinutes)
  const loads: LoadResult[] = buildLoads(
    planned.map(p => p.load),
    canners.map(c => c.id),
    (cannerId, jarSizeId) => fit(cannerOf(cannerId), jarOf(jarSizeId)),
    (jarSizeId, minutes) => loadMinutes(minutes, cool(jarSizeId), steps),
  ).map(load => ({
    ...load,
    gaugeType: cannerOf(load.cannerId).gaugeType,
    coolMinutes: cool(load.jarSizeId),
    // Every load names what is in it: recipe and bean for each line, so two beans on one recipe never read alike.
    contents: load.contents.map(c => ({ ...c, label: contentLabel(planned[c.lineIndex]!.recipe, c.jars, catalogue) })),
  }))
  const layouts = [...new Set(loads.map(l => `${l.cannerId}|${l.jarSizeId}`))].map(key => fits.get(key)!)
  // "pinto beans (Dried beans or peas, hot pack)": the bean first, as it is soaked and boiled.
  const prepName = (recipe: Recipe) => {
    const bean = catalogue.ingredients.find(g => g.id === recipe.ingredientId)?.name
    const base = recipe.name.split(' — ')[0]!
    return bean ? `${bean.toLowerCase()} (${base})` : base
  }
  const recipesOfDay = [...new Map(planned.map(p => [p.recipe.id, { id: p.recipe.id, name: prepName(p.recipe), prep: p.recipe.prep }])).values()]
  const schedule = buildSchedule(loads, start, steps, recipesOfDay, request.soak)

  const ingredientOf = (l: LineResult): string => planned[l.lineIndex]!.recipe.ingredientId
  const vinegarPerJar = options.vinegarMlPerJar ?? DEFAULT_VINEGAR_ML_PER_JAR
  const saltGrams = lines.reduce((s, l) => s + l.saltGramsTotal, 0)
  const buying = lines.filter(l => l.suppliedGrams === null)
  /** What jars of each line need from the market: dry goods to buy, salt, jars by size, vinegar. */
  const needsOf = (jarsOfLine: (l: LineResult) => number) => {
    const jars = lines.reduce((s, l) => s + jarsOfLine(l), 0)
    return {
      ingredientGrams: sumBy(buying, ingredientOf, l => l.perJar.dryGrams * jarsOfLine(l)),
      saltGrams: lines.reduce((s, l) => s + l.perJar.saltGrams * jarsOfLine(l), 0),
      jarsBySize: sumBy(lines.filter(l => jarsOfLine(l) > 0), l => l.jarSizeId, jarsOfLine),
      vinegarMl: jars * vinegarPerJar,
    }
  }
  // A plan part-way through its canning: the market list is what the loads not yet logged need,
  // bought against today's stock (which the logged loads already drew on).
  const progress = request.progress
  const logged = new Set((progress?.loggedLoads ?? []).filter(i => loads.some(l => l.index === i)))
  const jarsLeft = (l: LineResult): number => loads
    .filter(load => !logged.has(load.index))
    .reduce((s, load) => s + load.contents.filter(c => c.lineIndex === l.lineIndex).reduce((t, c) => t + c.jars, 0), 0)
  const marks = { atHome: progress?.atHome ?? [] }
  const fullNeeds = needsOf(l => l.jars)
  const shopping = buildShopping(
    logged.size ? needsOf(jarsLeft) : fullNeeds,
    household,
    catalogue.ingredients,
    catalogue.jarSizes,
    system,
    marks,
  )
  // The batch's cost stays what it was before any load was logged: priced against the stock the
  // household had then (today's stock plus what the logged loads took out of it).
  const withTaken = <T extends { count: number } | { grams: number }>(now: readonly T[] | undefined, taken: readonly T[] | undefined): T[] => [...(now ?? []), ...(taken ?? [])]
  const atStart: HouseholdSettings = logged.size
    ? { ...household, jarsOwned: withTaken(household.jarsOwned, progress?.jarsTaken), dryGoodsOnHand: withTaken(household.dryGoodsOnHand, progress?.dryGramsTaken) }
    : household
  const costing = logged.size ? buildShopping(fullNeeds, atStart, catalogue.ingredients, catalogue.jarSizes, system, marks).items : shopping.items
  for (const item of costing) {
    const last = buying.filter(l => item.kind === 'ingredient' && ingredientOf(l) === item.ref).pop()
    if (last) last.leftoverGrams = item.leftover
  }

  const eaten = planned.flatMap(p => (p.load.jarsPerMonth === null ? [] : [p.load.jarsPerMonth]))
  const measured = (household.jarsEatenPerMonth ?? [])
    .filter(e => planned.some(p => p.recipe.id === e.recipeId))
    .reduce((s, e) => s + e.jarsPerMonth, 0)
  // The beans in a jar, for the store comparison: its swollen beans (fill.ts).
  const beansMl = sumBy(lines, l => l.jarSizeId, l => l.perJar.hydratedMl * l.jars)
  const cost = costSummary(
    {
      jars: totalJars,
      gramsUsed: sumBy(lines, ingredientOf, l => l.dryGramsTotal),
      saltGrams,
      vinegarMl: fullNeeds.vinegarMl,
      jarsBySize: fullNeeds.jarsBySize,
      jarsPerMonth: eaten.length ? eaten.reduce((s, n) => s + n, 0) : null,
      measuredJarsPerMonth: measured > 0 ? measured : null,
      beansMlBySize: new Map([...beansMl].map(([id, ml]) => [id, ml / fullNeeds.jarsBySize.get(id)!])),
      ingredientNames: new Map(catalogue.ingredients.map(g => [g.id, g.name])),
    },
    shopping.items,
    household,
    catalogue.jarSizes,
    costing,
  )

  const recipes = [...new Set(planned.map(p => p.recipe))]
  const warnings: PlanWarning[] = [
    ...altitude.warnings,
    ...planned.flatMap(p => p.warnings),
    ...loads.flatMap(l => (l.note ? [info('mixed-load', `Load ${l.index}: ${l.note}`)] : [])),
    ...shopping.warnings,
    ...standingWarnings({ recipes, canners, loads, feet: altitude.feet, today, system }),
  ]
  const kettleMl = lines.reduce((s, l) => s + l.waterMlTotal, 0)
  const cannersUsed = canners.filter(c => loads.some(l => l.cannerId === c.id))
  return {
    lines,
    loads,
    layout: layouts[0]!,
    layouts,
    shopping: shopping.items,
    progress: {
      loggedLoads: [...logged].sort((a, b) => a - b),
      loadsLeft: loads.length - logged.size,
      jarsLeft: lines.reduce((s, l) => s + jarsLeft(l), 0),
    },
    schedule,
    cost,
    water: {
      kettleMl,
      kettleDisplay: formatVolume(kettleMl, system),
      canners: cannersUsed.map((c) => {
        const mlPerLoad = cannerWaterMl(c)
        return { cannerId: c.id, mlPerLoad, display: formatVolume(mlPerLoad, system) }
      }),
    },
    totals: {
      jars: totalJars,
      loads: loads.length,
      dryGrams: lines.reduce((s, l) => s + l.dryGramsTotal, 0),
      saltGrams,
    },
    altitudeFt: altitude.feet,
    warnings: [...warnings.filter(w => w.level === 'caution'), ...warnings.filter(w => w.level !== 'caution')],
  }
}
