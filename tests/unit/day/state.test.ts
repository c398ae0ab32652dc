/**
 * The canning day's sequence (USDA Complete Guide, "Using pressure canners"; reference §2): vent
 * 10 minutes, time the process only at pressure and from the beginning again after a drop,
 * cool naturally to zero, wait 10 minutes with the weight off before opening.
 */
import { describe, expect, it } from 'vitest'
import { DayRefusal, applyEvent, checkUndo, dayState, type DayEvent, type DaySnapshot } from '~~/utils/day/state'
import type { DayEventKind } from '~~/utils/vocabulary'

const T0 = Date.parse('2026-12-05T15:00:00Z')
const at = (minutes: number) => new Date(T0 + minutes * 60_000).toISOString()

const snapshot: DaySnapshot = {
  planName: 'Saturday beans',
  startAt: '2026-12-05T08:00:00',
  endAt: '2026-12-05T13:00:00',
  prepStartAt: '2026-12-04T19:15:00',
  loads: [
    { index: 1, cannerId: 'a', cannerName: 'Tall canner', gaugeType: 'weighted', pressurePsi: 15, processMinutes: 75, jars: 9, jarSizeId: 'pint-regular', contents: [] },
    { index: 2, cannerId: 'b', cannerName: 'Dial canner', gaugeType: 'dial', pressurePsi: 12, processMinutes: 90, jars: 7, jarSizeId: 'quart-regular', contents: [] },
    { index: 3, cannerId: 'a', cannerName: 'Tall canner', gaugeType: 'weighted', pressurePsi: 15, processMinutes: 75, jars: 9, jarSizeId: 'pint-regular', contents: [] },
  ],
  tasks: [{ key: 'beans:cook', label: 'Boil 30 minutes', minutes: 30, load: 0, plannedStart: '2026-12-05T07:15:00', plannedEnd: '2026-12-05T07:45:00' }],
  planned: [],
}

let n = 0
const ev = (target: string, kind: DayEventKind, minute: number, undoes?: string): DayEvent => ({ id: `e${++n}`, target, kind, at: at(minute), by: 'Ada', undoes: undoes ?? null })
/** Apply events one at a time, as the server does. */
function run(events: DayEvent[]) {
  let state = dayState(snapshot, [])
  for (const e of events) state = applyEvent(snapshot, state, e)
  return state
}
const load = (events: DayEvent[], index = 1) => run(events).loads.find(l => l.index === index)!
const refusal = (events: DayEvent[]) => {
  try {
    run(events)
  }
  catch (e) {
    expect(e).toBeInstanceOf(DayRefusal)
    return (e as DayRefusal).message
  }
  throw new Error('expected a refusal')
}

const upToProcess = (offset = 0) => [
  ev('load:1', 'start-heat', offset),
  ev('load:1', 'start-vent', offset + 14),
  ev('load:1', 'close-vent', offset + 24),
  ev('load:1', 'pressure-reached', offset + 29),
]

