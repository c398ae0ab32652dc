import { describe, expect, it } from 'vitest'
import {
  MAX_JARS_PER_LAYER, PACKOMANIA_RATIOS, drawnRatio, jarPositions, layersFor, layoutLayer, layoutTimings, tableJarsPerLayer,
  type Point,
} from '~~/utils/planning'
import { layoutViolations } from './geometry'

// R/r for n = 1…20, E. Specht, Packomania "circles in a circle" (canning reference §6 table),
// and n = 21…25 from the same table to 9 decimals (reference §6, "Other points").
const PACKOMANIA = [
  1, 2, 2.154700538379, 2.414213562373, 2.701301616704, 3, 3, 3.304764870962, 3.613125929753, 3.813025631398,
  3.923804400163, 4.029601930116, 4.2360679775, 4.328428554861, 4.521356964706, 4.615425594873, 4.792033748311,
  4.863703305156, 4.863703305156, 5.122320736992, 5.252317475, 5.439718959, 5.545204223, 5.651661092, 5.752824331,
]

const JAR = 76 // mm, a typical regular-mouth pint (from memory, reference §5.2)
const C = 6 // mm clearance
const canner = (ratio: number) => ratio * (JAR + C)

const assertValidLayout = (positions: Point[], D: number, d: number, c: number) => expect(layoutViolations(positions, D, d, c)).toEqual([])

describe('jars per layer vs the Packomania table (E. Specht, Packomania; canning reference §6)', () => {
  it('the embedded table matches the reference to 12 digits', () => {
    PACKOMANIA.forEach((k, i) => expect(PACKOMANIA_RATIOS[i]).toBeCloseTo(k, 9))
  })
  // At D/(d+c) = k(n) a layer holds n jars (n = 6 and 18 share their ratio with 7 and 19).
  const atRatio = (n: number) => Math.max(...PACKOMANIA.flatMap((k, i) => (k <= PACKOMANIA[n - 1]! ? [i + 1] : [])))
  it.each(Array.from({ length: 20 }, (_, i) => i + 1))('n = %i: holds n at k(n), fewer just below', (n) => {
    const k = PACKOMANIA[n - 1]!
    expect(tableJarsPerLayer(canner(k), JAR, C)).toBe(atRatio(n))
    expect(tableJarsPerLayer(canner(k * (1 - 1e-6)), JAR, C)).toBeLessThan(n)
  })
  // The reference rounds these to the hundredth of an inch, so check a hundredth either side.
  it.each([
    [9, 10.84],
    [10, 11.44],
    [11, 11.77],
    [12, 12.09],
  ])('worked example (reference §6): 3.0-in pints, %i jars need about %s in', (n, inches) => {
    expect(tableJarsPerLayer((inches + 0.01) * 25.4, 3 * 25.4, 0)).toBe(n)
    expect(tableJarsPerLayer((inches - 0.01) * 25.4, 3 * 25.4, 0)).toBe(n - 1)
  })
  it('worked example (reference §6): 7 quarts with OD 3.9 in need 11.7 in (3 × 3.9)', () => {
    expect(tableJarsPerLayer(11.7 * 25.4, 3.9 * 25.4, 0)).toBe(7)
    expect(tableJarsPerLayer(11.69 * 25.4, 3.9 * 25.4, 0)).toBe(5)
  })
  it('no jar fits a canner narrower than one jar plus clearance', () => {
    expect(tableJarsPerLayer(80, JAR, C)).toBe(0)
    expect(layoutLayer(80, JAR, C).perLayer).toBe(0)
  })
})

