/**
 * The cautions every plan carries when they apply: untested practice, house recipes, gauge
 * tests, altitude adjustment, and the procedure points a canner must not skip.
 */
import { caution, reminder, type PlanWarning } from './errors'
import type { LoadResult } from './results'
import { gaugeTestWarning, seaLevelPsi } from './process'
import type { Canner, Recipe, UnitSystem } from './types'
import { formatLength } from './units'

export interface StandingInput {
  recipes: readonly Recipe[]
  canners: readonly Canner[]
  loads: readonly LoadResult[]
  feet: number
  today: string
  system: UnitSystem
}

/** The cautions and the routine reminders that apply to this plan, in a fixed order. */
export function standingWarnings({ recipes, canners, loads, feet, today, system }: StandingInput): PlanWarning[] {
  const out: PlanWarning[] = []
  const dry = recipes.filter(r => r.packStyle === 'dry')
  if (dry.length) {
    out.push(
      caution(
        'dry-pack-untested',
        `Dry-pack (no-soak) canning (${dry.map(r => r.name).join(', ')}) is household practice, not a laboratory-tested `
        + 'process: USDA and NCHFP publish times only for beans soaked and pre-cooked, then hot-packed (OSU EM 9435; '
        + 'Penn State Extension). Never put more dry beans in a jar than the fill cap.',
      ),
    )
  }
  for (const r of recipes) {
    if (r.status === 'house') {
      // The stored caution usually opens with the same words; say them once.
      const extra = r.caution ? ` ${r.caution.replace(/^untested\s*[—-]\s*your own risk\.?\s*/i, '')}` : ''
      out.push(caution('house-recipe-untested', `${r.name} is a house recipe: untested — your own risk.${extra.trimEnd()}`))
    }
    else if (r.caution) {
      out.push(caution('recipe-caution', `${r.name}: ${r.caution}`))
    }
  }
  canners.forEach((c, k) => {
    const mine = loads.filter(l => l.cannerId === c.id)
    if (mine.length === 0) return
    const test = gaugeTestWarning(c, today, `canners[${k}].lastGaugeTestAt`)
    if (test) out.push(test)
    const psi = Math.max(...mine.map(l => l.pressurePsi))
    const base = Math.min(
      ...mine.flatMap(l => l.recipeIds.map(id => seaLevelPsi(recipes.find(r => r.id === id)!, c.gaugeType) ?? psi)),
    )
    if (psi > base) {
      out.push(
        reminder(
          'altitude-adjusted',
          `At ${feet.toLocaleString('en-US')} ft, process at ${psi} psi on the ${c.gaugeType} gauge of ${c.name}, `
          + `not the sea-level ${base} psi.`,
          'altitudeFt',
        ),
      )
    }
  })
  const headspaces = [...new Set(recipes.map(r => formatLength(r.headspaceMm, system)))]
  out.push(
    reminder(
      'procedure',
      `Leave ${headspaces.join(' or ')} headspace. Vent steam for a full 10 minutes before pressurising, keep the `
      + 'pressure at or above the setting for the whole time, and let the canner cool to zero on its own — never '
      + 'force-cool it. When in doubt, follow current published guidance, your extension office and the canner’s manual.',
    ),
  )
  return out
}
