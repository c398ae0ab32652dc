import convert from 'convert-units'
import { describe, expect, it } from 'vitest'
import {
  GRAMS_PER_LB, ML_PER_CUP, ML_PER_QUART, ML_PER_TBSP, ML_PER_TSP, SALT_GRAMS_PER_TSP,
  formatMass, formatSalt, formatVolume, kitchenMeasure, mlToCups,
} from '~~/utils/planning'

// Exact US customary definitions: NIST (canning reference §7 and §10 #23).
const NIST = { cup: 236.5882365, tsp: 4.92892159375, Tbsp: 14.78676478125, pint: 473.176473, quart: 946.352946, lb: 453.59237 }

describe('unit factors (NIST US customary definitions, reference §7) against convert-units', () => {
  // convert-units 2.3.4 uses rounded anchors (1 L = 33.8140226 fl oz; 1 lb = 453.592 g), so
  // we allow one part in a million: far below any kitchen measure.
  const close = (actual: number, exact: number) => expect(Math.abs(actual / exact - 1)).toBeLessThan(1e-6)
  it.each([
    ['cup', 'cup', NIST.cup],
    ['tsp', 'tsp', NIST.tsp],
    ['Tbs', 'Tbsp', NIST.Tbsp],
    ['pnt', 'pint', NIST.pint],
    ['qt', 'quart', NIST.quart],
  ] as const)('1 %s (%s) in mL matches NIST', (unit, _name, exact) => {
    close(convert(1).from(unit).to('ml'), exact)
  })
  it('1 lb in g matches NIST (453.59237 g)', () => close(convert(1).from('lb').to('g'), NIST.lb))
  it.each([
    ['ML_PER_CUP', ML_PER_CUP, NIST.cup],
    ['ML_PER_TSP', ML_PER_TSP, NIST.tsp],
    ['ML_PER_TBSP', ML_PER_TBSP, NIST.Tbsp],
    ['ML_PER_QUART', ML_PER_QUART, NIST.quart],
    ['GRAMS_PER_LB', GRAMS_PER_LB, NIST.lb],
  ] as const)('the planner\'s %s matches the NIST definition', (_name, constant, exact) => {
    close(constant, exact)
  })
  it('kitchen ratios hold: 3 tsp = 1 Tbsp, 16 Tbsp = 1 cup, 2 cups = 1 pint (NIST)', () => {
    expect(ML_PER_TBSP / ML_PER_TSP).toBeCloseTo(3, 9)
    expect(ML_PER_CUP / ML_PER_TBSP).toBeCloseTo(16, 9)
    expect(ML_PER_QUART / ML_PER_CUP).toBeCloseTo(4, 9)
  })
  it('table salt is 6 g per tsp (USDA SR Legacy "Salt, table", reference §7)', () => {
    expect(SALT_GRAMS_PER_TSP).toBe(6)
  })
})

describe('kitchen fractions: nearest 1/8, scant/heaping beyond 5 %', () => {
  it.each([
    [0.5, 'cup', '½ cup', null],
    [1.5, 'cup', '1½ cups', null],
    [2, 'cup', '2 cups', null],
    [0.125, 'tsp', '⅛ tsp', null],
    // 0.844 cups (black beans per USDA pint, reference §4.2) → ⅞, 3.7 % up: no qualifier
    [0.844, 'cup', '⅞ cup', null],
    // 0.45 → ½ is 11 % more than the amount: the real amount is a scant ½ cup
    [0.45, 'cup', 'scant ½ cup', 'scant'],
    // 0.56 → ½ is 10.7 % less: a heaping ½ cup
    [0.56, 'cup', 'heaping ½ cup', 'heaping'],
    [0.26, 'tsp', '¼ tsp', null],
    [0.3, 'tsp', 'heaping ¼ tsp', 'heaping'],
    [0.02, 'tsp', 'less than ⅛ tsp', null],
  ] as const)('%s %s → "%s"', (value, unit, text, qualifier) => {
    const m = kitchenMeasure(value, unit)
    expect(m.text).toBe(text)
    expect(m.qualifier).toBe(qualifier)
  })
  it('rounds to eighths and gives a plain fraction too', () => {
    const m = kitchenMeasure(1.4, 'cup')
    expect(m.rounded).toBe(1.375)
    expect(m.fraction).toBe('1 3/8')
    expect(m.text).toBe('1⅜ cups')
  })
  it('the 5 % line: just over it is qualified, just under it is not', () => {
    expect(kitchenMeasure(0.5 / 1.051, 'cup').qualifier).toBe('scant')
    expect(kitchenMeasure(0.5 / 1.049, 'cup').qualifier).toBeNull()
    expect(kitchenMeasure(0.5 / 0.949, 'cup').qualifier).toBe('heaping')
    expect(kitchenMeasure(0.5 / 0.951, 'cup').qualifier).toBeNull()
  })
  it('zero is zero', () => expect(kitchenMeasure(0, 'tsp').text).toBe('0 tsp'))
})

describe('display in the household units', () => {
  it('weights: 3¼ lb (CG Guide 4, 9 pints) reads "3 lb 4 oz"; ¾ lb reads "12 oz"', () => {
    expect(formatMass(3.25 * NIST.lb, 'us')).toBe('3 lb 4 oz')
    expect(formatMass(0.75 * NIST.lb, 'us')).toBe('12 oz')
    expect(formatMass(340.19, 'metric')).toBe('340 g')
    expect(formatMass(1474.18, 'metric')).toBe('1.47 kg')
  })
  it('volumes: cups below 4 cups, quarts above; mL and L in metric', () => {
    expect(formatVolume(NIST.cup * 1.25, 'us')).toBe('1¼ cups')
    expect(formatVolume(NIST.quart * 2.5, 'us')).toBe('2.5 qt')
    expect(formatVolume(NIST.quart, 'us')).toBe('1.0 qt')
    // NIST: 1 US gallon = 3785.411784 mL; a gallon jug of vinegar reads as a gallon
    expect(formatVolume(3785.411784, 'us')).toBe('1 gal')
    expect(formatVolume(3785.411784 * 1.1, 'us')).toBe('4.4 qt')
    expect(formatVolume(301, 'metric')).toBe('300 mL')
    expect(formatVolume(2500, 'metric')).toBe('2.50 L')
    expect(mlToCups(NIST.pint)).toBeCloseTo(2, 6)
  })
  it('salt: ½ tsp, or grams with the spoon in metric', () => {
    expect(formatSalt(0.5, 'us')).toBe('½ tsp')
    expect(formatSalt(0.5, 'metric')).toBe('3.0 g')
    expect(formatSalt(0, 'us')).toBe('no salt')
  })
})
