/**
 * The canning day as it happens: which step each load and each kitchen task is on, since when,
 * and the timers that run, worked out from the day's events (who pressed what, when). Pure and
 * shared: the server checks every new event with it before storing it, and the page shows the
 * same state, also for events it holds while offline.
 *
 * A load goes through the published sequence (CG "Using pressure canners"; reference §2): heat
 * until steam flows, vent 10 minutes (timed), close the vent and bring up to pressure, process
 * — timed only from the moment the gauge or weight shows the pressure; if the pressure drops
 * below it, the canner is brought back up and the whole time starts again — then cool naturally
 * to zero (never forced), take the weight off or open the petcock and wait 10 minutes (timed),
 * open and take the jars out. A timed step cannot be ended before its time; "stopped early"
 * ends a process short, and the load is flagged. A canner holds one load: the next load on it
 * starts once the jars of the one before are out.
 */
import type { LoadStepName } from '../planning/schedule'
import type { GaugeType } from '../planning/types'
import type { DayEventKind } from '../vocabulary'

/** Vent 10 minutes; wait 10 minutes after zero with the weight off (CG "Using pressure canners"). */
export const VENT_MINUTES = 10
export const WAIT_AFTER_ZERO_MINUTES = 10
/** An action kept offline may say when it happened: at most this long ago. */
export const OFFLINE_LIMIT_MS = 12 * 3_600_000

export class DayRefusal extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'DayRefusal'
  }
}

export interface DayLoad {
  index: number
  cannerId: string
  cannerName: string
  gaugeType: GaugeType
  pressurePsi: number
  processMinutes: number
  jars: number
  jarSizeId: string
  contents: Array<{ lineIndex: number, recipeId: string, jars: number, label: string }>
}

/** A task at the counter: a recipe's preparation, or filling a load's jars. */
export interface DayTask {
  key: string
  label: string
  minutes: number
  /** The load it fills, or 0 for preparation. */
  load: number
  plannedStart: string
  plannedEnd: string
  earliestStart?: string
}

/** What the day was planned as, frozen when it starts, so a later change to the plan does not move it. */
export interface DaySnapshot {
  planName: string
  startAt: string
  endAt: string
  prepStartAt: string
  loads: DayLoad[]
  tasks: DayTask[]
  /** The planned minutes of each load step, by load and step, for the timeline. */
  planned: Array<{ load: number, step: LoadStepName, start: string, end: string, minutes: number, label: string }>
}

export interface DayEvent {
  id: string
  /** "load:3" or a task key. */
  target: string
  kind: DayEventKind
  at: string
  by: string | null
  /** An undo names the event it takes back. */
  undoes?: string | null
}

export type LoadPhase = LoadStepName | 'waiting' | 'out'

export interface LoadState {
  index: number
  phase: LoadPhase
  /** When the current step began. */
  since: string | null
  /** The countdown of a timed step (vent, process, wait after zero). */
  timer: { minutes: number, startedAt: string, endsAt: string } | null
  heatAt: string | null
  ventAt: string | null
  pressureReachedAt: string | null
  processStartedAt: string | null
  processEndedAt: string | null
  zeroAt: string | null
  outAt: string | null
  drops: string[]
  /** Minutes processed at pressure without a drop, once the process step has ended. */
  processedMinutes: number | null
  stoppedEarly: boolean
  /** The last event that still counts, for undo. */
  lastEventId: string | null
}

export interface TaskState {
  key: string
  status: 'waiting' | 'running' | 'paused' | 'done'
  startedAt: string | null
  pausedAt: string | null
  /** Paused time so far, in ms. */
  pausedMs: number
  doneAt: string | null
  /** When the task's time is up, pauses counted; null unless running. */
  endsAt: string | null
  lastEventId: string | null
}

export interface DayState {
  loads: LoadState[]
  tasks: TaskState[]
}

const ms = (iso: string) => Date.parse(iso)
const plus = (iso: string, minutes: number) => new Date(ms(iso) + minutes * 60_000).toISOString()
const minutesLeft = (endsAt: string, at: string) => Math.ceil((ms(endsAt) - ms(at)) / 60_000)

