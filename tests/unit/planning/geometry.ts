import type { Point } from '~~/utils/planning'

/**
 * What is wrong with a drawn layer: a jar (widened by the clearance) poking through the wall or
 * two jars closer than a widened diameter. Empty when the drawing is a real arrangement.
 * Tolerance 1 µm.
 */
export function layoutViolations(positions: readonly Point[], cannerDiameterMm: number, jarDiameterMm: number, clearanceMm: number): string[] {
  const r = (jarDiameterMm + clearanceMm) / 2
  const tol = 1e-3
  const out: string[] = []
  positions.forEach((p, i) => {
    const reach = Math.hypot(p.x, p.y) + r
    if (reach > cannerDiameterMm / 2 + tol) out.push(`jar ${i} reaches ${reach.toFixed(4)} mm, wall at ${cannerDiameterMm / 2} mm`)
  })
  for (let i = 0; i < positions.length; i++) {
    for (let j = i + 1; j < positions.length; j++) {
      const d = Math.hypot(positions[i]!.x - positions[j]!.x, positions[i]!.y - positions[j]!.y)
      if (d < 2 * r - tol) out.push(`jars ${i} and ${j} are ${d.toFixed(4)} mm apart, need ${2 * r} mm`)
    }
  }
  return out
}
