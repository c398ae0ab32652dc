import { describe, expect, it } from 'vitest'
import { DEFAULT_STEP_MINUTES, KITCHEN_LANE, PlanningRefusal, buildSchedule, coolDownMinutes, parseStart, type RecipePrep } from '~~/utils/planning'

// Step lengths (CG "Using pressure canners" via MSU-PFS 01600948, EDIS HE8302; reference §2):
// heat to vent 12–15 min (we use 15), vent 10, pressurise 3–5 (5), natural cool-down about 30 min
// for pints and 45 for quarts, wait 10 min after zero, unload (our 5).
const load = (index: number, cannerId: string, processMinutes: number, coolMinutes: number, gaugeType: 'dial' | 'weighted' = 'weighted') =>
  ({ index, cannerId, processMinutes, coolMinutes, gaugeType, pressurePsi: gaugeType === 'dial' ? 11 : 10 })
const canning = (s: ReturnType<typeof buildSchedule>) => s.steps.filter(x => x.lane !== KITCHEN_LANE)
const start = parseStart('2025-09-14T08:00', '2025-09-14')

describe('one load', () => {
  it('pints at 75 min: 15 + 10 + 5 + 75 + 30 + 10 + 5 = 150 min, 08:00 to 10:30', () => {
    const s = buildSchedule([load(1, 'a', 75, 30)], start, DEFAULT_STEP_MINUTES)
    expect(canning(s).map(x => [x.step, x.minutes])).toEqual([
      ['heat', 15], ['vent', 10], ['pressurise', 5], ['process', 75], ['cool', 30], ['wait', 10], ['unload', 5],
    ])
    expect(s.totalMinutes).toBe(150)
    expect(canning(s)[3]).toMatchObject({ start: '2025-09-14T08:30:00', end: '2025-09-14T09:45:00' })
    expect(s.endAt).toBe('2025-09-14T10:30:00')
  })
  it('quarts at 90 min with the 45-min cool-down: 180 min', () => {
    expect(buildSchedule([load(1, 'a', 90, 45)], start, DEFAULT_STEP_MINUTES).totalMinutes).toBe(180)
  })
})

describe('several loads', () => {
  it('one canner: the next load starts when the previous is unloaded', () => {
    const s = buildSchedule([load(1, 'a', 75, 30), load(2, 'a', 75, 30)], start, DEFAULT_STEP_MINUTES)
    expect(s.totalMinutes).toBe(300)
    expect(s.steps.find(x => x.load === 2 && x.step === 'heat')).toMatchObject({ startMinute: 150, start: '2025-09-14T10:30:00' })
  })
  it('two canners run side by side', () => {
    const s = buildSchedule([load(1, 'a', 75, 30), load(2, 'b', 75, 30)], start, DEFAULT_STEP_MINUTES)
    expect(s.totalMinutes).toBe(150)
    expect(s.steps.filter(x => x.step === 'heat').map(x => x.startMinute)).toEqual([0, 0])
  })
  it('two canners of different lengths: the day ends at the latest end of any lane, not the last step listed', () => {
    // Canner a: two pint loads (150 + 150 min); canner b: one quart load (180 min).
    const s = buildSchedule([load(1, 'a', 75, 30), load(2, 'b', 90, 45), load(3, 'a', 75, 30)], start, DEFAULT_STEP_MINUTES)
    expect(s.totalMinutes).toBe(300)
    expect(s.endAt).toBe('2025-09-14T13:00:00')
    expect(Math.max(...s.steps.map(x => x.endMinute))).toBe(300)
  })
  it('fills the jars of the next load while the one before it processes, and the first loads just before the start', () => {
    const s = buildSchedule([load(1, 'a', 75, 30), load(2, 'a', 75, 30)], start, DEFAULT_STEP_MINUTES)
    const fills = s.steps.filter(x => x.step === 'fill')
    expect(fills.map(f => [f.load, f.startMinute, f.lane])).toEqual([[1, -15, KITCHEN_LANE], [2, 30, KITCHEN_LANE]])
    const process1 = s.steps.find(x => x.load === 1 && x.step === 'process')!
    expect(fills[1]!.startMinute).toBeGreaterThanOrEqual(process1.startMinute)
    expect(fills[1]!.endMinute).toBeLessThanOrEqual(process1.endMinute)
  })
  it('words the steps for the gauge: a dial reads zero, a weighted canner drops its lid lock (CG "Using pressure canners")', () => {
    const dial = buildSchedule([load(1, 'a', 75, 30, 'dial')], start, DEFAULT_STEP_MINUTES).steps
    const weighted = buildSchedule([load(1, 'a', 75, 30, 'weighted')], start, DEFAULT_STEP_MINUTES).steps
    expect(dial.find(x => x.step === 'pressurise')!.label).toMatch(/dial reads 11 psi/)
    expect(weighted.find(x => x.step === 'pressurise')!.label).toMatch(/10 psi weight/)
    expect(dial.find(x => x.step === 'wait')!.label).toMatch(/petcock/)
    expect(weighted.find(x => x.step === 'cool')!.label).toMatch(/never|naturally/)
  })
})