function freshLoad(index: number): LoadState {
  return {
    index, phase: 'waiting', since: null, timer: null, heatAt: null, ventAt: null, pressureReachedAt: null,
    processStartedAt: null, processEndedAt: null, zeroAt: null, outAt: null, drops: [], processedMinutes: null, stoppedEarly: false, lastEventId: null,
  }
}
function freshTask(key: string): TaskState {
  return { key, status: 'waiting', startedAt: null, pausedAt: null, pausedMs: 0, doneAt: null, endsAt: null, lastEventId: null }
}

/** Which load kinds move a load from which step, and to which. */
const LOAD_MOVES: Partial<Record<DayEventKind, { from: LoadPhase[], to: LoadPhase }>> = {
  'start-heat': { from: ['waiting'], to: 'heat' },
  'start-vent': { from: ['heat'], to: 'vent' },
  'close-vent': { from: ['vent'], to: 'pressurise' },
  'pressure-reached': { from: ['pressurise'], to: 'process' },
  'pressure-dropped': { from: ['process'], to: 'pressurise' },
  'process-done': { from: ['process'], to: 'cool' },
  'stop-early': { from: ['process'], to: 'cool' },
  'at-zero': { from: ['cool'], to: 'wait' },
  'open': { from: ['wait'], to: 'unload' },
  'out': { from: ['unload'], to: 'out' },
}
const TASK_MOVES: Partial<Record<DayEventKind, { from: TaskState['status'][], to: TaskState['status'] }>> = {
  'task-start': { from: ['waiting'], to: 'running' },
  'task-pause': { from: ['running'], to: 'paused' },
  'task-resume': { from: ['paused'], to: 'running' },
  'task-done': { from: ['running', 'paused'], to: 'done' },
}

const PHASE_WORDS: Record<LoadPhase, string> = {
  waiting: 'not started', heat: 'heating', vent: 'venting', pressurise: 'coming up to pressure', process: 'processing',
  cool: 'cooling to zero', wait: 'standing with the weight off', unload: 'being unloaded', out: 'out of the canner',
}

function applyLoad(snapshot: DaySnapshot, state: DayState, event: DayEvent): void {
  const index = Number(event.target.slice('load:'.length))
  const load = snapshot.loads.find(l => l.index === index)
  const current = state.loads.find(l => l.index === index)
  if (!load || !current) throw new DayRefusal(`This day has no load ${event.target.slice(5)}.`)
  const move = LOAD_MOVES[event.kind]
  if (!move) throw new DayRefusal('That action is not one a load takes.')
  if (!move.from.includes(current.phase)) {
    throw new DayRefusal(`Load ${index} is ${PHASE_WORDS[current.phase]}; that step comes at another time.`)
  }
  if (current.since && ms(event.at) < ms(current.since)) throw new DayRefusal(`Load ${index}'s step started later than that time; reload the page.`)
  if (current.timer && event.kind !== 'pressure-dropped' && event.kind !== 'stop-early' && ms(event.at) < ms(current.timer.endsAt)) {
    const left = minutesLeft(current.timer.endsAt, event.at)
    throw new DayRefusal(current.phase === 'process'
      ? `Load ${index} has ${left} more minute${left === 1 ? '' : 's'} to process at ${load.pressurePsi} psi. If the pressure fell below it, choose "Pressure dropped"; if you must stop now, choose "Stopped early".`
      : `Load ${index} has ${left} more minute${left === 1 ? '' : 's'} of ${current.phase === 'vent' ? 'venting' : 'standing with the weight off'}: the full 10 minutes are part of the process.`)
  }
  if (event.kind === 'start-heat') {
    const before = snapshot.loads.filter(l => l.cannerId === load.cannerId && l.index < index)
      .find(l => state.loads.find(s => s.index === l.index)!.phase !== 'out')
    if (before) throw new DayRefusal(`Load ${before.index} is still in ${load.cannerName}: take its jars out before starting load ${index}.`)
  }
  const at = event.at
  current.phase = move.to
  current.since = at
  current.timer = null
  current.lastEventId = event.id
  switch (event.kind) {
    case 'start-heat': current.heatAt = at; break
    case 'start-vent':
      current.ventAt = at
      current.timer = { minutes: VENT_MINUTES, startedAt: at, endsAt: plus(at, VENT_MINUTES) }
      break
    case 'pressure-reached':
      current.pressureReachedAt ??= at
      current.processStartedAt = at
      current.timer = { minutes: load.processMinutes, startedAt: at, endsAt: plus(at, load.processMinutes) }
      break
    case 'pressure-dropped':
      // The published rule: bring it back up to pressure and time the whole process again.
      current.drops.push(at)
      current.processStartedAt = null
      break
    case 'process-done':
    case 'stop-early':
      current.processEndedAt = at
      current.processedMinutes = Math.floor((ms(at) - ms(current.processStartedAt!)) / 60_000)
      current.stoppedEarly = event.kind === 'stop-early' && current.processedMinutes < load.processMinutes
      break
    case 'at-zero':
      current.zeroAt = at
      current.timer = { minutes: WAIT_AFTER_ZERO_MINUTES, startedAt: at, endsAt: plus(at, WAIT_AFTER_ZERO_MINUTES) }
      break
    case 'out': current.outAt = at; break
  }
}

