import { describe, expect, it } from 'vitest'
import {
  addMonths, bestByDate, bestByStatus, fifo, jarsPerMonthByProduct, lastMonths, loadCode, loadShortfall,
  monthKey, requiredProcess, sealRate, sealWindow, stockSeries, usedPerMonth,
} from '~~/utils/after'
import type { JarSize, Recipe } from '~~/utils/planning/types'
import { fromLocalInput } from '~~/utils/time'

const H = 3_600_000
/** Months are the household's: counted in its own time zone, never the test machine's. */
const ZONE = 'America/Denver'
/** Noon (or `hour`) on a calendar day in ZONE; `month` counts from 0 like Date's. */
const inZone = (year: number, month: number, day: number, hour = 12) =>
  new Date(fromLocalInput(`${year}-${String(month + 1).padStart(2, '0')}-${String(day).padStart(2, '0')}T${String(hour).padStart(2, '0')}:00`, ZONE))

describe('the seal-check window', () => {
  // USDA Complete Guide, "Cooling jars" / "Testing jar seals" (MSU-PFS 01600951): cool 12–24 h, then test
  const out = new Date('2026-10-04T15:00:00Z')
  it('is cooling before 12 h, due from 12 h to 24 h, overdue after', () => {
    expect(sealWindow(out, new Date(out.getTime() + 11.9 * H)).status).toBe('cooling')
    expect(sealWindow(out, new Date(out.getTime() + 12 * H)).status).toBe('due')
    expect(sealWindow(out, new Date(out.getTime() + 24 * H)).status).toBe('due')
    expect(sealWindow(out, new Date(out.getTime() + 24 * H + 1)).status).toBe('overdue')
  })
  // CG "Reprocessing unsealed jars" (MSU-PFS 01600593): reprocess within 24 h
  it('allows reprocessing until 24 h after unloading', () => {
    expect(sealWindow(out, out).reprocessBy.toISOString()).toBe('2026-10-05T15:00:00.000Z')
  })
})

describe('best-by dates', () => {
  // OSU EM 9435: use within a year → 12 months after canning
  it('adds 12 months by default', () => {
    expect(bestByDate('2026-10-04')).toBe('2027-10-04')
    expect(bestByDate('2026-10-04', 18)).toBe('2028-04-04')
  })
  it('keeps to the last day of a shorter month', () => {
    expect(addMonths('2027-01-31', 1)).toBe('2027-02-28')
    expect(addMonths('2028-01-31', 1)).toBe('2028-02-29')
    expect(bestByDate('2028-02-29')).toBe('2029-02-28')
  })
  it('warns within 30 days and after the date', () => {
    expect(bestByStatus('2026-12-31', '2026-12-01')).toBe('near') // 30 days ahead
    expect(bestByStatus('2027-01-01', '2026-12-01')).toBe('ok') // 31 days ahead
    expect(bestByStatus('2026-12-01', '2026-12-01')).toBe('near')
    expect(bestByStatus('2026-11-30', '2026-12-01')).toBe('past')
  })
  it('orders the Shelf oldest first', () => {
    const lot = (cannedOn: string, product: string, loadCode = '') => ({ cannedOn, bestBy: bestByDate(cannedOn), loadCode, product, jarSizeId: 'pint-regular' })
    const order = fifo([lot('2026-09-01', 'B'), lot('2025-11-20', 'Z'), lot('2026-09-01', 'A'), lot('2026-03-03', 'M')]).map(l => l.product)
    expect(order).toEqual(['Z', 'M', 'A', 'B'])
  })
})

