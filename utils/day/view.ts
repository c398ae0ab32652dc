/**
 * What the Canning day screen says about a load or a task: the step in words for the lane's
 * gauge, what the countdown counts, and the buttons that may be pressed now. Pure, so the page
 * stays a thin view and the wording is tested.
 */
import type { GaugeType } from '../planning/types'
import { formatWallClock } from '../time'
import type { DayEventKind } from '../vocabulary'
import type { DayLoad, DayTask, LoadPhase, LoadState, TaskState } from './state'

export interface DayAction {
  kind: DayEventKind
  label: string
  tone: 'primary' | 'secondary' | 'danger' | 'ghost'
  /** Pressable only once the step's timer is done. */
  whenTimerDone?: boolean
  /** Ask "are you sure?" first. */
  confirm?: string
}

export interface LoadView {
  title: string
  /** What to do or watch now, in the gauge's words. */
  doing: string
  /** A caution to keep in sight during this step. */
  caution: string | null
  next: string | null
  actions: DayAction[]
}

const zeroWords = (gauge: GaugeType) => (gauge === 'dial' ? 'the dial reads zero' : 'the pressure is gone and the lid lock has dropped')

export function loadView(load: DayLoad, state: LoadState): LoadView {
  const psi = load.pressurePsi
  const gauge = load.gaugeType
  const reached = gauge === 'dial' ? `The dial reads ${psi} psi: start timing` : `The ${psi} psi weight jiggles as the manual says: start timing`
  const views: Record<LoadPhase, Omit<LoadView, 'title'>> = {
    waiting: {
      doing: 'Set the filled jars on the rack in hot water as deep as the manual says (usually 5–8 cm, 2–3 in), lock the lid, leave the vent open and turn on the heat.',
      caution: null,
      next: 'Wait for a steady column of steam from the vent.',
      actions: [{ kind: 'start-heat', label: `Heat on for load ${load.index}`, tone: 'primary' }],
    },
    heat: {
      doing: 'Heating with the vent open. When steam flows from the vent in a steady column, start the vent timer.',
      caution: null,
      next: 'Vent steam for 10 minutes.',
      actions: [{ kind: 'start-vent', label: 'Steam is flowing: vent 10 minutes', tone: 'primary' }],
    },
    vent: {
      doing: 'Let steam flow from the open vent for the full 10 minutes, so no air is left in the canner.',
      caution: 'Air left in the canner lowers the temperature at the same pressure.',
      next: gauge === 'dial' ? 'Close the petcock and bring it up to pressure.' : `Put the ${psi} psi weight on and bring it up to pressure.`,
      actions: [{ kind: 'close-vent', label: gauge === 'dial' ? 'Vent done: petcock closed' : 'Vent done: weight on', tone: 'primary', whenTimerDone: true }],
    },
    pressurise: {
      doing: gauge === 'dial' ? `Coming up to pressure. Start timing only when the dial reads ${psi} psi.` : `Coming up to pressure. Start timing only when the ${psi} psi weight jiggles or rocks as the manual says.`,
      caution: state.drops.length ? `The pressure dropped: the whole ${load.processMinutes} minutes are timed again from the moment it is back.` : null,
      next: `Process ${load.processMinutes} minutes at ${psi} psi.`,
      actions: [{ kind: 'pressure-reached', label: reached, tone: 'primary' }],
    },
    process: {
      doing: `Processing at ${psi} psi. Keep the heat so the ${gauge === 'dial' ? 'dial stays at or just above' : 'weight keeps jiggling at'} ${psi} psi.`,
      caution: `If the pressure falls below ${psi} psi at any time, press "Pressure dropped": bring it back up and the ${load.processMinutes} minutes start over.`,
      next: `Turn off the heat and let it cool until ${zeroWords(gauge)}.`,
      actions: [
        { kind: 'process-done', label: `${load.processMinutes} minutes done: heat off`, tone: 'primary', whenTimerDone: true },
        { kind: 'pressure-dropped', label: `Pressure dropped below ${psi} psi`, tone: 'danger' },
        { kind: 'stop-early', label: 'Stopped early', tone: 'ghost', confirm: `Stop load ${load.index} before its ${load.processMinutes} minutes? Its jars will not be safe for the shelf: you will refrigerate them or reprocess them within 24 hours.` },
      ],
    },
    cool: {
      doing: `Heat off. Let the canner cool on its own until ${zeroWords(gauge)}.`,
      caution: 'Never force-cool: no cold water, no opening the vent or lifting the weight early.',
      next: gauge === 'dial' ? 'Open the petcock (or take the weight off) and wait 10 minutes.' : 'Take the weight off and wait 10 minutes.',
      actions: [{ kind: 'at-zero', label: gauge === 'dial' ? 'The dial reads zero: petcock open' : 'Pressure gone: weight off', tone: 'primary' }],
    },
    wait: {
      doing: 'Wait 10 minutes with the weight off or the petcock open before unfastening the lid.',
      caution: null,
      next: 'Open the lid away from you and lift the jars out upright.',
      actions: [{ kind: 'open', label: '10 minutes done: open the lid', tone: 'primary', whenTimerDone: true }],
    },
    unload: {
      doing: 'Lift the jars out upright onto a towel, 2.5 cm (1 in) apart, away from drafts. Do not tighten the bands.',
      caution: null,
      next: 'Leave them undisturbed 12–24 hours, then check the seals.',
      actions: [{ kind: 'out', label: 'Jars are out', tone: 'primary' }],
    },
    out: {
      doing: 'Out of the canner and in the Logbook. Leave the jars undisturbed 12–24 hours, then check the seals.',
      caution: null,
      next: null,
      actions: [],
    },
  }
  return { title: `Load ${load.index}`, ...views[state.phase] }
}

