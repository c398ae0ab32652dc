/**
 * One line of a plan: a recipe in a jar size and an amount, turned into its fill card, its jar
 * count and what its loads need (process time, pressure on each canner).
 */
import { PlanningRefusal, info, type PlanWarning } from './errors'
import { perJarFill } from './fill'
import type { LoadLine } from './loads'
import { pressureFor, processMinutesFor } from './process'
import type { CannerLayout, LineResult } from './results'
import { goodsForJars, jarsForAmount } from './scaling'
import type { Canner, Catalogue, JarSize, PlanLineRequest, Recipe, UnitSystem } from './types'
import { formatCooked, formatDry, formatLength, formatSalt, formatVolume, kitchenMeasure, mlToCups } from './units'
import { validateIngredient, validateJar, validateRecipe } from './validate'

export interface LineContext {
  catalogue: Catalogue
  canners: readonly Canner[]
  /** Altitude for the pressure bands, in whole feet (see `bandAltitude`). */
  feet: number
  clearanceMm: number
  system: UnitSystem
  /** The layer layout and layers of a canner for a jar size (cached by the caller). */
  fit: (canner: Canner, jar: JarSize) => CannerLayout
}

export interface PlannedLine {
  recipe: Recipe
  result: LineResult
  load: LoadLine & { jarsPerMonth: number | null }
  warnings: PlanWarning[]
}

/** Why a jar does not fit a canner, or null when at least one jar fits. */
function misfit(c: Canner, jar: JarSize, fit: CannerLayout, clearanceMm: number): string | null {
  if (fit.layers === 0) {
    return `${jar.name} jars (${Math.round(jar.heightMm)} mm tall) are taller than the usable height of ${c.name} `
      + `(${Math.round(c.usableHeightMm)} mm)`
  }
  if (fit.perLayer === 0) {
    return `${c.name} (${Math.round(c.innerDiameterMm)} mm across) cannot hold one ${jar.name} jar `
      + `(${Math.round(jar.outsideDiameterMm)} mm across plus ${clearanceMm} mm clearance)`
  }
  return null
}

/**
 * Plan one line. Refuses an unknown recipe, jar or ingredient, a jar no canner in the plan can
 * hold, and anything `perJarFill`, `processMinutesFor`, `pressureFor` or `jarsForAmount`
 * refuses. A canner that cannot hold this jar while another can is left out for the line, and
 * the plan says so.
 */
