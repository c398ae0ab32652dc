/**
 * Refusals and warnings.
 *
 * A refusal is thrown when the planner has no published or household-entered basis for what
 * was asked (or the request contradicts itself); the API turns it into HTTP 422. Its message
 * tells a home canner what to change. A warning travels with a plan: `caution` for safety
 * matters the canner must read, `info` for choices the planner made on their behalf.
 */

export class PlanningRefusal extends Error {
  /** Path of the request field at fault, e.g. `lines[0].amount.jars`. */
  readonly field?: string

  constructor(message: string, field?: string) {
    super(message)
    this.name = 'PlanningRefusal'
    if (field !== undefined) this.field = field
  }
}

/** 'caution': a real hazard (untested recipe, gauge test due); 'reminder': the routine steps every load needs; 'info': worth knowing. */
export type WarningLevel = 'caution' | 'reminder' | 'info'

export interface PlanWarning {
  code: string
  level: WarningLevel
  message: string
  field?: string
}

/** A safety point the canner must read. */
export function caution(code: string, message: string, field?: string): PlanWarning {
  return field === undefined ? { code, level: 'caution', message } : { code, level: 'caution', message, field }
}

/** A routine step every load needs (headspace, venting, the altitude's pressure): shown calmly, so cautions stand out. */
export function reminder(code: string, message: string, field?: string): PlanWarning {
  return field === undefined ? { code, level: 'reminder', message } : { code, level: 'reminder', message, field }
}

/** A choice the planner made on the canner's behalf, or a figure worth knowing. */
export function info(code: string, message: string, field?: string): PlanWarning {
  return field === undefined ? { code, level: 'info', message } : { code, level: 'info', message, field }
}

/** Throw unless `value` is a finite number within [min, max] (or above min), whole if asked. */
export function requireNumber(
  value: number,
  field: string,
  what: string,
  limits: { min?: number, max?: number, integer?: boolean, above?: boolean } = {},
): number {
  const { min = 0, max = Infinity, integer = false, above = false } = limits
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new PlanningRefusal(`${what} must be a number.`, field)
  }
  if (above ? value <= min : value < min) {
    throw new PlanningRefusal(`${what} must be ${above ? 'more than' : 'at least'} ${min}; got ${value}.`, field)
  }
  if (value > max) {
    throw new PlanningRefusal(`${what} must be at most ${max}; got ${value}.`, field)
  }
  if (integer && !Number.isInteger(value)) {
    throw new PlanningRefusal(`${what} must be a whole number; got ${value}.`, field)
  }
  return value
}