/** The buttons of a kitchen task in its state. */
export function taskActions(task: DayTask, state: TaskState): DayAction[] {
  switch (state.status) {
    case 'waiting': return [{ kind: 'task-start', label: task.minutes >= 60 ? 'Start' : `Start ${task.minutes} min`, tone: 'secondary' }]
    case 'running': return [{ kind: 'task-done', label: 'Done', tone: 'primary' }, { kind: 'task-pause', label: 'Pause', tone: 'ghost' }]
    case 'paused': return [{ kind: 'task-resume', label: 'Resume', tone: 'primary' }, { kind: 'task-done', label: 'Done', tone: 'ghost' }]
    case 'done': return []
  }
}

/**
 * Milliseconds left of a timer of `minutes` ending at `endsAt`, as of `now` (the server's time as
 * this device reckons it). Never more than the timer's minutes: the reckoning can trail the
 * server's clock by the network's delay, and "10:01 left of 10 min" would be wrong.
 */
export function msLeft(endsAt: string, minutes: number, now: number): number {
  return Math.min(Date.parse(endsAt) - now, minutes * 60_000)
}

/**
 * What to do first, from the day's first preparation step: "Start soaking by 7:15 PM on
 * Friday", with the weekday when it falls before the canning day.
 */
export function firstThingText(step: { start: string, isSoak: boolean, isQuick: boolean }, canningStart: string): { what: string, by: string } {
  const what = step.isSoak ? 'Start soaking' : step.isQuick ? 'Start the quick soak' : 'Start preparing'
  return { what, by: formatWallClock(step.start, step.start.slice(0, 10) !== canningStart.slice(0, 10)) }
}

/** "1:05:09", "7:32", "0:04": a countdown or time elapsed, from milliseconds. */
export function clockText(msLeft: number): string {
  const total = Math.max(0, Math.ceil(msLeft / 1000))
  const h = Math.floor(total / 3600)
  const m = Math.floor((total % 3600) / 60)
  const s = total % 60
  return `${h ? `${h}:` : ''}${h ? String(m).padStart(2, '0') : m}:${String(s).padStart(2, '0')}`
}
