/**
 * What goes into one jar: dry goods (capped), salt and the liquid to top it up.
 */
import { PlanningRefusal, info, type PlanWarning } from './errors'
import type { Ingredient, JarSize, Recipe } from './types'
import { ML_PER_CUP, SALT_GRAMS_PER_TSP, formatDry, mlToCups } from './units'

/** Relative slack for "equal to the cap" (floating-point noise, not a tolerance for canners). */
const CAP_EPSILON = 1e-9

/**
 * Cap on dry volume per jar, d_max = f · V / E, in mL: the hydrated solids (E times the dry
 * volume) may take at most the fraction f of the jar's nominal capacity V.
 * Pint (473.176 mL), E = 3, f = ¾ → 118.29 mL, exactly ½ US cup.
 */
export function fillCapMl(jar: JarSize, recipe: Recipe, ingredient: Ingredient): number {
  return (recipe.solidsFillFraction * jar.capacityMl) / ingredient.expansionRatio
}

/** Dry grams for a dry volume: cups × the ingredient's grams per level cup. */
export const gramsForMl = (ml: number, ingredient: Ingredient): number =>
  mlToCups(ml) * ingredient.gramsPerCup

export const mlForGrams = (grams: number, ingredient: Ingredient): number =>
  (grams / ingredient.gramsPerCup) * ML_PER_CUP

/**
 * Volume of the jar up to the headspace line. The jar is treated as a straight cylinder whose
 * inner height is its outside height (glass and shoulder ignored), so the headspace takes the
 * fraction headspace ÷ height of the nominal capacity. A rough figure, used only to estimate
 * how much hot liquid to heat.
 */
export function volumeToHeadspaceMl(jar: JarSize, headspaceMm: number): number {
  return jar.capacityMl * Math.max(0, 1 - headspaceMm / jar.heightMm)
}

export interface PerJarFill {
  dryMl: number
  /** The beans once swollen (cooked, drained), in mL: what a hot pack fills and what a store can is compared with. */
  hydratedMl: number
  dryGrams: number
  capMl: number
  /** dryMl ÷ capMl; above 1 only for a published amount (see `perJarFill`). */
  fillFractionOfCap: number
  saltTsp: number
  saltGrams: number
  /** Volume taken by the packed solids when the jar is filled. */
  solidsMl: number
  /** Boiling water (or cooking liquid) to fill to the headspace line. */
  waterMl: number
  warnings: PlanWarning[]
}

/** Look a value up by jar key; a missing size is scaled by capacity from the nearest larger one. */
function byJarKey(
  entries: ReadonlyArray<{ jarKey: string, value: number }>,
  jar: JarSize,
  jarSizes: readonly JarSize[],
): { value: number, fromKey: string } | null {
  const own = entries.find(e => e.jarKey === jar.key)
  if (own) return { value: own.value, fromKey: jar.key }
  const sized = entries
    .map(e => ({ e, size: jarSizes.find(j => j.key === e.jarKey) }))
    .filter((x): x is { e: { jarKey: string, value: number }, size: JarSize } => x.size !== undefined)
    .sort((a, b) => a.size.capacityMl - b.size.capacityMl)
  const base = sized.find(x => x.size.capacityMl >= jar.capacityMl) ?? sized[sized.length - 1]
  if (!base) return null
  return { value: (base.e.value * jar.capacityMl) / base.size.capacityMl, fromKey: base.e.jarKey }
}

/**
 * The fill of one jar.
 *
 * - `cap` (dry-pack house recipe): the cap f·V/E, or a smaller requested dry volume. A request
 *   above the cap is refused with the cap in the message — never clipped.
 * - `published` (tested hot pack): the published grams for the jar key. For a jar size the
 *   recipe does not list (a half-pint when only pints are given), the amount is scaled by
 *   capacity from the next larger listed size. The published amount is a buying average; the
 *   jars themselves are filled by the tested procedure (hot beans and cooking liquid to the
 *   headspace line), so an amount above the dry-pack cap is reported as information, not refused.
 *
 * Salt: the request's tsp per jar, else the recipe's for the jar (scaled the same way), else
 * none. Water: the volume to the headspace line minus the packed solids, which are the dry
 * beans themselves for a dry pack and the hydrated beans (E × dry), at most the fraction f of the
 * jar, for a hot or raw pack.
 */
