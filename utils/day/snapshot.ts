/** The day as planned, taken from a computed plan when the canning day starts. */
import { KITCHEN_LANE, type LoadStepName } from '../planning/schedule'
import type { PlanResult } from '../planning/results'
import type { DaySnapshot } from './state'

/** A kitchen task's key: "fill:2" for a load's jars, "<recipe>:<step>" for a recipe's preparation. */
const taskKey = (step: { load: number, step: string, recipeId?: string }) =>
  step.step === 'fill' ? `fill:${step.load}` : `${step.recipeId ?? 'prep'}:${step.step}`

export function daySnapshot(planName: string, result: Pick<PlanResult, 'loads' | 'schedule'>, cannerNames: Readonly<Record<string, string>>): DaySnapshot {
  const { schedule } = result
  return {
    planName,
    startAt: schedule.startAt,
    endAt: schedule.endAt,
    prepStartAt: schedule.prepStartAt,
    loads: result.loads.map(l => ({
      index: l.index,
      cannerId: l.cannerId,
      cannerName: cannerNames[l.cannerId] ?? 'Canner',
      gaugeType: l.gaugeType,
      pressurePsi: l.pressurePsi,
      processMinutes: l.processMinutes,
      jars: l.jars,
      jarSizeId: l.jarSizeId,
      contents: l.contents.map(c => ({ lineIndex: c.lineIndex, recipeId: c.recipeId, jars: c.jars, label: c.label })),
    })),
    tasks: schedule.steps.filter(s => s.lane === KITCHEN_LANE).map(s => ({
      key: taskKey(s),
      label: s.label,
      minutes: s.minutes,
      load: s.load,
      plannedStart: s.start,
      plannedEnd: s.end,
      ...(s.earliestStart ? { earliestStart: s.earliestStart } : {}),
    })),
    planned: schedule.steps.filter(s => s.lane !== KITCHEN_LANE)
      .map(s => ({ load: s.load, step: s.step as LoadStepName, start: s.start, end: s.end, minutes: s.minutes, label: s.label })),
  }
}
