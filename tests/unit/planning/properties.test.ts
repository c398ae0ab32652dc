import { fc, test } from '@fast-check/vitest'
import { describe, expect } from 'vitest'
import {
  DEFAULT_STEP_MINUTES, PlanningRefusal, buildLoads, buildSchedule, goodsForJars, jarsFromGoods, layersFor, layoutLayer,
  parseStart, perJarFill, planBatch, type Canner, type LoadLine, type PlanLineRequest, type PlanRequest,
} from '~~/utils/planning'
import { TODAY, blackBeans, catalogue, dryPack, household, jarSizes, pint, standardCanner } from './fixtures'
import { layoutViolations } from './geometry'

const double = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true })

describe('fill', () => {
  test.prop([double(50, 4000), double(0.05, 1), double(1, 6), fc.option(double(-10, 3000), { nil: undefined })])(
    'the cap is never exceeded: a request within it is planned as asked, one above it (or not above 0) is refused',
    (capacityMl, f, E, ask) => {
      const jar = { ...pint, capacityMl }
      const recipe = { ...dryPack, solidsFillFraction: f }
      const bean = { ...blackBeans, expansionRatio: E }
      const cap = perJarFill(recipe, jar, bean, jarSizes, {}, 'l')
      expect(cap.dryMl).toBeCloseTo(cap.capMl, 9)
      // The cap is d_max = f · V / E (shared/design/computation.md §1).
      expect(cap.capMl).toBeCloseTo(capacityMl * f / E, 6)
      if (ask === undefined) return
      const fill = () => perJarFill(recipe, jar, bean, jarSizes, { dryMlPerJar: ask }, 'l')
      if (ask <= 0 || ask > cap.capMl * (1 + 1e-6)) expect(fill).toThrow(PlanningRefusal)
      else if (ask < cap.capMl * (1 - 1e-6)) expect(fill().dryMl).toBe(ask)
    },
  )
})

describe('scaling', () => {
  test.prop([fc.integer({ min: 1, max: 2000 }), double(0.5, 5000)])('jars → goods → jars gives back at least the jars asked', (jars, perJar) => {
    expect(jarsFromGoods(goodsForJars(jars, perJar), perJar).jars).toBeGreaterThanOrEqual(jars)
  })
  test.prop([fc.integer({ min: 1, max: 300 }), double(20, 118)], { numRuns: 40 })(
    'through the planner: the dry grams of a jars plan, planned as goods, fill at least as many jars',
    (n, dryMl) => {
      const base: PlanRequest = { lines: [], canners: [standardCanner], altitudeFt: 0, today: TODAY }
      const line = { recipeId: dryPack.id, jarSizeId: pint.id, dryMlPerJar: dryMl }
      const forward = planBatch({ ...base, lines: [{ ...line, amount: { mode: 'jars', jars: n } }] }, catalogue, household)
      const grams = forward.lines[0]!.dryGramsTotal
      const back = planBatch({ ...base, lines: [{ ...line, amount: { mode: 'dryGrams', grams } }] }, catalogue, household)
      expect(back.lines[0]!.jars).toBeGreaterThanOrEqual(n)
    },
  )
})

const lineArb = fc.record({
  jars: fc.integer({ min: 1, max: 150 }),
  processMinutes: fc.constantFrom(40, 60, 65, 75, 90),
  jarSizeId: fc.constantFrom('pint', 'quart'),
  psi: fc.constantFrom(10, 15),
})
const fitArb = fc.record({ perLayer: fc.integer({ min: 1, max: 25 }), layers: fc.integer({ min: 1, max: 3 }) })

