/**
 * The demo household: an invented homestead of our own (people, town, prices are made up).
 * Created only on an empty database and only in demo mode.
 */
import type { Database } from '~~/server/utils/database'
import * as t from '../schema'

export const DEMO_PASSWORD = 'put-up-2026'
/** The demo homestead keeps Mountain time. */
export const DEMO_TIME_ZONE = 'America/Denver'
export const demoSignIns = [
  { email: 'owner@demo.shelfstead.test', name: 'Marisol Achterberg', role: 'owner' },
  { email: 'canner@demo.shelfstead.test', name: 'Dev Achterberg', role: 'canner' },
  { email: 'helper@demo.shelfstead.test', name: 'Wren Okafor', role: 'helper' },
] as const

export async function seedDemoHousehold(
  db: Database,
  hashPassword: (password: string) => Promise<string>,
): Promise<string> {
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  return db.transaction(async (tx) => {
    const [household] = await tx.insert(t.households).values({
      name: 'Quillfeather Hollow Homestead',
      altitudeFt: 2350,
      unitSystem: 'us',
      storeCanPriceCents: 119,
      jarUses: 10,
      timeZone: DEMO_TIME_ZONE,
      isDemo: true,
    }).returning()
    const people = await tx.insert(t.users)
      .values(demoSignIns.map(p => ({ email: p.email, name: p.name, passwordHash })))
      .returning()
    await tx.insert(t.memberships).values(demoSignIns.map((p, i) => ({
      userId: people[i]!.id,
      householdId: household!.id,
      role: p.role,
    })))
    const householdId = household!.id
    await tx.insert(t.canners).values([
      {
        householdId,
        name: 'Tall canner (23 qt)',
        innerDiameterMm: 310,
        usableHeightMm: 330,
        rackThicknessMm: 6,
        gaugeType: 'weighted',
        maxLayers: 2,
        waterDepthMm: 76,
        lastGaugeTestAt: null,
      },
      {
        householdId,
        name: 'Everyday canner (16 qt)',
        innerDiameterMm: 300,
        usableHeightMm: 220,
        rackThicknessMm: 6,
        gaugeType: 'dial',
        maxLayers: 1,
        waterDepthMm: 76,
        lastGaugeTestAt: '2025-09-20',
      },
    ])
    await tx.insert(t.jarStock).values([
      { householdId, jarSizeId: 'pint-regular', count: 28 },
      { householdId, jarSizeId: 'pint-wide', count: 6 },
      { householdId, jarSizeId: 'quart-regular', count: 11 },
    ])
    await tx.insert(t.priceItems).values([
      { householdId, kind: 'ingredient', label: 'Pinto beans, 2 lb bag', ingredientId: 'pinto-beans', packageGrams: 907.18474, priceCents: 349 },
      { householdId, kind: 'ingredient', label: 'Pinto beans, 4 lb bag', ingredientId: 'pinto-beans', packageGrams: 1814.36948, priceCents: 629 },
      { householdId, kind: 'ingredient', label: 'Black beans, 1 lb bag', ingredientId: 'black-beans', packageGrams: 453.59237, priceCents: 199 },
      { householdId, kind: 'ingredient', label: 'Black beans, 2 lb bag', ingredientId: 'black-beans', packageGrams: 907.18474, priceCents: 379 },
      { householdId, kind: 'ingredient', label: 'Kidney beans, 2 lb bag', ingredientId: 'kidney-beans', packageGrams: 907.18474, priceCents: 399 },
      { householdId, kind: 'ingredient', label: 'Great northern beans, 1 lb bag', ingredientId: 'great-northern-beans', packageGrams: 453.59237, priceCents: 209 },
      { householdId, kind: 'ingredient', label: 'Navy beans, 2 lb bag', ingredientId: 'navy-beans', packageGrams: 907.18474, priceCents: 359 },
      { householdId, kind: 'salt', label: 'Canning salt, 4 lb box', packageGrams: 1814.36948, priceCents: 429 },
      { householdId, kind: 'lid', label: 'Regular-mouth lids, 12', mouth: 'regular', packCount: 12, priceCents: 379 },
      { householdId, kind: 'lid', label: 'Wide-mouth lids, 12', mouth: 'wide', packCount: 12, priceCents: 449 },
      { householdId, kind: 'jar', label: 'Regular-mouth pint jars, case of 12', jarSizeId: 'pint-regular', packCount: 12, priceCents: 1649 },
      { householdId, kind: 'jar', label: 'Regular-mouth quart jars, case of 12', jarSizeId: 'quart-regular', packCount: 12, priceCents: 1849 },
      { householdId, kind: 'vinegar', label: 'White vinegar, 1 gal', packageMl: 3785.411784, priceCents: 459 },
    ])
    return householdId
  })
}
