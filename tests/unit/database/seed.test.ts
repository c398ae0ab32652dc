import { PGlite } from '@electric-sql/pglite'
import { and, count, eq } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/pglite'
import { migrate } from 'drizzle-orm/pglite/migrator'
import { beforeAll, describe, expect, it } from 'vitest'
import * as schema from '~~/server/database/schema'
import { seedDemoIfEmpty, seedReference } from '~~/server/database/seed'
import { recipeSeed, REFERENCE_VERSION } from '~~/server/database/seed/reference'
import type { Database } from '~~/server/utils/database'

let db: Database

beforeAll(async () => {
  db = drizzle(await PGlite.create(), { schema, casing: 'snake_case' })
  await migrate(db, { migrationsFolder: 'server/database/migrations' })
  await seedReference(db)
}, 60_000)

async function rowCounts() {
  const tables = [schema.jarSizes, schema.ingredients, schema.recipes, schema.recipeJarSpecs, schema.recipePressureBands]
  return Promise.all(tables.map(async t => (await db.select({ n: count() }).from(t))[0]!.n))
}

/** Minutes for dried beans, hot pack, pints, as the database holds them. */
async function beanPintMinutes() {
  const [row] = await db.select({ m: schema.recipeJarSpecs.processMinutes }).from(schema.recipeJarSpecs)
    .where(and(eq(schema.recipeJarSpecs.recipeId, 'usda-dried-beans-hot-pack'), eq(schema.recipeJarSpecs.sizeKey, 'pint')))
  return row?.m
}

describe('reference data versions', () => {
  // USDA Complete Guide, Guide 4, "Beans or peas – shelled, dried": hot pack pints 75 minutes.
  it('records the version it applied', async () => {
    const [row] = await db.select().from(schema.referenceData).where(eq(schema.referenceData.name, 'published'))
    expect(row?.version).toBe(REFERENCE_VERSION)
    expect(await beanPintMinutes()).toBe(75)
  })

  it('leaves an edit at the current version alone, and puts published values right when a newer version arrives', async () => {
    await db.update(schema.recipeJarSpecs).set({ processMinutes: 40 })
      .where(and(eq(schema.recipeJarSpecs.recipeId, 'usda-dried-beans-hot-pack'), eq(schema.recipeJarSpecs.sizeKey, 'pint')))
    await db.insert(schema.recipePressureBands).values({ recipeId: 'usda-dried-beans-hot-pack', gaugeType: 'dial', minFt: 90_000, maxFt: 99_000, psi: 3, source: 'a stray row no published table has' })
    expect(await seedReference(db)).toBe(false)
    expect(await beanPintMinutes()).toBe(40)

    // A database that still holds the previous version, as an existing household's would.
    await db.update(schema.referenceData).set({ version: REFERENCE_VERSION - 1 })
    expect(await seedReference(db)).toBe(true)
    expect(await beanPintMinutes()).toBe(75)
    const stray = await db.select().from(schema.recipePressureBands).where(eq(schema.recipePressureBands.minFt, 90_000))
    expect(stray).toHaveLength(0)
    const [row] = await db.select().from(schema.referenceData).where(eq(schema.referenceData.name, 'published'))
    expect(row?.version).toBe(REFERENCE_VERSION)
  })
})

