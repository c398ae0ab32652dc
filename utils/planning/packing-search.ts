/**
 * Search for an arrangement of n equal circles in the smallest circle we can find.
 *
 * Units: every small circle has radius 1, so the container radius equals the ratio R/r.
 * The search is "shrink and relax": start from a loose arrangement (rings or random), shrink
 * the container a little, push overlapping circles apart with FIRE (a damped-inertia
 * minimiser of the overlap energy), keep the shrink if all overlap vanishes, otherwise take a
 * smaller step. The result is then made exactly valid by scaling the centres until the closest
 * pair is exactly 2 apart; the reported ratio is measured from those centres, so it can only
 * be an upper bound on the true optimum — never an arrangement that overlaps.
 *
 * Deterministic: the random starts come from a seeded generator. The search is slow
 * (hundreds of milliseconds for 25 circles), so the planner draws from the precomputed
 * arrangements in `packing-data.ts`, produced by this function (see `printPackingData`).
 */

export interface Point {
  x: number
  y: number
}

/** n circles of radius 1, centres in `points`, all inside a circle of radius `ratio` at (0,0). */
export interface UnitPacking {
  n: number
  ratio: number
  points: Point[]
}

export interface SearchOptions {
  /** Random starts in addition to the ring starts (default 12, or 40 above 21 circles). */
  randomStarts?: number
  /** Seed for the random starts (default derived from n). */
  seed?: number
}

/** Small, seeded pseudo-random generator (mulberry32), so every run draws the same starts. */
function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Overlap energy and its gradient for centres `p` (x0,y0,x1,y1,…) in a container of radius k. */
function energy(p: Float64Array, n: number, k: number, grad: Float64Array): number {
  grad.fill(0)
  let e = 0
  const wall = k - 1
  for (let i = 0; i < n; i++) {
    const xi = p[2 * i]!
    const yi = p[2 * i + 1]!
    const ri = Math.hypot(xi, yi)
    if (ri > wall) {
      const o = ri - wall
      e += o * o
      grad[2 * i] = grad[2 * i]! + (2 * o * xi) / ri
      grad[2 * i + 1] = grad[2 * i + 1]! + (2 * o * yi) / ri
    }
    for (let j = i + 1; j < n; j++) {
      const dx = xi - p[2 * j]!
      const dy = yi - p[2 * j + 1]!
      const d2 = dx * dx + dy * dy
      if (d2 >= 4) continue
      const d = Math.sqrt(d2) || 1e-12
      const o = 2 - d
      e += o * o
      const gx = (-2 * o * dx) / d
      const gy = (-2 * o * dy) / d
      grad[2 * i] = grad[2 * i]! + gx
      grad[2 * i + 1] = grad[2 * i + 1]! + gy
      grad[2 * j] = grad[2 * j]! - gx
      grad[2 * j + 1] = grad[2 * j + 1]! - gy
    }
  }
  return e
}

const DONE_ENERGY = 1e-24

/** FIRE relaxation of the overlap energy at container radius k; returns the final energy. */
function relax(p: Float64Array, n: number, k: number, maxIter: number): number {
  const g = new Float64Array(2 * n)
  const v = new Float64Array(2 * n)
  let dt = 0.05
  let alpha = 0.1
  let positive = 0
  let e = energy(p, n, k, g)
  for (let it = 0; it < maxIter && e > DONE_ENERGY; it++) {
    let power = 0
    let vNorm = 0
    let fNorm = 0
    for (let i = 0; i < 2 * n; i++) {
      power -= g[i]! * v[i]!
      vNorm += v[i]! * v[i]!
      fNorm += g[i]! * g[i]!
    }
    if (fNorm < 1e-30) break
    vNorm = Math.sqrt(vNorm)
    fNorm = Math.sqrt(fNorm)
    if (power > 0) {
      for (let i = 0; i < 2 * n; i++) v[i] = (1 - alpha) * v[i]! - (alpha * vNorm * g[i]!) / fNorm
      if (++positive > 5) {
        dt = Math.min(dt * 1.1, 0.5)
        alpha *= 0.99
      }
    }
    else {
      v.fill(0)
      dt *= 0.5
      alpha = 0.1
      positive = 0
    }
    for (let i = 0; i < 2 * n; i++) {
      v[i] = v[i]! - g[i]! * dt
      p[i] = p[i]! + v[i]! * dt
    }
    e = energy(p, n, k, g)
  }
  return e
}

/** Scale centres so the closest pair touches; return the exact ratio those centres need. */
export function tighten(points: Point[]): UnitPacking {
  const n = points.length
  if (n === 1) return { n, ratio: 1, points: [{ x: 0, y: 0 }] }
  let minD = Infinity
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      minD = Math.min(minD, Math.hypot(points[i]!.x - points[j]!.x, points[i]!.y - points[j]!.y))
    }
  }
  const s = 2 / minD
  const scaled = points.map(q => ({ x: q.x * s, y: q.y * s }))
  const ratio = 1 + Math.max(...scaled.map(q => Math.hypot(q.x, q.y)))
  return { n, ratio, points: scaled }
}

function toArray(points: Point[]): Float64Array {
  const p = new Float64Array(2 * points.length)
  points.forEach((q, i) => {
    p[2 * i] = q.x
    p[2 * i + 1] = q.y
  })
  return p
}

function fromArray(p: Float64Array): Point[] {
  const out: Point[] = []
  for (let i = 0; i < p.length; i += 2) out.push({ x: p[i]!, y: p[i + 1]! })
  return out
}

