/**
 * Jars in one layer of a round canner, and layers in its height.
 *
 * Count: a layer holds n jars when D / (d + c) ≥ k(n), with D the canner's inner diameter, d
 * the jar's outside diameter, c a clearance and k(n) the best-known ratio R/r for n equal circles
 * in a circle (Packomania table, n = 1…25).
 *
 * Drawing: the positions come from arrangements found by our own search (`packing-search.ts`,
 * stored in `packing-data.ts`). On first use each stored arrangement is re-measured (`tighten`),
 * so the ratio it needs is exact for the stored centres: every drawn jar is inside the wall and
 * no two overlap. Where our arrangement for the table's n needs a little more room than the
 * table's optimum (n = 22…25, by at most 0.15 %), the layer falls back to the largest n we can
 * draw and the layout says so (`limitedBy: 'drawing'`); it never draws overlapping jars.
 *
 * Beyond the table (n > 25) the count continues with our own arrangements, whose ratios are
 * upper bounds on the optimum and therefore safe, up to 40 jars per layer — more than any home
 * canner holds (an 18-pint canner holds 9 per layer).
 */
import { PACKING_DATA } from './packing-data'
import { tighten, type Point, type UnitPacking } from './packing-search'

/**
 * R/r for n = 1…25 equal circles in a circle: E. Specht, Packomania ("circles in a circle"),
 * via the 30-digit copy in jcmiller11/circlepacking (circlepacking.js) as tabulated in the
 * project's canning reference §6; n = 21…25 to 9 decimals.
 */
export const PACKOMANIA_RATIOS: readonly number[] = [
  1, 2, 2.154700538379, 2.414213562373, 2.701301616704, 3, 3, 3.304764870962, 3.613125929753,
  3.813025631398, 3.923804400163, 4.029601930116, 4.2360679775, 4.328428554861, 4.521356964706,
  4.615425594873, 4.792033748311, 4.863703305156, 4.863703305156, 5.122320736992, 5.252317475,
  5.439718959, 5.545204223, 5.651661092, 5.752824331,
]

const MAX_TABLE_N = PACKOMANIA_RATIOS.length
export const MAX_JARS_PER_LAYER = PACKING_DATA.length

/**
 * Default clearance c, in mm, added to each jar's diameter: jars stand at least 6 mm apart and
 * 3 mm from the wall — room to lift a jar out with a jar lifter and for steam to circulate.
 */
export const DEFAULT_CLEARANCE_MM = 6

/** Floating-point slack when comparing ratios (one part in 10¹², far below a micrometre). */
const TABLE_EPSILON = 1e-12
/** Slack for our drawings (one part in 10⁹: a 300 mm canner is off by at most 0.3 µm). */
const DRAW_EPSILON = 1e-9

/** R/r from the Packomania table, or undefined beyond n = 25. */
function packomaniaRatio(n: number): number | undefined {
  return PACKOMANIA_RATIOS[n - 1]
}

/** D / (d + c): how many clearance-widened jar radii fit in the canner's radius. */
function layerRatio(cannerDiameterMm: number, jarDiameterMm: number, clearanceMm: number): number {
  return cannerDiameterMm / (jarDiameterMm + clearanceMm)
}

/** The table's count: the largest n ≤ 25 with D/(d+c) ≥ k(n); 0 if not even one jar fits. */
export function tableJarsPerLayer(
  cannerDiameterMm: number,
  jarDiameterMm: number,
  clearanceMm = DEFAULT_CLEARANCE_MM,
): number {
  const ratio = layerRatio(cannerDiameterMm, jarDiameterMm, clearanceMm)
  let n = 0
  while (n < MAX_TABLE_N && ratio >= PACKOMANIA_RATIOS[n]! * (1 - TABLE_EPSILON)) n++
  return n
}

let drawn: UnitPacking[] | undefined

/** Our arrangements for n = 1…40 (unit jar radius), measured exactly once and then reused. */
function drawnPackings(): readonly UnitPacking[] {
  drawn ??= PACKING_DATA.map((flat) => {
    const points: Point[] = []
    for (let i = 0; i + 1 < flat.length; i += 2) points.push({ x: flat[i]!, y: flat[i + 1]! })
    return tighten(points)
  })
  return drawn
}