describe('reference seed', () => {
  it('is idempotent: seeding again adds no rows', async () => {
    const before = await rowCounts()
    await seedReference(db)
    await seedReference(db)
    expect(await rowCounts()).toEqual(before)
    expect(before.every(n => n > 0)).toBe(true)
  })

  it('gives every tested recipe a published source and every house recipe a caution', async () => {
    const rows = await db.select().from(schema.recipes)
    for (const r of rows.filter(r => r.status === 'tested')) expect(r.source).toMatch(/USDA Complete Guide|MSU Extension|EDIS/)
    for (const r of rows.filter(r => r.status === 'house')) expect(r.caution).toMatch(/untested/i)
  })

  // USDA Complete Guide to Home Canning (AIB 539), Guide 4, Table 1 (dial) and Table 2 (weighted).
  it('stores the published pressure bands for every recipe', async () => {
    const published = [
      ['dial', 0, 2000, 11], ['dial', 2001, 4000, 12], ['dial', 4001, 6000, 13], ['dial', 6001, 8000, 14],
      ['weighted', 0, 1000, 10], ['weighted', 1001, 2_147_483_647, 15],
    ]
    for (const recipe of recipeSeed) {
      const bands = await db.select().from(schema.recipePressureBands).where(eq(schema.recipePressureBands.recipeId, recipe.id))
      const got = bands.map(b => [b.gaugeType, b.minFt, b.maxFt, b.psi]).sort((a, b) => String(a).localeCompare(String(b)))
      expect(got).toEqual([...published].sort((a, b) => String(a).localeCompare(String(b))))
      expect(bands.every(b => b.source.startsWith('CG Guide 4, Table'))).toBe(true)
    }
  })

  // USDA CG Guide 4: dried beans pints 75 / quarts 90; in sauce and baked 65 / 75; fresh lima 40 / 50; soups 60 / 75.
  it('stores the published process minutes by jar size', async () => {
    const expected: Record<string, [number, number]> = {
      'usda-dried-beans-hot-pack': [75, 90],
      'usda-beans-in-sauce': [65, 75],
      'usda-baked-beans': [65, 75],
      'usda-fresh-lima-hot-pack': [40, 50],
      'usda-bean-soup': [60, 75],
    }
    for (const [id, [pint, quart]] of Object.entries(expected)) {
      const specs = await db.select().from(schema.recipeJarSpecs).where(eq(schema.recipeJarSpecs.recipeId, id))
      expect(specs.find(s => s.sizeKey === 'pint')?.processMinutes).toBe(pint)
      expect(specs.find(s => s.sizeKey === 'quart')?.processMinutes).toBe(quart)
      expect(specs.some(s => s.sizeKey === 'half-gallon')).toBe(false)
    }
  })

  // NIST: 1 US fl oz = 29.5735295625 mL; pint 473.176473 mL, quart 946.352946 mL.
  it('stores exact nominal jar capacities and marks outside dimensions as typical', async () => {
    const jars = await db.select().from(schema.jarSizes)
    expect(jars.find(j => j.id === 'pint-regular')!.capacityMl).toBeCloseTo(473.176473, 6)
    expect(jars.find(j => j.id === 'quart-regular')!.capacityMl).toBeCloseTo(946.352946, 6)
    expect(jars.find(j => j.id === 'half-pint-regular')!.capacityMl).toBeCloseTo(236.5882365, 6)
    expect(jars.every(j => /typical/i.test(j.dimensionsNote))).toBe(true)
  })

  // USDA SR Legacy household measures: black 194 g, pinto 193 g, great northern 183 g per cup.
  it('stores USDA cup weights of dry beans', async () => {
    const rows = await db.select().from(schema.ingredients)
    const byId = Object.fromEntries(rows.map(r => [r.id, r.gramsPerCup]))
    expect(byId['black-beans']).toBe(194)
    expect(byId['pinto-beans']).toBe(193)
    expect(byId['great-northern-beans']).toBe(183)
    expect(byId['kidney-beans']).toBe(184)
  })

  it('creates the demo household once, only on an empty database', async () => {
    const fakeHash = async (p: string) => `hashed:${p}`
    expect(await seedDemoIfEmpty(db, fakeHash)).toBe(true)
    expect(await seedDemoIfEmpty(db, fakeHash)).toBe(false)
    const [households] = await db.select({ n: count() }).from(schema.households)
    expect(households?.n).toBe(1)
    const members = await db.select().from(schema.memberships)
    expect(members.map(m => m.role).sort()).toEqual(['canner', 'helper', 'owner'])
  })
})
