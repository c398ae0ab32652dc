/**
 * How many jars a canner holds: the planner's own packing (jars per layer from the circle-packing
 * table, layers from the usable height), so the Logbook refuses a load the canner cannot hold by
 * the same rule the Canner map draws.
 */
import { countOf } from '../planning/units'
import { layersFor, layoutLayer } from '../planning/packing'

export interface CapacityCanner { name: string, innerDiameterMm: number, usableHeightMm: number, rackThicknessMm: number, maxLayers: number }
export interface CapacityJar { id: string, name: string, outsideDiameterMm: number, heightMm: number }

/** Jars of one size a canner holds in one load. */
export function cannerCapacity(canner: CapacityCanner, jar: CapacityJar): number {
  const layer = layoutLayer(canner.innerDiameterMm, jar.outsideDiameterMm)
  return layer.perLayer * layersFor(canner.usableHeightMm, canner.rackThicknessMm, jar.heightMm, canner.maxLayers)
}

/**
 * Why these jars do not fit in one load, or null when they do. Each jar size takes its share of
 * the canner (jars ÷ what the canner holds of that size); the shares may not add up past one.
 */
export function overCapacity(canner: CapacityCanner, lines: ReadonlyArray<{ jar: CapacityJar, jars: number }>): string | null {
  const bySize = new Map<string, { jar: CapacityJar, jars: number }>()
  for (const l of lines) bySize.set(l.jar.id, { jar: l.jar, jars: (bySize.get(l.jar.id)?.jars ?? 0) + l.jars })
  const sizes = [...bySize.values()].map(s => ({ ...s, holds: cannerCapacity(canner, s.jar) }))
  const jarName = (jar: CapacityJar) => jar.name.split(',')[0]!.toLowerCase()
  const none = sizes.find(s => s.holds === 0)
  if (none) return `${canner.name} cannot hold ${jarName(none.jar)} jars at all (too tall or too wide for it).`
  const share = sizes.reduce((sum, s) => sum + s.jars / s.holds, 0)
  if (share <= 1 + 1e-9) return null
  const holds = sizes.map(s => `${countOf(s.holds, `${jarName(s.jar)} jar`)}`).join(' or ')
  const asked = sizes.map(s => countOf(s.jars, `${jarName(s.jar)} jar`)).join(' and ')
  return `${canner.name} holds ${holds} in one load; ${asked} ${sizes.length === 1 && sizes[0]!.jars === 1 ? 'is' : 'are'} more than it holds.`
}
