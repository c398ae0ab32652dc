import { describe, expect, it } from 'vitest'
import { cannerCapacity, monthsOfSupply, overCapacity } from '~~/utils/after'

describe('months of supply on the Shelf', () => {
  const eaten = [
    { key: 'Pinto beans, hot pack|pint-regular', product: 'Pinto beans, hot pack', recipeId: 'r', jarSizeId: 'pint-regular', jarsPerMonth: 4 },
    { key: 'Black beans|quart-regular', product: 'Black beans', recipeId: 'r', jarSizeId: 'quart-regular', jarsPerMonth: 1.5 },
  ]
  const shelf = [
    { product: 'Pinto beans, hot pack', jarSizeId: 'pint-regular', jars: 18 },
    { product: 'Baked beans', jarSizeId: 'pint-regular', jars: 6 },
  ]
  const rows = monthsOfSupply(eaten, shelf)
  it('18 jars at 4 a month last 4.5 months', () => {
    expect(rows.find(r => r.product === 'Pinto beans, hot pack')).toMatchObject({ onShelf: 18, jarsPerMonth: 4, monthsLeft: 18 / 4 })
  })
  it('a product eaten but gone from the shelf has 0 months left', () => {
    expect(rows.find(r => r.product === 'Black beans')).toMatchObject({ onShelf: 0, monthsLeft: 0 })
  })
  it('a product nobody has eaten yet has no rate, not "infinite" months', () => {
    expect(rows.find(r => r.product === 'Baked beans')).toMatchObject({ onShelf: 6, jarsPerMonth: null, monthsLeft: null })
  })
})

describe('what a canner holds in one load', () => {
  // "Most canners … hold seven quart jars" (USDA CG, MSU-PFS 01600948); the canner's 300 mm inside
  // and the quart's 89 mm outside are typical sizes from memory, as in the planner's packing tests.
  const canner = { name: 'Everyday canner', innerDiameterMm: 300, usableHeightMm: 200, rackThicknessMm: 10, maxLayers: 2 }
  const quart = { id: 'quart-regular', name: 'Quart, regular mouth', outsideDiameterMm: 89, heightMm: 175 }
  it('7 quarts fit, 8 do not, and the refusal names the capacity', () => {
    expect(cannerCapacity(canner, quart)).toBe(7)
    expect(overCapacity(canner, [{ jar: quart, jars: 7 }])).toBeNull()
    expect(overCapacity(canner, [{ jar: quart, jars: 8 }])).toBe('Everyday canner holds 7 quart jars in one load; 8 quart jars are more than it holds.')
  })
})