/** Shrink the container around a valid start until the relaxation can no longer clear overlaps. */
function shrink(start: Point[], budget: number): UnitPacking {
  const n = start.length
  let best = tighten(start)
  let p = toArray(best.points)
  let step = 0.02
  let spent = 0
  while (step > 1e-10 && spent < budget) {
    const scale = 1 - step
    const k = 1 + (best.ratio - 1) * scale
    const q = p.map(c => c * scale)
    const iters = 400 + 40 * n
    spent += iters
    if (relax(q, n, k, iters) <= DONE_ENERGY) {
      const t = tighten(fromArray(q))
      if (t.ratio < best.ratio) {
        best = t
        p = toArray(t.points)
      }
      step = Math.min(step * 1.5, 0.05)
    }
    else {
      step *= 0.5
    }
  }
  return best
}

/**
 * Concentric-ring starts: an optional centre circle and rings of sizes that grow outward,
 * each ring at the smallest radius that keeps its own circles apart and clear of the ring
 * inside it. These are the known constructions (single ring, ring with centre, 1-6-12 and
 * similar); the shrink step then improves them.
 */
function ringStarts(n: number): Point[][] {
  const starts: Point[][] = []
  for (const centre of n === 1 ? [1] : [0, 1]) {
    const rest = n - centre
    if (rest === 0) {
      starts.push([{ x: 0, y: 0 }])
      continue
    }
    for (const sizes of ringSizes(rest, centre === 1)) starts.push(placeRings(sizes, centre === 1))
  }
  return starts
}

/**
 * Ring-size splits (inner to outer), at most three rings; each ring holds at least three more
 * circles than the one inside it, as in the known ring constructions (6-12, 3-9, 6-12-18).
 */
function ringSizes(m: number, centre: boolean): number[][] {
  const out: number[][] = [[m]]
  for (let a = centre ? 5 : 1; a < m; a++) {
    if (m - a >= a + 3) out.push([a, m - a])
    for (let b = a + 3; m - a - b >= b + 3; b++) out.push([a, b, m - a - b])
  }
  return out
}

/** Centres of the rings: each ring at the smallest radius clearing its own circles and the ring inside (gap 2). */
function placeRings(sizes: number[], centre: boolean): Point[] {
  const pts: Point[] = centre ? [{ x: 0, y: 0 }] : []
  let radius = centre ? 2 : 0
  sizes.forEach((m, ringIndex) => {
    const own = m === 1 ? 0 : 1 / Math.sin(Math.PI / m)
    const gap = ringIndex === 0 && !centre ? 0 : 2
    radius = Math.max(own, radius + gap)
    const phase = ringIndex % 2 === 1 ? Math.PI / m : 0
    for (let i = 0; i < m; i++) {
      const a = phase + (2 * Math.PI * i) / m
      pts.push({ x: radius * Math.cos(a), y: radius * Math.sin(a) })
    }
  })
  return pts
}

/** n centres spread uniformly over a disc a little larger than the packing will need. */
function randomStart(n: number, next: () => number): Point[] {
  const spread = 1.6 * Math.sqrt(n)
  return Array.from({ length: n }, () => {
    const r = spread * Math.sqrt(next())
    const a = 2 * Math.PI * next()
    return { x: r * Math.cos(a), y: r * Math.sin(a) }
  })
}

/** Best arrangement found for n circles from the ring starts plus seeded random starts. */
export function searchPacking(n: number, options: SearchOptions = {}): UnitPacking {
  if (!Number.isInteger(n) || n < 1) throw new RangeError('n must be a positive integer')
  if (n === 1) return { n, ratio: 1, points: [{ x: 0, y: 0 }] }
  const next = seeded(options.seed ?? 7919 * n)
  const starts = [...ringStarts(n)]
  for (let i = 0; i < (options.randomStarts ?? (n > 21 ? 40 : 12)); i++) starts.push(randomStart(n, next))
  let best: UnitPacking | undefined
  for (const start of starts) {
    const found = shrink(start, 60_000)
    if (!best || found.ratio < best.ratio) best = found
  }
  return best!
}

/**
 * The source text of `packing-data.ts` for arrangements n = 1, 2, …: one flat array of centres
 * (x0, y0, x1, y1, …) per n, rounded to 10 decimals. Rounding is harmless: the planner
 * re-measures every stored arrangement with `tighten` before using it.
 */
export function formatPackingData(packings: readonly UnitPacking[]): string {
  const out = [
    '/**',
    ' * Arrangements of n = 1…' + packings.length + ' equal circles (radius 1) in a circle, found by',
    ' * `searchPacking` in packing-search.ts. Generated by `npx tsx scripts/print-packing-data.ts`;',
    ' * do not edit by hand. Ratios found (R/r, before re-measuring):',
  ]
  for (let i = 0; i < packings.length; i += 5) {
    out.push(' *  ' + packings.slice(i, i + 5).map(p => `${p.n}: ${p.ratio.toFixed(9)}`).join(', '))
  }
  out.push(' */', 'export const PACKING_DATA: ReadonlyArray<readonly number[]> = [')
  for (const p of packings) {
    const nums = p.points.flatMap(q => [q.x, q.y]).map(v => Number(v.toFixed(10)).toString())
    const rows: string[] = []
    for (let i = 0; i < nums.length; i += 8) rows.push('    ' + nums.slice(i, i + 8).join(', ') + ',')
    out.push(`  [ // n = ${p.n}`, ...rows, '  ],')
  }
  out.push(']')
  return out.join('\n')
}
