import { describe, expect, it } from 'vitest'
import { buildLoads, spreadEvenly, type CannerFit, type LoadLine } from '~~/utils/planning'

const line = (lineIndex: number, jars: number, processMinutes: number, over: Partial<LoadLine> = {}): LoadLine => ({
  lineIndex, recipeId: `r${lineIndex}`, jarSizeId: 'pint', jars, processMinutes, psiByCanner: { a: 10, b: 10 }, ...over,
})
const nine: CannerFit = { cannerId: 'a', perLayer: 9, layers: 1 }
const fitOne = (perLayer: number, layers = 1) => (cannerId: string): CannerFit => ({ cannerId, perLayer, layers })
const minutes = () => 150

describe('spreading jars evenly over loads', () => {
  it.each([
    [10, [9, 9], [5, 5]],
    [17, [9, 9], [9, 8]],
    [19, [9, 9, 9], [7, 6, 6]],
    [18, [9, 9], [9, 9]],
    // a small canner beside a big one: the small one is full, the big one takes the rest
    [10, [7, 4], [6, 4]],
    [11, [7, 4], [7, 4]],
  ])('%i jars over capacities %j → %j', (total, caps, expected) => {
    expect(spreadEvenly(total, caps)).toEqual(expected)
  })
})

describe('loads on one canner', () => {
  it('18 pints in a 9-pint canner: 2 loads of 9', () => {
    const loads = buildLoads([line(0, 18, 75)], ['a'], () => nine, minutes)
    expect(loads.map(l => l.jars)).toEqual([9, 9])
    expect(loads.every(l => l.processMinutes === 75 && l.pressurePsi === 10 && l.cannerId === 'a')).toBe(true)
  })
  it('20 pints: 3 loads of 7, 7 and 6 rather than 9, 9 and a near-empty 2', () => {
    expect(buildLoads([line(0, 20, 75)], ['a'], () => nine, minutes).map(l => l.jars)).toEqual([7, 7, 6])
  })
  it('two layers: 14 jars in a 9-per-layer, 2-layer canner fill the bottom layer first', () => {
    const [load] = buildLoads([line(0, 14, 75)], ['a'], fitOne(9, 2), minutes)
    expect(load).toMatchObject({ jars: 14, layers: 2, layersAvailable: 2, capacity: 18, jarsByLayer: [9, 5] })
  })
})

describe('sharing loads', () => {
  it('same jar size and pressure share a load, timed for the longest and saying so', () => {
    const loads = buildLoads([line(0, 4, 60), line(1, 5, 75)], ['a'], () => nine, minutes)
    expect(loads).toHaveLength(1)
    expect(loads[0]).toMatchObject({ jars: 9, processMinutes: 75, recipeIds: ['r1', 'r0'] })
    expect(loads[0]!.note).toMatch(/timed for the longest, 75 min/)
  })
  it('the longest-time line is loaded first, so only the boundary load mixes', () => {
    const loads = buildLoads([line(0, 9, 60), line(1, 9, 75)], ['a'], () => nine, minutes)
    expect(loads.map(l => [l.processMinutes, l.note === null])).toEqual([[75, true], [60, true]])
  })
  it('different pressure or jar size never share a load', () => {
    const psi = buildLoads([line(0, 4, 75), line(1, 4, 75, { psiByCanner: { a: 15 } })], ['a'], () => nine, minutes)
    expect(psi.map(l => [l.jars, l.pressurePsi])).toEqual([[4, 10], [4, 15]])
    const size = buildLoads([line(0, 4, 75), line(1, 4, 90, { jarSizeId: 'quart' })], ['a'], () => nine, minutes)
    expect(size.map(l => l.jarSizeId)).toEqual(['pint', 'quart'])
  })
})

describe('two canners side by side', () => {
  it('18 pints: one load on each canner', () => {
    const loads = buildLoads([line(0, 18, 75)], ['a', 'b'], fitOne(9), minutes)
    expect(loads.map(l => [l.cannerId, l.jars])).toEqual([['a', 9], ['b', 9]])
  })
  it('8 pints fit one load: the second canner stays cold', () => {
    expect(buildLoads([line(0, 8, 75)], ['a', 'b'], fitOne(9), minutes).map(l => l.cannerId)).toEqual(['a'])
  })
  it('loads keep alternating across groups', () => {
    const loads = buildLoads([line(0, 9, 75), line(1, 7, 90, { jarSizeId: 'quart' })], ['a', 'b'], fitOne(9), minutes)
    expect(loads.map(l => l.cannerId)).toEqual(['a', 'b'])
  })
  it('a canner that cannot hold the jar is skipped', () => {
    const fit = (id: string): CannerFit => ({ cannerId: id, perLayer: id === 'a' ? 0 : 9, layers: 1 })
    expect(buildLoads([line(0, 12, 75)], ['a', 'b'], fit, minutes).map(l => [l.cannerId, l.jars])).toEqual([['b', 6], ['b', 6]])
  })
})
