/**
 * A correction of a published value reaches an existing database: a database that holds an
 * older reference version (here: a wrong pint time for dried beans, hot pack) gets the shipped
 * value at the next start, the change is logged, and a plan saved before says what changed.
 *
 * Published value (shared/reference/canning-reference.md): USDA Complete Guide to Home Canning,
 * Guide 4, "Beans or peas – shelled, dried": hot pack, pints 75 minutes.
 */
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, startServer, type RunningServer } from '../support/server'
import { queryDatabase } from '../support/databases'

const dataDir = mkdtempSync(join(tmpdir(), 'shelfstead-reference-'))
const EMAIL = 'oda@example.org'
const PASSWORD = 'yellow-eye-2026'
const RECIPE = 'usda-dried-beans-hot-pack'
const running: RunningServer[] = []

afterAll(async () => {
  for (const s of running) await s.stop()
})

async function pintMinutes(client: ApiClient, householdId: string): Promise<number> {
  const recipes = (await client.get(`/api/recipes?householdId=${householdId}`)).body as Array<{ id: string, processMinutes: Array<{ jarKey: string, minutes: number }> }>
  return recipes.find(r => r.id === RECIPE)!.processMinutes.find(p => p.jarKey === 'pint')!.minutes
}

describe('reference corrections', () => {
  it('reach an existing database at the next start and are noted on a plan saved before', async () => {
    const first = await startServer({ dataDir })
    running.push(first)
    const client = new ApiClient(first.url)
    const reg = await client.post('/api/auth/register', { email: EMAIL, password: PASSWORD, name: 'Oda Lindqvist', householdName: 'Lindqvist cellar' })
    expect(reg.status).toBe(201)
    const hid = reg.body.households[0].id
    await client.patch(`/api/households/${hid}`, { altitudeFt: 900 })
    const canner = await client.post(`/api/households/${hid}/canners`, { name: 'Weighted canner', innerDiameterMm: 310, usableHeightMm: 330, rackThicknessMm: 6, gaugeType: 'weighted', maxLayers: 2, waterDepthMm: 76 })
    const saved = await client.post(`/api/households/${hid}/plans`, {
      name: 'Pintos for winter',
      request: { lines: [{ recipeId: RECIPE, jarSizeId: 'pint-regular', ingredientId: 'pinto-beans', jars: 9 }], cannerIds: [canner.body.id] },
    })
    expect(saved.status, JSON.stringify(saved.body)).toBe(201)
    expect(await pintMinutes(client, hid)).toBe(75)
    await first.stop()

    // Make this database look like one seeded by an older release with a wrong pint time.
    await queryDatabase(first, `update recipe_jar_specs set process_minutes = 70 where recipe_id = $1 and size_key = 'pint'`, [RECIPE])
    await queryDatabase(first, `update reference_data set version = version - 1 where name = 'published'`)

    const second = await startServer({ dataDir })
    running.push(second)
    expect(second.output()).toMatch(/Reference data version \d+ changed 1 published value/)
    expect(second.output()).toContain('70 min')
    const after = new ApiClient(second.url)
    await after.login(EMAIL, PASSWORD)
    expect(await pintMinutes(after, hid)).toBe(75)
    const plan = await after.get(`/api/households/${hid}/plans/${saved.body.plan.id}`)
    expect(plan.status).toBe(200)
    expect(plan.body.referenceChanges).toHaveLength(1)
    expect(plan.body.referenceChanges[0]).toMatch(/pint: process time.*70 min.*→ 75 min/)
  })
})
