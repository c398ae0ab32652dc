import { describe, expect, it } from 'vitest'
import { PlanningRefusal, fillCapMl, kitchenMeasure, mlToCups, perJarFill } from '~~/utils/planning'
import { blackBeans, dryPack, halfPint, jarSizes, pint, quart, usdaDryBeans } from './fixtures'

const HALF_CUP_ML = 236.5882365 / 2 // NIST
const LB = 453.59237 // NIST

describe('fill cap d_max = f·V/E', () => {
  it('common practice, no published source: a dry-pack pint (E = 3, f = ¾) is capped at exactly ½ US cup', () => {
    expect(fillCapMl(pint, dryPack, blackBeans)).toBeCloseTo(HALF_CUP_ML, 6)
    const fill = perJarFill(dryPack, pint, blackBeans, jarSizes, {}, 'l')
    expect(kitchenMeasure(mlToCups(fill.dryMl), 'cup').text).toBe('½ cup')
    // ½ cup of black beans at 194 g per cup (USDA SR Legacy 16014) = 97 g
    expect(fill.dryGrams).toBeCloseTo(97, 3)
    expect(fill.fillFractionOfCap).toBeCloseTo(1, 12)
  })
  it('a quart is capped at 1 cup, a half-pint at ¼ cup (same rule, twice and half the volume)', () => {
    expect(fillCapMl(quart, dryPack, blackBeans)).toBeCloseTo(2 * HALF_CUP_ML, 6)
    expect(fillCapMl(halfPint, dryPack, blackBeans)).toBeCloseTo(HALF_CUP_ML / 2, 6)
  })
  it('a request above the cap is refused with the cap in the message, never clipped', () => {
    const ask = () => perJarFill(dryPack, pint, blackBeans, jarSizes, { dryMlPerJar: 130 }, 'lines[0]')
    expect(ask).toThrow(PlanningRefusal)
    expect(ask).toThrow(/safe fill of ½ cup \(97 g\) \(118 mL\)/)
    try {
      ask()
    }
    catch (e) {
      expect((e as PlanningRefusal).field).toBe('lines[0].dryMlPerJar')
    }
  })
  it('a smaller request is used as asked; the cap itself is allowed', () => {
    expect(perJarFill(dryPack, pint, blackBeans, jarSizes, { dryMlPerJar: 100 }, 'l').dryMl).toBe(100)
    expect(perJarFill(dryPack, pint, blackBeans, jarSizes, { dryMlPerJar: HALF_CUP_ML }, 'l').dryMl).toBeCloseTo(HALF_CUP_ML, 9)
    expect(() => perJarFill(dryPack, pint, blackBeans, jarSizes, { dryMlPerJar: 0 }, 'l')).toThrow(PlanningRefusal)
  })
})

describe('tested hot pack: published amounts (USDA Complete Guide (AIB 539) Guide 4 "Quantity")', () => {
  it('¾ lb of dry beans per quart (340.19 g)', () => {
    const fill = perJarFill(usdaDryBeans, quart, blackBeans, jarSizes, {}, 'l')
    expect(fill.dryGrams).toBeCloseTo(0.75 * LB, 6)
    expect(fill.dryGrams).toBeCloseTo(340.19, 2)
  })
  it('3¼ lb per 9 pints: 163.80 g per pint (derived, reference §1.4)', () => {
    expect(perJarFill(usdaDryBeans, pint, blackBeans, jarSizes, {}, 'l').dryGrams).toBeCloseTo(163.8, 1)
  })
  it('the published amount exceeds the dry-pack cap and is reported, not refused (it is a buying average)', () => {
    const fill = perJarFill(usdaDryBeans, quart, blackBeans, jarSizes, {}, 'l')
    expect(fill.fillFractionOfCap).toBeGreaterThan(1)
    expect(fill.warnings.map(w => w.code)).toContain('published-amount-above-cap')
  })
})

describe('salt per jar (optional)', () => {
  it('½ tsp per pint, 1 tsp per quart (USDA Complete Guide (AIB 539) Guide 4)', () => {
    expect(perJarFill(usdaDryBeans, pint, blackBeans, jarSizes, {}, 'l').saltTsp).toBe(0.5)
    expect(perJarFill(usdaDryBeans, quart, blackBeans, jarSizes, {}, 'l').saltTsp).toBe(1)
  })
  it('salt grams at 6 g per tsp (USDA SR Legacy "Salt, table")', () => {
    expect(perJarFill(usdaDryBeans, quart, blackBeans, jarSizes, {}, 'l').saltGrams).toBe(6)
  })
  it('the request overrides the recipe, 0 for none; a half-pint gets the pint amount scaled by volume (¼ tsp)', () => {
    expect(perJarFill(usdaDryBeans, pint, blackBeans, jarSizes, { saltTsp: 0 }, 'l').saltTsp).toBe(0)
    expect(perJarFill(usdaDryBeans, halfPint, blackBeans, jarSizes, {}, 'l').saltTsp).toBeCloseTo(0.25, 9)
  })
})

describe('water per jar', () => {
  it('dry-pack pint: the volume to the 1-in headspace line (cylinder of the jar height) minus the dry beans', () => {
    // 473.18 mL × (1 − 25.4 mm / 135 mm) − 118.29 mL, worked by hand: 384.15 − 118.29 = 265.85 mL
    const toLine = 473.176473 * (1 - 25.4 / 135)
    expect(toLine).toBeCloseTo(384.15, 2)
    expect(perJarFill(dryPack, pint, blackBeans, jarSizes, {}, 'l').waterMl).toBeCloseTo(265.85, 1)
  })
  it('hot-pack quart: hydrated solids take at most ¾ of the jar, the liquid the rest to the line', () => {
    // 946.35 × (1 − 25.4/175) = 809.00 mL to the line; solids ¾ × 946.35 = 709.76 mL → 99.2 mL
    expect(perJarFill(usdaDryBeans, quart, blackBeans, jarSizes, {}, 'l').waterMl).toBeCloseTo(99.2, 0)
  })
})