describe('one load, as published', () => {
  it('runs heat → vent 10 → pressure → process 75 → cool → wait 10 → out, keeping every time', () => {
    const s = load([...upToProcess(), ev('load:1', 'process-done', 104), ev('load:1', 'at-zero', 140), ev('load:1', 'open', 150), ev('load:1', 'out', 153)])
    expect(s).toMatchObject({ phase: 'out', heatAt: at(0), ventAt: at(14), pressureReachedAt: at(29), processStartedAt: at(29), processEndedAt: at(104), zeroAt: at(140), outAt: at(153), processedMinutes: 75, stoppedEarly: false, drops: [] })
  })
  it('times the vent for 10 minutes and refuses to close it sooner', () => {
    const s = load([ev('load:1', 'start-heat', 0), ev('load:1', 'start-vent', 14)])
    expect(s.timer).toEqual({ minutes: 10, startedAt: at(14), endsAt: at(24) })
    expect(refusal([ev('load:1', 'start-heat', 0), ev('load:1', 'start-vent', 14), ev('load:1', 'close-vent', 20)])).toMatch(/4 more minutes of venting/)
  })
  it('starts the process timer only when the pressure is reached, and refuses to end it early', () => {
    expect(load(upToProcess()).timer).toEqual({ minutes: 75, startedAt: at(29), endsAt: at(104) })
    expect(refusal([...upToProcess(), ev('load:1', 'process-done', 100)])).toMatch(/4 more minutes to process at 15 psi/)
  })
  it('waits the full 10 minutes with the weight off before opening', () => {
    expect(refusal([...upToProcess(), ev('load:1', 'process-done', 104), ev('load:1', 'at-zero', 140), ev('load:1', 'open', 145)])).toMatch(/5 more minutes of standing/)
  })
  it('never skips a step', () => {
    expect(refusal([ev('load:1', 'start-heat', 0), ev('load:1', 'pressure-reached', 5)])).toMatch(/Load 1 is heating/)
    expect(refusal([ev('load:1', 'out', 0)])).toMatch(/not started/)
  })
})

describe('a pressure drop', () => {
  it('restarts the process from the beginning once the pressure is back, and records the drop', () => {
    const events = [...upToProcess(), ev('load:1', 'pressure-dropped', 69), ev('load:1', 'pressure-reached', 74)]
    const s = load(events)
    expect(s.drops).toEqual([at(69)])
    expect(s.pressureReachedAt).toBe(at(29))
    expect(s.processStartedAt).toBe(at(74))
    expect(s.timer).toEqual({ minutes: 75, startedAt: at(74), endsAt: at(149) })
    // 75 minutes after the first reach is not enough any more.
    expect(refusal([...events, ev('load:1', 'process-done', 104)])).toMatch(/45 more minutes/)
    expect(load([...events, ev('load:1', 'process-done', 149)]).processedMinutes).toBe(75)
  })
  it('stopping early ends the process short and flags it', () => {
    const s = load([...upToProcess(), ev('load:1', 'stop-early', 89)])
    expect(s).toMatchObject({ phase: 'cool', processedMinutes: 60, stoppedEarly: true })
  })
})

describe('two canners and a kitchen', () => {
  it('runs a timer on each canner at once', () => {
    const s = run([...upToProcess(), ev('load:2', 'start-heat', 2), ev('load:2', 'start-vent', 15)])
    expect(s.loads.find(l => l.index === 1)!.timer!.endsAt).toBe(at(104))
    expect(s.loads.find(l => l.index === 2)!.timer!.endsAt).toBe(at(25))
  })
  it('holds one load per canner: the next on it starts once the jars of the one before are out', () => {
    expect(refusal([...upToProcess(), ev('load:3', 'start-heat', 40)])).toMatch(/Load 1 is still in Tall canner/)
  })
  it('pauses and resumes a kitchen task, moving its end', () => {
    const s = run([ev('beans:cook', 'task-start', 0), ev('beans:cook', 'task-pause', 10), ev('beans:cook', 'task-resume', 15)])
    expect(s.tasks[0]).toMatchObject({ status: 'running', pausedMs: 5 * 60_000, endsAt: at(35) })
  })
})

describe('undo', () => {
  it('takes back the last action of a load', () => {
    const events = upToProcess()
    const state = run(events)
    const undone = checkUndo(state, events, 'load:1')
    expect(undone.kind).toBe('pressure-reached')
    const after = dayState(snapshot, [...events, ev('load:1', 'undo', 30, undone.id)])
    expect(after.loads[0]).toMatchObject({ phase: 'pressurise', processStartedAt: null, timer: null })
  })
  it('never takes back "out": the Logbook entry is corrected there', () => {
    const events = [...upToProcess(), ev('load:1', 'process-done', 104), ev('load:1', 'at-zero', 140), ev('load:1', 'open', 150), ev('load:1', 'out', 153)]
    expect(() => checkUndo(run(events), events, 'load:1')).toThrow(/Logbook/)
  })
})