describe('preparation before the start (CG Guide 4, "Beans or peas—shelled, dried"; reference §1.1)', () => {
  const driedBeans: RecipePrep = { soak: 'either', cook: { label: 'drain, cover with fresh water and boil 30 minutes', minutes: 30 }, source: 'CG Guide 4' }
  const recipes = [{ id: 'beans', name: 'pinto beans', prep: driedBeans }]
  it('overnight: soak at least 12 h and at most 18 h, then boil 30 min, then fill, ending at the start', () => {
    const s = buildSchedule([load(1, 'a', 75, 30)], start, DEFAULT_STEP_MINUTES, recipes, 'overnight')
    const prep = s.steps.filter(x => x.load === 0)
    expect(prep.map(x => [x.step, x.minutes])).toEqual([['soak', 12 * 60], ['cook', 30]])
    // Fill 15 min (common practice, no published source) before 08:00: boil 07:15–07:45, soak ends 07:15.
    expect(prep[1]).toMatchObject({ start: '2025-09-14T07:15:00', end: '2025-09-14T07:45:00' })
    expect(prep[0]).toMatchObject({ start: '2025-09-13T19:15:00', end: '2025-09-14T07:15:00', earliestStart: '2025-09-13T13:15:00' })
    expect(s.prepStartAt).toBe('2025-09-13T19:15:00')
    expect(s.startAt).toBe('2025-09-14T08:00:00')
    expect(s.steps[0]!.step).toBe('soak')
  })
  it('quick: boil 2 min, stand 1 h, then the 30-minute boil', () => {
    const s = buildSchedule([load(1, 'a', 75, 30)], start, DEFAULT_STEP_MINUTES, recipes, 'quick')
    expect(s.steps.filter(x => x.load === 0).map(x => [x.step, x.minutes])).toEqual([['quick-boil', 2], ['stand', 60], ['cook', 30]])
    expect(s.prepStartAt).toBe('2025-09-14T06:13:00')
  })
  it('a recipe that allows only the quick method uses it even when overnight is asked', () => {
    const s = buildSchedule([load(1, 'a', 65, 30)], start, DEFAULT_STEP_MINUTES, [{ id: 'sauce', name: 'navy beans', prep: { ...driedBeans, soak: 'quick' } }], 'overnight')
    expect(s.steps.filter(x => x.load === 0).map(x => x.step)).toEqual(['quick-boil', 'stand', 'cook'])
  })
  it('dry pack: sort and rinse, then fill (common practice, no published source)', () => {
    const s = buildSchedule([load(1, 'a', 75, 30)], start, DEFAULT_STEP_MINUTES, [{ id: 'dry', name: 'black beans', prep: { soak: 'none', cook: null, source: 'household practice' } }])
    expect(s.steps.filter(x => x.lane === KITCHEN_LANE).map(x => [x.step, x.startMinute])).toEqual([['rinse', -30], ['fill', -15]])
  })
})

describe('cool-down by jar size (PNW 421: about 30 min pints, 45 min quarts)', () => {
  it('pints and smaller 30, anything larger 45; the household can change both', () => {
    expect(coolDownMinutes(236.59)).toBe(30)
    expect(coolDownMinutes(473.176473)).toBe(30)
    expect(coolDownMinutes(709.76)).toBe(45)
    expect(coolDownMinutes(946.35)).toBe(45)
    expect(coolDownMinutes(473.176473, { pint: 25, quart: 40 })).toBe(25)
  })
})

describe('start times keep their offset', () => {
  it.each([
    ['2025-09-14T08:00:00Z', '2025-09-14T10:30:00Z'],
    ['2025-09-14T07:00-06:00', '2025-09-14T09:30:00-06:00'],
    ['2025-09-14T23:00', '2025-09-15T01:30:00'],
    ['2025-09-14', '2025-09-14T10:30:00'],
  ])('%s + 150 min → %s', (text, end) => {
    expect(buildSchedule([load(1, 'a', 75, 30)], parseStart(text, '2025-09-14'), DEFAULT_STEP_MINUTES).endAt).toBe(end)
  })
  it('without a start, 08:00 local wall-clock time on `today`', () => {
    expect(buildSchedule([], parseStart(undefined, '2025-09-14'), DEFAULT_STEP_MINUTES).startAt).toBe('2025-09-14T08:00:00')
  })
  it.each(['tomorrow', '2025-02-30T08:00', '2025-09-14T25:00', '2025-09-14T08:61'])('refuses "%s"', (text) => {
    expect(() => parseStart(text, '2025-09-14')).toThrow(PlanningRefusal)
  })
})
