/**
 * The seal check: cool jars 12–24 h, then test the seals (USDA CG "Testing jar seals",
 * MSU-PFS 01600951); reprocess an unsealed jar within 24 h (CG "Reprocessing unsealed jars").
 */
import type { SealCheckStatus } from '../vocabulary'

export const SEAL_CHECK_AFTER_HOURS = 12
export const SEAL_CHECK_BY_HOURS = 24
export const REPROCESS_WITHIN_HOURS = 24

const HOUR_MS = 3_600_000

export interface SealWindow {
  dueAt: Date
  byAt: Date
  reprocessBy: Date
  status: SealCheckStatus
}

/** Seal check due 12 h after a load comes out and expected by 24 h; reprocessing must start within 24 h. */
export function sealWindow(endedAt: Date, now: Date): SealWindow {
  const dueAt = new Date(endedAt.getTime() + SEAL_CHECK_AFTER_HOURS * HOUR_MS)
  const byAt = new Date(endedAt.getTime() + SEAL_CHECK_BY_HOURS * HOUR_MS)
  const reprocessBy = new Date(endedAt.getTime() + REPROCESS_WITHIN_HOURS * HOUR_MS)
  const status: SealCheckStatus = now < dueAt ? 'cooling' : now <= byAt ? 'due' : 'overdue'
  return { dueAt, byAt, reprocessBy, status }
}

export interface SealRate {
  sealed: number
  unsealed: number
  /** sealed / (sealed + unsealed), or null before any check. */
  rate: number | null
}

export function sealRate(lines: ReadonlyArray<{ sealed: number | null, unsealed: number | null }>): SealRate {
  const sealed = lines.reduce((s, l) => s + (l.sealed ?? 0), 0)
  const unsealed = lines.reduce((s, l) => s + (l.unsealed ?? 0), 0)
  return { sealed, unsealed, rate: sealed + unsealed > 0 ? sealed / (sealed + unsealed) : null }
}

/** Seal rates grouped by a key (recipe, canner …), largest groups first. */
export function sealRatesBy<T extends { sealed: number | null, unsealed: number | null }>(
  lines: readonly T[],
  key: (line: T) => { id: string, name: string },
): Array<SealRate & { id: string, name: string }> {
  const groups = new Map<string, { name: string, lines: T[] }>()
  for (const line of lines) {
    if (line.sealed === null && line.unsealed === null) continue
    const k = key(line)
    const group = groups.get(k.id) ?? { name: k.name, lines: [] }
    group.lines.push(line)
    groups.set(k.id, group)
  }
  return [...groups.entries()]
    .map(([id, g]) => ({ id, name: g.name, ...sealRate(g.lines) }))
    .sort((a, b) => (b.sealed + b.unsealed) - (a.sealed + a.unsealed) || a.name.localeCompare(b.name))
}