export function planLine(line: PlanLineRequest, i: number, ctx: LineContext): PlannedLine {
  const field = `lines[${i}]`
  const { catalogue, system } = ctx
  const recipe = catalogue.recipes.find(r => r.id === line.recipeId)
  if (!recipe) throw new PlanningRefusal('Choose a recipe from the recipe book.', `${field}.recipeId`)
  if (recipe.retired) throw new PlanningRefusal(`${recipe.retired} Choose another recipe.`, `${field}.recipeId`)
  const jar = catalogue.jarSizes.find(j => j.id === line.jarSizeId)
  if (!jar) throw new PlanningRefusal('Choose a jar size from the catalogue.', `${field}.jarSizeId`)
  const ingredient = catalogue.ingredients.find(g => g.id === recipe.ingredientId)
  if (!ingredient) {
    throw new PlanningRefusal(`${recipe.name} names an ingredient that is not in the catalogue.`, `${field}.recipeId`)
  }
  validateJar(jar, `${field}.jarSizeId`)
  validateIngredient(ingredient, `${field}.recipeId`)
  validateRecipe(recipe, jar, `${field}.recipeId`)
  const warnings: PlanWarning[] = []

  const process = processMinutesFor(recipe, jar, catalogue.jarSizes, field)
  if (process.borrowed) {
    warnings.push(info('time-from-larger-jar', `${jar.name} jars of ${recipe.name} use the ${process.fromJarKey} time, `
    + `${process.minutes} min (a smaller jar may take the next larger size's time, never the reverse).`, field))
  }
  const fill = perJarFill(recipe, jar, ingredient, catalogue.jarSizes, line, field)
  warnings.push(...fill.warnings)
  const amount = jarsForAmount(line.amount, fill.dryGrams, field, jar.name)
  if (amount.suppliedGrams !== null && amount.leftoverGrams > 0.5) {
    const part = Math.round(amount.partJar * 100)
    warnings.push(info('goods-leftover', `${Math.round(amount.suppliedGrams)} g of ${ingredient.name} fills ${amount.jars} `
    + `${jar.name} jars with ${Math.round(amount.leftoverGrams)} g left over (${part} % of a jar).`, field))
  }

  const psiByCanner: Record<string, number> = {}
  const misfits: string[] = []
  ctx.canners.forEach((c, k) => {
    const fit = ctx.fit(c, jar)
    const why = misfit(c, jar, fit, ctx.clearanceMm)
    if (why) {
      misfits.push(why)
      return
    }
    psiByCanner[c.id] = pressureFor(recipe, c.gaugeType, ctx.feet, 'altitudeFt', c.name)
    if (fit.limitedBy === 'drawing') {
      warnings.push(info('layer-drawing-limit', `The published packing fits ${fit.tableCount} ${jar.name} jars per layer `
      + `in ${c.name}, but we can only draw ${fit.perLayer} without overlap; the plan uses ${fit.perLayer}.`, `canners[${k}]`))
    }
  })
  if (misfits.length === ctx.canners.length) {
    throw new PlanningRefusal(`${misfits.join('; ')}. Choose smaller jars or another canner.`, `${field}.jarSizeId`)
  }
  for (const why of misfits) warnings.push(info('canner-not-used', `${why}; that canner is not used for them.`, field))

  const display = {
    dry: formatDry(fill.dryMl, fill.dryGrams, system),
    salt: formatSalt(fill.saltTsp, system),
    // A published hot pack is topped with its own cooking liquid; only a dry pack needs kettle water.
    water: recipe.fillBasis === 'published'
      ? `hot cooking liquid to ${formatLength(recipe.headspaceMm, system)} headspace`
      : formatVolume(fill.waterMl, system),
    headspace: formatLength(recipe.headspaceMm, system),
    dryCups: kitchenMeasure(mlToCups(fill.dryMl), 'cup'),
    saltSpoons: fill.saltTsp > 0 ? kitchenMeasure(fill.saltTsp, 'tsp') : null,
  }
  const { dryMl, dryGrams, saltTsp, saltGrams, waterMl, hydratedMl } = fill
  const result: LineResult = {
    lineIndex: i,
    recipeId: recipe.id,
    recipeName: recipe.name,
    jarSizeId: jar.id,
    jarKey: jar.key,
    jars: amount.jars,
    perJar: { dryGrams, dryMl, hydratedMl, saltTsp, saltGrams, waterMl, display: { ...display, cooked: formatCooked(hydratedMl, system) } },
    dryGramsTotal: goodsForJars(amount.jars, dryGrams),
    leftoverGrams: amount.leftoverGrams,
    partJar: amount.partJar,
    suppliedGrams: amount.suppliedGrams,
    capMl: fill.capMl,
    fillFractionOfCap: fill.fillFractionOfCap,
    fillBasis: recipe.fillBasis,
    packStyle: recipe.packStyle,
    headspaceMm: recipe.headspaceMm,
    saltTspTotal: saltTsp * amount.jars,
    saltGramsTotal: saltGrams * amount.jars,
    waterMlTotal: waterMl * amount.jars,
    processMinutes: process.minutes,
    processTimeFrom: process.fromJarKey,
  }
  const load = {
    lineIndex: i,
    recipeId: recipe.id,
    jarSizeId: jar.id,
    jars: amount.jars,
    processMinutes: process.minutes,
    psiByCanner,
    jarsPerMonth: amount.jarsPerMonth,
  }
  return { recipe, result, load, warnings }
}