describe('what a load needed', () => {
  const pint: JarSize = { id: 'pint-regular', key: 'pint', name: 'Pint', capacityMl: 473, outsideDiameterMm: 76, heightMm: 135, mouth: 'regular' }
  const quart: JarSize = { id: 'quart-regular', key: 'quart', name: 'Quart', capacityMl: 946, outsideDiameterMm: 89, heightMm: 175, mouth: 'regular' }
  // USDA CG Guide 4 "Beans or peas—shelled, dried": pints 75, quarts 90; Table 1 dial, Table 2 weighted
  const bands = [
    { gaugeType: 'dial' as const, minFt: 0, maxFt: 2000, psi: 11 }, { gaugeType: 'dial' as const, minFt: 2001, maxFt: 4000, psi: 12 },
    { gaugeType: 'dial' as const, minFt: 4001, maxFt: 6000, psi: 13 }, { gaugeType: 'dial' as const, minFt: 6001, maxFt: 8000, psi: 14 },
    { gaugeType: 'weighted' as const, minFt: 0, maxFt: 1000, psi: 10 }, { gaugeType: 'weighted' as const, minFt: 1001, maxFt: 30000, psi: 15 },
  ]
  const beans: Recipe = { id: 'beans', name: 'Dried beans', status: 'tested', packStyle: 'hot', ingredientId: 'pinto', headspaceMm: 25.4, solidsFillFraction: 1, fillBasis: 'published', perJar: [], processMinutes: [{ jarKey: 'pint', minutes: 75 }, { jarKey: 'quart', minutes: 90 }], pressureBands: bands, source: 'USDA CG Guide 4' }
  const baked: Recipe = { ...beans, id: 'baked', name: 'Baked beans', processMinutes: [{ jarKey: 'pint', minutes: 65 }, { jarKey: 'quart', minutes: 75 }] }

  it('takes the longest time of a mixed load and the band for the gauge and altitude', () => {
    expect(requiredProcess([{ recipe: beans, jarSize: pint }, { recipe: baked, jarSize: pint }], [pint, quart], 'weighted', 2350)).toMatchObject({ psi: 15, minutes: 75 })
    expect(requiredProcess([{ recipe: baked, jarSize: quart }], [pint, quart], 'dial', 500)).toMatchObject({ psi: 11, minutes: 75 })
  })
  it('refuses above the highest dial band (no published value)', () => {
    expect(() => requiredProcess([{ recipe: beans, jarSize: pint }], [pint], 'dial', 9000)).toThrow(/No published dial-gauge pressure/)
  })
  it('flags less pressure or fewer minutes, never more', () => {
    expect(loadShortfall({ psi: 15, minutes: 75 }, { psi: 15, minutes: 75 })).toBeNull()
    expect(loadShortfall({ psi: 16, minutes: 80 }, { psi: 15, minutes: 75 })).toBeNull()
    const under = loadShortfall({ psi: 12, minutes: 70 }, { psi: 15, minutes: 75 })!
    expect(under.kind).toBe('under-processed')
    expect(under.message).toMatch(/12 psi instead of 15 psi and 70 min instead of 75 min/)
    expect(loadShortfall({ psi: 15, minutes: 75 }, null, 'no table')!.kind).toBe('no-published-process')
  })
  it('numbers loads L-001 onwards', () => {
    expect(loadCode(7)).toBe('L-007')
    expect(loadCode(1234)).toBe('L-1234')
  })
})

describe('seal rates and stock over time', () => {
  it('counts sealed out of checked jars', () => {
    expect(sealRate([{ sealed: 17, unsealed: 1 }, { sealed: 7, unsealed: 0 }, { sealed: null, unsealed: null }])).toEqual({ sealed: 24, unsealed: 1, rate: 24 / 25 })
    expect(sealRate([]).rate).toBeNull()
  })
  const now = inZone(2026, 11, 15, 12)
  it('puts an instant in the month it was in the household\'s time zone', () => {
    // IANA tz database: Denver keeps Mountain Standard Time (UTC−7) in winter, so 03:00 UTC on
    // 1 December is 20:00 on 30 November there; in UTC it is already December.
    const lateEvening = new Date('2026-12-01T03:00:00Z')
    expect(monthKey(lateEvening, ZONE)).toBe('2026-11')
    expect(monthKey(lateEvening, 'UTC')).toBe('2026-12')
    expect(usedPerMonth([{ at: lateEvening, jars: 2 }], lateEvening, ZONE, 2)).toEqual([{ month: '2026-10', jars: 0 }, { month: '2026-11', jars: 2 }])
  })
  it('lists the last twelve months, oldest first', () => {
    const months = lastMonths(now, ZONE, 12)
    expect(months[0]).toBe('2026-01')
    expect(months.at(-1)).toBe('2026-12')
  })
  it('adds shelved jars and takes away jars used, month by month', () => {
    const added = [{ at: inZone(2026, 8, 10), jars: 18 }, { at: inZone(2026, 10, 2), jars: 7 }]
    const taken = [{ at: inZone(2026, 9, 5), jars: 4 }, { at: inZone(2026, 11, 1), jars: 2 }]
    const series = stockSeries(added, taken, now, ZONE, 4)
    expect(series).toEqual([{ month: '2026-09', jars: 18 }, { month: '2026-10', jars: 14 }, { month: '2026-11', jars: 21 }, { month: '2026-12', jars: 19 }])
  })
  it('gives jars per month by product since the first take-off', () => {
    const e = (month: number, jars: number, product: string) => ({ at: inZone(2026, month, 10), jars, key: product, product, recipeId: null, jarSizeId: 'pint-regular' })
    const rows = jarsPerMonthByProduct([e(9, 4, 'Pinto'), e(10, 6, 'Pinto'), e(11, 2, 'Pinto'), e(11, 3, 'Black')], now, ZONE)
    // October to December: three months
    expect(rows).toEqual([
      expect.objectContaining({ product: 'Pinto', jars: 12, months: 3, jarsPerMonth: 4 }),
      expect.objectContaining({ product: 'Black', jars: 3, months: 3, jarsPerMonth: 1 }),
    ])
  })
})
