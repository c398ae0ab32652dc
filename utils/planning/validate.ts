/**
 * Input checks. Every number the planner uses is checked here (or where it is read) so that a
 * bad request ends in a PlanningRefusal naming the field, never in a crash or a silent NaN.
 * The upper limits are generous bounds on home equipment, there to catch typing slips
 * (a 3,000 mm canner) and to keep every search small.
 */
import { PlanningRefusal, requireNumber as num } from './errors'
import { fillBases, gaugeTypes, packStyles } from '../vocabulary'
import type { Canner, HouseholdSettings, Ingredient, JarSize, PlanOptions, PlanRequest, Recipe } from './types'

const oneOf = <T extends string>(value: T, allowed: readonly T[], field: string, what: string): void => {
  if (!allowed.includes(value)) throw new PlanningRefusal(`${what} must be one of ${allowed.join(', ')}.`, field)
}

/** Canner dimensions: positive and under 1 m; 1–10 layers; a known gauge type. */
function validateCanner(c: Canner, field: string): void {
  num(c.innerDiameterMm, `${field}.innerDiameterMm`, `The inner diameter of ${c.name}`, { min: 0, above: true, max: 1000 })
  num(c.usableHeightMm, `${field}.usableHeightMm`, `The usable height of ${c.name}`, { min: 0, above: true, max: 1500 })
  num(c.rackThicknessMm, `${field}.rackThicknessMm`, `The rack thickness of ${c.name}`, { max: 100 })
  num(c.maxLayers, `${field}.maxLayers`, `The most layers of ${c.name}`, { min: 1, max: 10, integer: true })
  num(c.waterDepthMm, `${field}.waterDepthMm`, `The water depth of ${c.name}`, { max: 500 })
  oneOf(c.gaugeType, gaugeTypes, `${field}.gaugeType`, 'The gauge type')
}

/** Jar capacity up to 5 L, diameter up to 500 mm, height up to 600 mm. */
export function validateJar(j: JarSize, field: string): void {
  num(j.capacityMl, `${field}.capacityMl`, `The capacity of ${j.name}`, { min: 0, above: true, max: 5000 })
  num(j.outsideDiameterMm, `${field}.outsideDiameterMm`, `The diameter of ${j.name}`, { min: 0, above: true, max: 500 })
  num(j.heightMm, `${field}.heightMm`, `The height of ${j.name}`, { min: 0, above: true, max: 600 })
}

/** Grams per cup up to 1,000; an expansion ratio from 1 (no swelling) to 20. */
export function validateIngredient(i: Ingredient, field: string): void {
  num(i.gramsPerCup, `${field}.gramsPerCup`, `Grams per cup of ${i.name}`, { min: 0, above: true, max: 1000 })
  num(i.expansionRatio, `${field}.expansionRatio`, `The expansion ratio of ${i.name}`, { min: 1, max: 20 })
}

/** Recipe data as used for this jar: fractions, headspace below the jar top, times, pressures, amounts. */
export function validateRecipe(r: Recipe, jar: JarSize, field: string): void {
  oneOf(r.fillBasis, fillBases, `${field}.fillBasis`, 'The fill basis')
  oneOf(r.packStyle, packStyles, `${field}.packStyle`, 'The pack style')
  num(r.solidsFillFraction, `${field}.solidsFillFraction`, `The solids fraction of ${r.name}`, { min: 0, above: true, max: 1 })
  num(r.headspaceMm, `${field}.headspaceMm`, `The headspace of ${r.name}`, { max: 100 })
  if (r.headspaceMm >= jar.heightMm) {
    throw new PlanningRefusal(`The headspace of ${r.name} is taller than a ${jar.name} jar.`, `${field}.headspaceMm`)
  }
  r.processMinutes.forEach((p, i) =>
    num(p.minutes, `${field}.processMinutes[${i}].minutes`, `A process time of ${r.name}`, { min: 0, above: true, max: 600 }),
  )
  r.pressureBands.forEach((b, i) => {
    const f = `${field}.pressureBands[${i}]`
    num(b.psi, `${f}.psi`, `A pressure of ${r.name}`, { min: 0, above: true, max: 30 })
    if (!(b.minFt <= b.maxFt)) throw new PlanningRefusal(`A pressure band of ${r.name} runs backwards.`, f)
  })
  r.perJar.forEach((p, i) => {
    const f = `${field}.perJar[${i}]`
    if (p.dryGrams !== undefined) {
      num(p.dryGrams, `${f}.dryGrams`, `A per-jar amount of ${r.name}`, { min: 0, above: true, max: 5000 })
    }
    if (p.saltTsp !== undefined) num(p.saltTsp, `${f}.saltTsp`, `A per-jar salt of ${r.name}`, { max: 4 })
  })
}

