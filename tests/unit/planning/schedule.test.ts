import { describe, expect, it } from 'vitest'
import { DEFAULT_STEP_MINUTES, PlanningRefusal, buildSchedule, coolDownMinutes, parseStart } from '~~/utils/planning'

// Step lengths (CG "Using pressure canners" via MSU-PFS 01600948, EDIS HE8302; reference §2):
// heat to vent 12–15 min (we use 15), vent 10, pressurise 3–5 (5), natural cool-down about 30 min
// for pints and 45 for quarts, wait 10 min after zero, unload (our 5).
const load = (index: number, cannerId: string, processMinutes: number, coolMinutes: number) => ({ index, cannerId, processMinutes, coolMinutes })
const start = parseStart('2025-09-14T08:00', '2025-09-14')

describe('one load', () => {
  it('pints at 75 min: 15 + 10 + 5 + 75 + 30 + 10 + 5 = 150 min, 08:00 to 10:30', () => {
    const s = buildSchedule([load(1, 'a', 75, 30)], start, DEFAULT_STEP_MINUTES)
    expect(s.steps.map(x => [x.step, x.minutes])).toEqual([
      ['heat', 15], ['vent', 10], ['pressurise', 5], ['process', 75], ['cool', 30], ['wait', 10], ['unload', 5],
    ])
    expect(s.totalMinutes).toBe(150)
    expect(s.steps[3]).toMatchObject({ start: '2025-09-14T08:30:00', end: '2025-09-14T09:45:00' })
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