describe('loads', () => {
  test.prop([fc.array(lineArb, { minLength: 1, maxLength: 5 }), fc.array(fitArb, { minLength: 1, maxLength: 2 })])(
    'every jar is loaded once, no load is over capacity, and a group’s loads are even (differ by ≤ 1 unless the smaller is full)',
    (specs, fits) => {
      const ids = fits.map((_, i) => `c${i}`)
      const lines: LoadLine[] = specs.map((s, i) => ({
        lineIndex: i, recipeId: `r${i}`, jarSizeId: s.jarSizeId, jars: s.jars, processMinutes: s.processMinutes,
        psiByCanner: Object.fromEntries(ids.map(id => [id, s.psi])),
      }))
      const fit = (cannerId: string) => ({ cannerId, ...fits[Number(cannerId.slice(1))]! })
      const loads = buildLoads(lines, ids, fit, () => 150)
      const total = specs.reduce((s, l) => s + l.jars, 0)
      expect(loads.reduce((s, l) => s + l.jars, 0)).toBe(total)
      lines.forEach((line) => {
        const loaded = loads.flatMap(l => l.contents).filter(c => c.lineIndex === line.lineIndex)
        expect(loaded.reduce((s, c) => s + c.jars, 0)).toBe(line.jars)
      })
      for (const load of loads) {
        expect(load.jars).toBeGreaterThan(0)
        expect(load.jars).toBeLessThanOrEqual(load.capacity)
        expect(load.processMinutes).toBe(Math.max(...load.contents.map(c => c.processMinutes)))
      }
      const groups = new Map<string, typeof loads>()
      for (const l of loads) {
        const key = `${l.jarSizeId}|${l.pressurePsi}`
        groups.set(key, [...(groups.get(key) ?? []), l])
      }
      for (const group of groups.values()) {
        const jarsInGroup = group.reduce((s, l) => s + l.jars, 0)
        expect(group.reduce((s, l) => s + l.capacity, 0)).toBeGreaterThanOrEqual(jarsInGroup)
        for (const a of group) {
          for (const b of group) {
            if (a.jars < b.jars - 1) expect(a.jars).toBe(a.capacity)
          }
        }
        if (fits.length === 1) expect(group.length).toBe(Math.ceil(jarsInGroup / group[0]!.capacity))
      }
    },
  )
})

describe('canner geometry', () => {
  test.prop([double(60, 700), double(40, 130), double(0, 15)])('drawn jars sit inside the wall and never overlap', (D, d, c) => {
    const layout = layoutLayer(D, d, c)
    expect(layout.positions).toHaveLength(layout.perLayer)
    expect(layout.perLayer).toBeLessThanOrEqual(Math.max(layout.tableCount, layout.tableCount >= 25 ? 40 : 0))
    expect(layoutViolations(layout.positions, D, d, c)).toEqual([])
  })
  test.prop([double(60, 700), double(0, 300), double(40, 130), double(0, 15)])('a larger canner never holds fewer jars per layer', (D, extra, d, c) => {
    expect(layoutLayer(D + extra, d, c).perLayer).toBeGreaterThanOrEqual(layoutLayer(D, d, c).perLayer)
  })
  test.prop([double(50, 800), double(0, 300), double(0, 20), double(60, 300), fc.integer({ min: 1, max: 4 })])(
    'a taller canner never holds fewer layers',
    (H, extra, t, h, max) => {
      expect(layersFor(H + extra, t, h, max)).toBeGreaterThanOrEqual(layersFor(H, t, h, max))
    },
  )
})

describe('schedule', () => {
  const loadArb = fc.record({
    cannerId: fc.constantFrom('a', 'b'),
    processMinutes: fc.integer({ min: 1, max: 120 }),
    coolMinutes: fc.integer({ min: 0, max: 60 }),
  })
  const stepsArb = fc.record({ heat: fc.integer({ min: 0, max: 30 }), unload: fc.integer({ min: 0, max: 10 }) })
  test.prop([fc.array(loadArb, { maxLength: 12 }), stepsArb])(
    'steps on one canner never overlap and the day ends with the last step',
    (specs, over) => {
      const loads = specs.map((s, i) => ({ index: i + 1, ...s, gaugeType: 'weighted' as const, pressurePsi: 10 }))
      const s = buildSchedule(loads, parseStart('2025-09-14T08:00Z', '2025-09-14'), { ...DEFAULT_STEP_MINUTES, ...over })
      for (const id of ['a', 'b']) {
        const steps = s.steps.filter(x => x.cannerId === id).sort((x, y) => x.startMinute - y.startMinute || x.endMinute - y.endMinute)
        steps.forEach((x, i) => {
          expect(x.endMinute - x.startMinute).toBe(x.minutes)
          if (i > 0) expect(x.startMinute).toBeGreaterThanOrEqual(steps[i - 1]!.endMinute)
        })
      }
      expect(s.totalMinutes).toBe(Math.max(0, ...s.steps.map(x => x.endMinute)))
    },
  )
})