export function perJarFill(
  recipe: Recipe,
  jar: JarSize,
  ingredient: Ingredient,
  jarSizes: readonly JarSize[],
  request: { dryMlPerJar?: number, saltTsp?: number },
  field: string,
): PerJarFill {
  const warnings: PlanWarning[] = []
  const capMl = fillCapMl(jar, recipe, ingredient)
  let dryMl: number
  if (recipe.fillBasis === 'cap') {
    dryMl = capMl
    const asked = request.dryMlPerJar
    if (asked !== undefined) {
      if (!(asked > 0) || !Number.isFinite(asked)) {
        throw new PlanningRefusal('The dry amount per jar must be more than 0 mL.', `${field}.dryMlPerJar`)
      }
      if (asked > capMl * (1 + CAP_EPSILON)) {
        throw new PlanningRefusal(
          `${formatDry(asked, gramsForMl(asked, ingredient), 'us')} of dry ${ingredient.name} per ${jar.name} `
          + `is more than the safe fill of ${formatDry(capMl, gramsForMl(capMl, ingredient), 'us')} `
          + `(${Math.round(capMl)} mL). Beans swell about ${ingredient.expansionRatio}×; use the cap or less.`,
          `${field}.dryMlPerJar`,
        )
      }
      dryMl = asked
    }
  }
  else {
    const found = byJarKey(
      recipe.perJar.flatMap(p => (p.dryGrams === undefined ? [] : [{ jarKey: p.jarKey, value: p.dryGrams }])),
      jar,
      jarSizes,
    )
    if (!found) {
      throw new PlanningRefusal(`${recipe.name} has no published dry amount per jar.`, `${field}.recipeId`)
    }
    if (found.fromKey !== jar.key) {
      warnings.push(
        info(
          'amount-scaled',
          `${recipe.name} lists no amount for ${jar.name} jars; the ${found.fromKey} amount is scaled by jar size.`,
          field,
        ),
      )
    }
    if (request.dryMlPerJar !== undefined) {
      const why = `${recipe.name} is a tested recipe: its published amount per jar is used.`
      warnings.push(info('fill-request-ignored', why, `${field}.dryMlPerJar`))
    }
    dryMl = mlForGrams(found.value, ingredient)
    if (dryMl > capMl * (1 + CAP_EPSILON)) {
      warnings.push(
        info(
          'published-amount-above-cap',
          `The published ${Math.round(found.value)} g of dry ${ingredient.name} per ${jar.name} is a buying average for `
          + `soaked, pre-cooked beans. Fill jars with hot beans and liquid to the headspace line as the recipe says; `
          + `some beans may be left over.`,
          field,
        ),
      )
    }
  }

  const recipeSalt = byJarKey(
    recipe.perJar.flatMap(p => (p.saltTsp === undefined ? [] : [{ jarKey: p.jarKey, value: p.saltTsp }])),
    jar,
    jarSizes,
  )
  const saltTsp = request.saltTsp ?? recipeSalt?.value ?? 0
  const toLine = volumeToHeadspaceMl(jar, recipe.headspaceMm)
  // The beans once swollen: E times the dry volume, never more than the solids' share f of the jar
  // or the jar to its headspace line. A dry pack swells in the jar; a hot pack is packed swollen.
  const hydratedMl = Math.min(dryMl * ingredient.expansionRatio, recipe.solidsFillFraction * jar.capacityMl, toLine)
  const solidsMl = recipe.packStyle === 'dry' ? dryMl : hydratedMl
  return {
    hydratedMl,
    dryMl,
    dryGrams: gramsForMl(dryMl, ingredient),
    capMl,
    fillFractionOfCap: dryMl / capMl,
    saltTsp,
    saltGrams: saltTsp * SALT_GRAMS_PER_TSP,
    solidsMl,
    waterMl: Math.max(0, toLine - solidsMl),
    warnings,
  }
}