/** The ratio R/r our drawing of n jars needs (≥ the table's), or undefined beyond 40. */
export function drawnRatio(n: number): number | undefined {
  return drawnPackings()[n - 1]?.ratio
}

/**
 * Centres of n jars in mm from the canner's centre, or null if our arrangement of n does not
 * fit. The arrangement is spread outward to the available room (scaling centres apart only
 * widens the gaps), so the outer jars sit c/2 from the wall and the rest spread evenly.
 */
export function jarPositions(
  n: number,
  cannerDiameterMm: number,
  jarDiameterMm: number,
  clearanceMm = DEFAULT_CLEARANCE_MM,
): Point[] | null {
  const packing = drawnPackings()[n - 1]
  if (!packing) return null
  const ratio = layerRatio(cannerDiameterMm, jarDiameterMm, clearanceMm)
  if (packing.ratio > ratio * (1 + DRAW_EPSILON)) return null
  const r = (jarDiameterMm + clearanceMm) / 2
  const spread = packing.ratio > 1 ? (ratio - 1) / (packing.ratio - 1) : 1
  return packing.points.map(p => ({ x: p.x * spread * r, y: p.y * spread * r }))
}

export interface LayerLayout {
  perLayer: number
  /** The Packomania count for this canner and jar (≤ 25). */
  tableCount: number
  /** What set perLayer: the table, our drawing (fewer than the table), or the 40-jar cap. */
  limitedBy: 'table' | 'drawing' | 'cap'
  positions: Point[]
  jarDiameterMm: number
  cannerDiameterMm: number
  clearanceMm: number
}

/**
 * Jars per layer with their drawn positions. perLayer is the largest n not above the table's
 * count (or up to 40 when the table's 25 fit) that we can draw without overlap.
 */
export function layoutLayer(
  cannerDiameterMm: number,
  jarDiameterMm: number,
  clearanceMm = DEFAULT_CLEARANCE_MM,
): LayerLayout {
  const tableCount = tableJarsPerLayer(cannerDiameterMm, jarDiameterMm, clearanceMm)
  const limit = tableCount < MAX_TABLE_N ? tableCount : MAX_JARS_PER_LAYER
  for (let n = limit; n >= 1; n--) {
    const positions = jarPositions(n, cannerDiameterMm, jarDiameterMm, clearanceMm)
    if (!positions) continue
    const limitedBy = n < tableCount ? 'drawing' : n === MAX_JARS_PER_LAYER && n > tableCount ? 'cap' : 'table'
    return { perLayer: n, tableCount, limitedBy, positions, jarDiameterMm, cannerDiameterMm, clearanceMm }
  }
  return { perLayer: 0, tableCount, limitedBy: 'table', positions: [], jarDiameterMm, cannerDiameterMm, clearanceMm }
}

/**
 * Layers that fit in the canner's usable height H with a rack of thickness t between layers:
 * floor((H + t) / (h + t)), capped by the canner's own maximum.
 */
export function layersFor(usableHeightMm: number, rackThicknessMm: number, jarHeightMm: number, maxLayers: number): number {
  const fit = Math.floor((usableHeightMm + rackThicknessMm) / (jarHeightMm + rackThicknessMm) + TABLE_EPSILON)
  return Math.max(0, Math.min(fit, Math.floor(maxLayers)))
}

/**
 * Time `layoutLayer` for canners that just hold n jars of 76 mm, n = 1…40 by default.
 * Returns microseconds per call, averaged over `repeats` calls (after the one-off set-up).
 */
export function layoutTimings(
  counts: readonly number[] = Array.from({ length: MAX_JARS_PER_LAYER }, (_, i) => i + 1),
  repeats = 200,
): Array<{ n: number, perLayer: number, microseconds: number }> {
  const jar = 76
  const c = DEFAULT_CLEARANCE_MM
  drawnPackings()
  return counts.map((n) => {
    const ratio = drawnRatio(n) ?? packomaniaRatio(n) ?? 1
    const canner = ratio * (jar + c) * (1 + 1e-6)
    let perLayer = 0
    const t0 = performance.now()
    for (let i = 0; i < repeats; i++) perLayer = layoutLayer(canner, jar, c).perLayer
    return { n, perLayer, microseconds: ((performance.now() - t0) * 1000) / repeats }
  })
}