describe('refusals', () => {
  const wild = fc.oneof(
    fc.double(),
    fc.integer({ min: -100, max: 3000 }),
    fc.constantFrom(0, -1, 0.5, 1e9, Number.NaN, Number.POSITIVE_INFINITY),
  )
  const amount = fc.oneof(
    fc.record({ mode: fc.constant('jars' as const), jars: wild }),
    fc.record({ mode: fc.constant('dryGrams' as const), grams: wild }),
    fc.record({ mode: fc.constant('packages' as const), packages: fc.array(fc.record({ grams: wild, count: wild }), { maxLength: 3 }) }),
    fc.record({
      mode: fc.constant('consumption' as const), jarsPerMonth: wild, months: wild,
      jarsOnShelf: fc.option(wild, { nil: undefined }),
    }),
  )
  const line: fc.Arbitrary<PlanLineRequest> = fc.record({
    recipeId: fc.constantFrom(...catalogue.recipes.map(r => r.id), 'unknown'),
    jarSizeId: fc.constantFrom(...catalogue.jarSizes.map(j => j.id), 'unknown'),
    amount,
    saltTsp: fc.option(wild, { nil: undefined }),
    dryMlPerJar: fc.option(wild, { nil: undefined }),
  })
  const canner: fc.Arbitrary<Canner> = fc.record({
    id: fc.constantFrom('a', 'b', 'c'),
    name: fc.constant('Canner'),
    innerDiameterMm: fc.oneof(wild, double(150, 450)),
    usableHeightMm: fc.oneof(wild, double(100, 400)),
    rackThicknessMm: fc.oneof(wild, double(0, 15)),
    gaugeType: fc.constantFrom('dial' as const, 'weighted' as const),
    maxLayers: fc.oneof(wild, fc.integer({ min: 1, max: 3 })),
    waterDepthMm: fc.oneof(wild, double(50, 80)),
    lastGaugeTestAt: fc.constantFrom(null, '2025-01-01', 'not a date'),
  })
  const requestArb: fc.Arbitrary<PlanRequest> = fc.record({
    lines: fc.array(line, { maxLength: 3 }),
    canners: fc.array(canner, { maxLength: 3 }),
    altitudeFt: fc.oneof(wild, fc.integer({ min: -2000, max: 12000 })),
    startAt: fc.option(fc.constantFrom('2025-09-14T08:00', '2025-09-14T08:00+02:00', 'soon', '2025-13-01'), { nil: undefined }),
    // A caller outside TypeScript may still leave it out: that too must end in a refusal.
    today: fc.constantFrom(TODAY, 'someday', undefined as unknown as string),
  })
  test.prop([requestArb, fc.option(wild, { nil: undefined }), wild], { numRuns: 400 })(
    'random requests either plan or end in a PlanningRefusal with a message — never another error',
    (request, clearanceMm, jarUses) => {
      try {
        const r = planBatch(request, catalogue, { ...household, jarUses }, { clearanceMm })
        expect(r.loads.length).toBeGreaterThan(0)
        expect(r.loads.reduce((s, l) => s + l.jars, 0)).toBe(r.totals.jars)
        for (const l of r.layouts) expect(layoutViolations(l.positions, l.cannerDiameterMm, l.jarDiameterMm, l.clearanceMm)).toEqual([])
      }
      catch (e) {
        if (!(e instanceof PlanningRefusal)) throw e
        expect(e.message.trim().length).toBeGreaterThan(0)
      }
    },
  )

  // Valid by construction: a published recipe in a jar size its table covers, a sensible jar
  // count, one ordinary canner, an altitude inside the published bands (USDA Complete Guide,
  // Guide 4, Table 1: dial-gauge pressures are published up to 8,000 ft). These must plan.
  const tested = catalogue.recipes.filter(r => r.status === 'tested')
  const validLine: fc.Arbitrary<PlanLineRequest> = fc.constantFrom(...tested).chain((recipe) => {
    const sizes = catalogue.jarSizes.filter(j => recipe.processMinutes.some(p => p.jarKey === j.key))
    return fc.record({
      recipeId: fc.constant(recipe.id),
      jarSizeId: fc.constantFrom(...sizes.map(j => j.id)),
      amount: fc.record({ mode: fc.constant('jars' as const), jars: fc.integer({ min: 1, max: 60 }) }),
    })
  })
  test.prop([fc.array(validLine, { minLength: 1, maxLength: 3 }), fc.integer({ min: 0, max: 8000 }), fc.constantFrom('dial' as const, 'weighted' as const)], { numRuns: 200 })(
    'valid requests are planned, with every jar asked for in some load',
    (lines, altitudeFt, gaugeType) => {
      const request: PlanRequest = { lines, canners: [{ ...standardCanner, gaugeType, lastGaugeTestAt: TODAY }], altitudeFt, today: TODAY, startAt: `${TODAY}T08:00` }
      const r = planBatch(request, catalogue, household)
      const asked = lines.reduce((s, l) => s + (l.amount.mode === 'jars' ? l.amount.jars : 0), 0)
      expect(r.totals.jars).toBe(asked)
    },
  )
})
