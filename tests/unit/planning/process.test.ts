import { describe, expect, it } from 'vitest'
import { PlanningRefusal, bandAltitude, gaugeTestWarning, pressureFor, processMinutesFor } from '~~/utils/planning'
import {
  dialCanner, halfGallon, halfPint, jarSizes, pint, pintAndAHalf, productRecipe, publishedProducts, quart, usdaDryBeans,
} from './fixtures'

const psi = (gauge: 'dial' | 'weighted', ft: number) =>
  pressureFor(usdaDryBeans, gauge, bandAltitude(ft, 'altitudeFt').feet, 'altitudeFt')

describe('pressure by altitude at every band edge (USDA Complete Guide (AIB 539) Guide 4, Tables 1 and 2)', () => {
  it.each([
    [0, 11], [1000, 11], [1001, 11], [2000, 11], [2001, 12], [4000, 12], [4001, 13], [6000, 13], [6001, 14], [8000, 14],
  ])('dial gauge at %i ft → %i psi (Table 1)', (ft, expected) => expect(psi('dial', ft)).toBe(expected))

  it.each([
    [0, 10], [1000, 10], [1001, 15], [2000, 15], [2001, 15], [4000, 15], [4001, 15], [6000, 15], [6001, 15], [8000, 15],
  ])('weighted gauge at %i ft → %i psi (Table 2)', (ft, expected) => expect(psi('weighted', ft)).toBe(expected))

  it('refuses a dial gauge above 8,000 ft: USDA gives no value (reference §1.3)', () => {
    expect(() => psi('dial', 8001)).toThrow(PlanningRefusal)
    expect(() => psi('dial', 8001)).toThrow(/above 8,000 ft.*extension/)
  })
  it('a weighted gauge still has a value at 9,000 ft (Table 2: 15 psi above 1,000 ft)', () => expect(psi('weighted', 9000)).toBe(15))

  it('a fractional altitude rounds up to the safer band: 2,000.5 ft → 2,001 ft → 12 psi dial', () => {
    expect(psi('dial', 2000.5)).toBe(12)
    expect(psi('weighted', 1000.2)).toBe(15)
    expect(psi('dial', 2000)).toBe(11)
  })
  it('below sea level the sea-level band applies; below any inhabited place is refused', () => {
    expect(psi('dial', -200)).toBe(11)
    expect(bandAltitude(-200, 'altitudeFt').warnings[0]?.code).toBe('below-sea-level')
    expect(() => bandAltitude(-5000, 'altitudeFt')).toThrow(PlanningRefusal)
    expect(() => bandAltitude(Number.NaN, 'altitudeFt')).toThrow(PlanningRefusal)
  })
})

describe('process minutes by jar size', () => {
  describe.each(publishedProducts)('$name ($source)', (product) => {
    const recipe = productRecipe(product)
    it(`pint ${product.pint} min, quart ${product.quart} min`, () => {
      expect(processMinutesFor(recipe, pint, jarSizes, 'l').minutes).toBe(product.pint)
      expect(processMinutesFor(recipe, quart, jarSizes, 'l').minutes).toBe(product.quart)
    })
    it('a half-pint takes the pint time (Iowa State AnswerLine 2019, reference §5.1)', () => {
      const t = processMinutesFor(recipe, halfPint, jarSizes, 'l')
      expect(t).toEqual({ minutes: product.pint, fromJarKey: 'pint', borrowed: true })
    })
    it('a half-gallon is refused: no low-acid process, "cannot be extended by any formula" (Penn State Extension; NCHFP)', () => {
      expect(() => processMinutesFor(recipe, halfGallon, jarSizes, 'l')).toThrow(PlanningRefusal)
      expect(() => processMinutesFor(recipe, halfGallon, jarSizes, 'l')).toThrow(/cannot be extended by any formula/)
    })
  })
  it('a pint-and-a-half, between pint and quart, takes the next larger (quart) time, never the pint time', () => {
    expect(processMinutesFor(usdaDryBeans, pintAndAHalf, jarSizes, 'l').minutes).toBe(90)
  })
})

describe('dial-gauge test reminder (yearly: PNW 421; Illinois Extension)', () => {
  it('warns when never tested, when over a year old, and not within the year', () => {
    expect(gaugeTestWarning({ ...dialCanner, lastGaugeTestAt: null }, '2025-09-14', 'c')?.code).toBe('gauge-test-due')
    expect(gaugeTestWarning({ ...dialCanner, lastGaugeTestAt: '2024-09-13' }, '2025-09-14', 'c')?.code).toBe('gauge-test-due')
    expect(gaugeTestWarning({ ...dialCanner, lastGaugeTestAt: '2024-09-15' }, '2025-09-14', 'c')).toBeNull()
  })
  it('a weighted gauge needs no test (University of Missouri Extension)', () => {
    expect(gaugeTestWarning({ ...dialCanner, gaugeType: 'weighted', lastGaugeTestAt: null }, '2025-09-14', 'c')).toBeNull()
  })
})
