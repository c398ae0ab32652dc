/**
 * The published values a canner relies on, read for comparison before and after a change (a
 * reference version shipped with the code, or a site admin's edit of a shared recipe), so that
 * every change becomes a line a saved plan and the recipe's history can show.
 */
import { and, eq, inArray, isNotNull } from 'drizzle-orm'
import * as t from '~~/server/database/schema'
import type { Tx } from './database'

export interface Change { recipeId: string | null, what: string }
type Value = { recipeId: string | null, label: string, value: string, wordy?: boolean }
export type ReferenceValues = Map<string, Value>

const ft = (n: number) => n.toLocaleString('en-US')

/** The values a canner relies on, as this database holds them, keyed for comparison. */
export async function referenceValues(tx: Tx): Promise<ReferenceValues> {
  const [jars, goods, specs, bands, recipes] = await Promise.all([
    tx.select().from(t.jarSizes),
    tx.select().from(t.ingredients),
    tx.select().from(t.recipeJarSpecs),
    tx.select().from(t.recipePressureBands),
    tx.select().from(t.recipes),
  ])
  const values: ReferenceValues = new Map()
  const name = (id: string) => recipes.find(r => r.id === id)?.name ?? id
  for (const j of jars) {
    values.set(`jar:${j.id}:capacity`, { recipeId: null, label: `${j.name}: capacity`, value: `${j.capacityMl} mL` })
    values.set(`jar:${j.id}:size`, { recipeId: null, label: `${j.name}: outside size`, value: `${j.outsideDiameterMm} × ${j.heightMm} mm` })
  }
  for (const g of goods) {
    values.set(`ingredient:${g.id}:cup`, { recipeId: null, label: `${g.name}: weight of a cup`, value: `${g.gramsPerCup} g` })
    values.set(`ingredient:${g.id}:swell`, { recipeId: null, label: `${g.name}: swell`, value: `×${g.expansionRatio}` })
  }
  for (const r of recipes) {
    const basis = recipes.find(b => b.id === r.basedOnRecipeId)
    const set = (key: string, label: string, value: string, wordy = false) => values.set(`recipe:${r.id}:${key}`, { recipeId: r.id, label: `${r.name}: ${label}`, value, wordy })
    set('name', 'name', r.name)
    set('pack', 'pack, headspace and fill', `${r.packStyle} pack, ${r.headspaceMm} mm headspace, fill basis ${r.fillBasis}, solids up to ${r.solidsFillFraction}`)
    set('ingredient', 'bean', r.ingredientId)
    set('source', 'source', r.source)
    set('steps', 'steps', r.steps, true)
    set('summary', 'summary', r.summary, true)
    set('caution', 'caution', r.caution ?? '', true)
    set('prep', 'preparation', r.prep ? `soak: ${r.prep.soak}; ${r.prep.cook ? `${r.prep.cook.label}, ${r.prep.cook.minutes} min` : 'no cooking'}` : 'none given')
    // A house recipe follows its tested basis out of the library; the admin's reason goes with the change.
    set('retired', 'status', r.retiredAt ? 'retired' : basis?.retiredAt ? `its tested basis ${basis.name} retired` : 'in the library')
  }
  for (const s of specs) {
    values.set(`spec:${s.recipeId}:${s.sizeKey}`, { recipeId: s.recipeId, label: `${name(s.recipeId)}, ${s.sizeKey}: process time, dry amount, salt`, value: `${s.processMinutes ?? '—'} min, ${s.dryGrams ?? '—'} g, ${s.saltTsp ?? '—'} tsp` })
  }
  for (const b of bands) {
    values.set(`band:${b.recipeId}:${b.gaugeType}:${b.minFt}`, { recipeId: b.recipeId, label: `${name(b.recipeId)}, ${b.gaugeType} gauge from ${ft(b.minFt)} ft`, value: `${b.psi} psi up to ${ft(b.maxFt)} ft` })
  }
  return values
}

/** One line per value that changed, was removed or (when `before` held anything) was added. */
export function changesBetween(before: ReferenceValues, after: ReferenceValues): Change[] {
  const changes: Change[] = []
  const show = (v: Value) => (v.wordy ? (v.value ? 'text' : 'none') : v.value)
  for (const [key, old] of before) {
    const now = after.get(key)
    if (!now) changes.push({ recipeId: old.recipeId, what: `${old.label}: ${show(old)} removed` })
    else if (now.value !== old.value) changes.push({ recipeId: old.recipeId, what: old.wordy ? `${old.label} rewritten` : `${old.label}: ${old.value} → ${now.value}` })
  }
  // A row new to a database that already held the reference data is a change too.
  if (before.size) {
    for (const [key, now] of after) if (!before.has(key)) changes.push({ recipeId: now.recipeId, what: `${now.label}: ${show(now)} added` })
  }
  return changes
}

/**
 * House recipes borrow a tested recipe's process table: they take its corrected minutes and
 * pressure bands too (their own dry amounts and salt stay theirs).
 */
export async function followBasis(tx: Tx, publishedIds: string[]): Promise<void> {
  const house = await tx.select({ id: t.recipes.id, basis: t.recipes.basedOnRecipeId }).from(t.recipes)
    .where(and(isNotNull(t.recipes.householdId), inArray(t.recipes.basedOnRecipeId, publishedIds)))
  if (!house.length) return
  const specs = await tx.select().from(t.recipeJarSpecs).where(inArray(t.recipeJarSpecs.recipeId, publishedIds))
  const bands = await tx.select().from(t.recipePressureBands).where(inArray(t.recipePressureBands.recipeId, publishedIds))
  for (const recipe of house) {
    for (const spec of specs.filter(s => s.recipeId === recipe.basis)) {
      await tx.update(t.recipeJarSpecs).set({ processMinutes: spec.processMinutes })
        .where(and(eq(t.recipeJarSpecs.recipeId, recipe.id), eq(t.recipeJarSpecs.sizeKey, spec.sizeKey)))
    }
    await tx.delete(t.recipePressureBands).where(eq(t.recipePressureBands.recipeId, recipe.id))
    const own = bands.filter(b => b.recipeId === recipe.basis).map(b => ({ ...b, recipeId: recipe.id }))
    if (own.length) await tx.insert(t.recipePressureBands).values(own)
  }
}