function applyTask(snapshot: DaySnapshot, state: DayState, event: DayEvent): void {
  const task = snapshot.tasks.find(t => t.key === event.target)
  const current = state.tasks.find(t => t.key === event.target)
  if (!task || !current) throw new DayRefusal('This day has no such task.')
  const move = TASK_MOVES[event.kind]
  if (!move) throw new DayRefusal('That action is not one a kitchen task takes.')
  if (!move.from.includes(current.status)) throw new DayRefusal(`"${task.label}" is ${current.status}; that action comes at another time.`)
  const at = event.at
  if (event.kind === 'task-start') current.startedAt = at
  if (event.kind === 'task-pause') current.pausedAt = at
  if (event.kind === 'task-resume' && current.pausedAt) {
    current.pausedMs += Math.max(0, ms(at) - ms(current.pausedAt))
    current.pausedAt = null
  }
  if (event.kind === 'task-done') {
    current.doneAt = at
    current.pausedAt = null
  }
  current.status = move.to
  current.endsAt = current.status === 'running' ? new Date(ms(current.startedAt!) + current.pausedMs + task.minutes * 60_000).toISOString() : null
  current.lastEventId = event.id
}

/** The state after one more event; refuses (DayRefusal) one that does not fit the sequence. */
export function applyEvent(snapshot: DaySnapshot, state: DayState, event: DayEvent): DayState {
  // Plain data only (a page's reactive copy cannot be structured-cloned).
  const next: DayState = JSON.parse(JSON.stringify(state))
  if (event.target.startsWith('load:')) applyLoad(snapshot, next, event)
  else applyTask(snapshot, next, event)
  return next
}

/** The events that still count: in order, without the undone ones and the undos. */
export function effectiveEvents(events: readonly DayEvent[]): DayEvent[] {
  const undone = new Set(events.filter(e => e.kind === 'undo').map(e => e.undoes))
  return events.filter(e => e.kind !== 'undo' && !undone.has(e.id))
}

/** The day's state from all its events, in the order they were stored. */
export function dayState(snapshot: DaySnapshot, events: readonly DayEvent[]): DayState {
  let state: DayState = { loads: snapshot.loads.map(l => freshLoad(l.index)), tasks: snapshot.tasks.map(t => freshTask(t.key)) }
  for (const event of effectiveEvents(events)) state = applyEvent(snapshot, state, event)
  return state
}

/**
 * Checks an undo: it takes back the last event still counting for its target, unless that
 * event took a load out (its Logbook entry is written then: correct it in the Logbook).
 */
export function checkUndo(state: DayState, events: readonly DayEvent[], target: string): DayEvent {
  const last = target.startsWith('load:')
    ? state.loads.find(l => `load:${l.index}` === target)?.lastEventId
    : state.tasks.find(t => t.key === target)?.lastEventId
  const event = events.find(e => e.id === last)
  if (!event) throw new DayRefusal('There is nothing to undo here.')
  if (event.kind === 'out') throw new DayRefusal('The jars are out and the load is in the Logbook; correct it there.')
  return event
}