describe('drawn arrangements: real coordinates', () => {
  it('for n = 1…21 our drawing needs no more room than the table (within 1 part in a million)', () => {
    for (let n = 1; n <= 21; n++) expect(drawnRatio(n)! / PACKOMANIA[n - 1]! - 1).toBeLessThan(1e-6)
  })
  it('for n = 22…25 our drawing is within 0.2 % of the table, and never better than it', () => {
    for (let n = 22; n <= 25; n++) {
      expect(drawnRatio(n)! / PACKOMANIA[n - 1]! - 1).toBeLessThan(2e-3)
      expect(drawnRatio(n)! / PACKOMANIA[n - 1]! - 1).toBeGreaterThan(-1e-9)
    }
  })
  it('with room to spare the drawn count equals the table count for n = 1…25', () => {
    for (let n = 1; n <= 25; n++) {
      const layout = layoutLayer(canner(PACKOMANIA[n - 1]! * 1.002), JAR, C)
      expect(layout.perLayer).toBe(layout.tableCount)
      expect(layout.tableCount).toBeGreaterThanOrEqual(n)
    }
  })
  it('at exactly the table ratio for 25, where our drawing needs more room, it falls back and says so', () => {
    const layout = layoutLayer(canner(PACKOMANIA[24]!), JAR, C)
    expect(layout.tableCount).toBe(25)
    expect(layout.perLayer).toBe(24)
    expect(layout.limitedBy).toBe('drawing')
    assertValidLayout(layout.positions, canner(PACKOMANIA[24]!), JAR, C)
  })
  it('every stored arrangement, n = 1…40, is inside the wall and free of overlap at its own tightest ratio', () => {
    for (let n = 1; n <= MAX_JARS_PER_LAYER; n++) {
      const D = canner(drawnRatio(n)!)
      const positions = jarPositions(n, D, JAR, C)
      expect(positions).toHaveLength(n)
      assertValidLayout(positions!, D, JAR, C)
    }
  })
  it('beyond the table the count continues with our own arrangements and stops at 40', () => {
    const beyond = layoutLayer(canner(drawnRatio(30)!), JAR, C)
    expect(beyond.perLayer).toBe(30)
    expect(layoutLayer(5000, JAR, C)).toMatchObject({ perLayer: 40, limitedBy: 'cap' })
  })
  it('layoutTimings covers 1…40 without blowing up', () => {
    const timings = layoutTimings(undefined, 5)
    expect(timings.map(t => t.n)).toEqual(Array.from({ length: 40 }, (_, i) => i + 1))
    for (const t of timings) expect(t.perLayer).toBeGreaterThanOrEqual(t.n)
  })
})

describe('published canner statements with typical dimensions (jar and canner sizes from memory, reference §5.2 and §8)', () => {
  // Standard canner about 300 mm (11.8 in) across, 200 mm usable height; large canner the same
  // width and 290 mm tall; small canner 240 mm across. Rack 10 mm, clearance 6 mm.
  // Typical jar OD: pints 2.9–3.0 in (74–76 mm), quarts 3.4–3.6 in (86–91 mm); heights pint
  // 5.2–5.4 in (132–137 mm), quart 6.8–7.0 in (173–178 mm).
  const perLoad = (D: number, H: number, od: number, h: number) => layoutLayer(D, od, C).perLayer * layersFor(H, 10, h, 2)
  it.each([74, 76])('"most canners … hold seven quart jars or eight to nine pints" (CG, MSU-PFS 01600948): pint OD %i mm', (od) => {
    const pints = perLoad(300, 200, od, 135)
    expect(pints).toBeGreaterThanOrEqual(8)
    expect(pints).toBeLessThanOrEqual(9)
  })
  it.each([86, 89, 91])('standard canner: 7 quarts of OD %i mm (CG, MSU-PFS 01600948)', (od) => {
    expect(perLoad(300, 200, od, 175)).toBe(7)
  })
  it.each([132, 137])('"some large pressure canners hold 18 pint jars in two layers, but … only seven quart jars": pint height %i mm', (h) => {
    expect(perLoad(300, 290, 76, h)).toBe(18)
    expect(perLoad(300, 290, 89, 175)).toBe(7)
    expect(perLoad(300, 290, 89, 178)).toBe(7)
  })
  it('"small pressure canners hold four quart jars" (CG) — also the 2015 minimum of 4 quarts (p.1-35)', () => {
    expect(perLoad(240, 200, 89, 175)).toBe(4)
  })
})

describe('layers = floor((H + t) / (h + t)), capped by the canner', () => {
  it('two layers of pints in 290 mm with a 10 mm rack; one of quarts', () => {
    expect(layersFor(290, 10, 135, 3)).toBe(2) // (290 + 10) / (135 + 10) = 2.07
    expect(layersFor(290, 10, 175, 3)).toBe(1) // 300 / 185 = 1.62
  })
  it('exact fit counts; the canner maximum caps; a jar too tall gets none', () => {
    expect(layersFor(280, 10, 135, 3)).toBe(2) // 290 / 145 = 2 exactly
    expect(layersFor(600, 10, 135, 2)).toBe(2)
    expect(layersFor(120, 10, 135, 2)).toBe(0)
  })
})