/** Household numbers: prices, package sizes and counts, jar uses, cool-down minutes. */
export function validateHousehold(h: HouseholdSettings): void {
  num(h.storeCanPriceCents, 'household.storeCanPriceCents', 'The store price of a can', { max: 100_000 })
  num(h.jarUses, 'household.jarUses', 'The expected uses per jar', { min: 1, max: 1000 })
  if (h.coolDownMinutes) {
    num(h.coolDownMinutes.pint, 'household.coolDownMinutes.pint', 'The cool-down for pints', { max: 600 })
    num(h.coolDownMinutes.quart, 'household.coolDownMinutes.quart', 'The cool-down for quarts', { max: 600 })
  }
  h.jarsOwned.forEach((o, i) => num(o.count, `household.jarsOwned[${i}].count`, 'Jars owned', { integer: true, max: 100_000 }))
  h.prices.forEach((p, i) => {
    const f = `household.prices[${i}]`
    num(p.priceCents, `${f}.priceCents`, 'A price', { max: 10_000_000 })
    if (p.kind === 'ingredient' || p.kind === 'salt') {
      num(p.packageGrams, `${f}.packageGrams`, 'A package weight', { min: 1, max: 1_000_000 })
    }
    else if (p.kind === 'vinegar') num(p.packageMl, `${f}.packageMl`, 'A bottle size', { min: 1, max: 1_000_000 })
    else num(p.packCount, `${f}.packCount`, 'A pack count', { min: 1, max: 10_000, integer: true })
  })
}

/** Planner options: clearance, vinegar per jar, step minutes. */
export function validateOptions(o: PlanOptions): void {
  if (o.clearanceMm !== undefined) num(o.clearanceMm, 'options.clearanceMm', 'The jar clearance', { max: 100 })
  if (o.vinegarMlPerJar !== undefined) num(o.vinegarMlPerJar, 'options.vinegarMlPerJar', 'Vinegar per jar', { max: 100 })
  for (const [k, v] of Object.entries(o.stepMinutes ?? {})) {
    if (v !== undefined) num(v, `options.stepMinutes.${k}`, `The ${k} step`, { max: 600 })
  }
}

/** Request-level checks; lines are checked one by one as the plan reads them. */
export function validateRequest(request: PlanRequest): void {
  if (!Array.isArray(request.lines) || request.lines.length === 0) {
    throw new PlanningRefusal('Add at least one recipe and jar size to plan.', 'lines')
  }
  if (request.lines.length > 50) throw new PlanningRefusal('A plan holds at most 50 lines.', 'lines')
  if (!Array.isArray(request.canners) || request.canners.length === 0) {
    throw new PlanningRefusal('Choose the canner to use.', 'canners')
  }
  if (request.canners.length > 4) throw new PlanningRefusal('A plan runs at most 4 canners side by side.', 'canners')
  const ids = new Set(request.canners.map(c => c.id))
  if (ids.size !== request.canners.length) throw new PlanningRefusal('The same canner is listed twice.', 'canners')
  request.canners.forEach((c, i) => validateCanner(c, `canners[${i}]`))
  request.lines.forEach((l, i) => {
    if (l.saltTsp !== undefined) {
      num(l.saltTsp, `lines[${i}].saltTsp`, 'Salt per jar (tsp)', { max: 4 })
    }
  })
}
