/**
 * A season of invented canning for the demo household, so its Pantry board has something to
 * show: loads logged over the past year, seal checks (mostly sealed, a few not), a Shelf of
 * jars by product, jars taken off month by month, and one load still waiting for its check.
 * Dates are relative to the moment of seeding. Only on an empty database, in demo mode.
 */
import { and, eq, inArray } from 'drizzle-orm'
import { bestByDate, loadCode, requiredProcess, sealWindow } from '~~/utils/after'
import { dateIn } from '~~/utils/time'
import type { JarSize, Recipe } from '~~/utils/planning/types'
import type { Database, Tx } from '~~/server/utils/database'
import * as t from '../schema'
import { DEMO_TIME_ZONE } from './demo'

const HOUR = 3_600_000
const DAY = 24 * HOUR

interface DemoLoad {
  daysAgo: number
  canner: 'tall' | 'everyday'
  lines: Array<{ recipeId: string, product: string, jarSizeId: string, jars: number, unsealed?: number, action?: 'refrigerate' | 'reprocess' }>
  notes: string
  /** Hours after unloading that the seal check was recorded; null: not checked yet. */
  checkedAfterHours: number | null
}

const season: DemoLoad[] = [
  { daysAgo: 340, canner: 'tall', checkedAfterHours: 14, notes: 'First load of the season. Weight rocked steadily.',
    lines: [{ recipeId: 'usda-dried-beans-hot-pack', product: 'Pinto beans, hot pack', jarSizeId: 'pint-regular', jars: 18, unsealed: 1, action: 'refrigerate' }] },
  { daysAgo: 300, canner: 'everyday', checkedAfterHours: 16, notes: 'Quarts for chili night.',
    lines: [{ recipeId: 'usda-dried-beans-hot-pack', product: 'Black beans, hot pack', jarSizeId: 'quart-regular', jars: 7 }] },
  { daysAgo: 230, canner: 'tall', checkedAfterHours: 13, notes: 'Two lids did not take; reprocessed next morning with new lids.',
    lines: [{ recipeId: 'house-dry-pack-beans', product: 'Dry-packed black beans', jarSizeId: 'pint-regular', jars: 18, unsealed: 2, action: 'reprocess' }] },
  { daysAgo: 160, canner: 'everyday', checkedAfterHours: 18, notes: 'Ham-bone broth from the freezer.',
    lines: [{ recipeId: 'usda-bean-soup', product: 'Navy bean soup', jarSizeId: 'quart-regular', jars: 7 }] },
  { daysAgo: 95, canner: 'tall', checkedAfterHours: 12.5, notes: 'Mixed load: both recipes take 65 minutes for pints.',
    lines: [
      { recipeId: 'usda-baked-beans', product: 'Baked beans', jarSizeId: 'pint-regular', jars: 9 },
      { recipeId: 'usda-beans-in-sauce', product: 'Beans in tomato sauce', jarSizeId: 'pint-regular', jars: 9, unsealed: 1, action: 'refrigerate' },
    ] },
  { daysAgo: 38, canner: 'tall', checkedAfterHours: 15, notes: '',
    lines: [{ recipeId: 'usda-dried-beans-hot-pack', product: 'Pinto beans, hot pack', jarSizeId: 'pint-regular', jars: 18 }] },
  { daysAgo: 0.6, canner: 'everyday', checkedAfterHours: null, notes: 'Cooling on the towel by the window.',
    lines: [{ recipeId: 'usda-dried-beans-hot-pack', product: 'Kidney beans, hot pack', jarSizeId: 'quart-regular', jars: 7 }] },
]

/** Jars eaten in a month: a household of three eats a few pints a week. */
const monthlyUse = [6, 7, 5, 8, 6, 7, 8, 6, 7, 5, 7]

async function recipesFor(tx: Tx, ids: string[]): Promise<Map<string, Recipe>> {
  const [rows, specs, bands] = await Promise.all([
    tx.select().from(t.recipes).where(inArray(t.recipes.id, ids)),
    tx.select().from(t.recipeJarSpecs).where(inArray(t.recipeJarSpecs.recipeId, ids)),
    tx.select().from(t.recipePressureBands).where(inArray(t.recipePressureBands.recipeId, ids)),
  ])
  return new Map(rows.map(r => [r.id, {
    ...r,
    caution: r.caution ?? undefined,
    perJar: [],
    processMinutes: specs.filter(s => s.recipeId === r.id && s.processMinutes !== null).map(s => ({ jarKey: s.sizeKey, minutes: s.processMinutes! })),
    pressureBands: bands.filter(b => b.recipeId === r.id).map(b => ({ gaugeType: b.gaugeType, minFt: b.minFt, maxFt: b.maxFt, psi: b.psi })),
  } satisfies Recipe]))
}

export async function seedDemoSeason(db: Database, householdId: string, now = new Date()): Promise<void> {
  await db.transaction(async (tx) => {
    const [household] = await tx.select().from(t.households).where(eq(t.households.id, householdId))
    const canners = await tx.select().from(t.canners).where(eq(t.canners.householdId, householdId))
    const [owner] = await tx.select({ id: t.memberships.userId }).from(t.memberships)
      .where(and(eq(t.memberships.householdId, householdId), eq(t.memberships.role, 'owner')))
    const jarRows = await tx.select().from(t.jarSizes)
    const jarSizes: JarSize[] = jarRows.map(j => ({ ...j, key: j.sizeKey }))
    const recipes = await recipesFor(tx, [...new Set(season.flatMap(l => l.lines.map(x => x.recipeId)))])
    const cannerOf = (which: DemoLoad['canner']) => canners.find(c => c.name.startsWith(which === 'tall' ? 'Tall' : 'Everyday'))!
    const lots: Array<{ id: string, jarsLeft: number, cannedOn: string }> = []
    let number = 0

    const altitudeFt = household!.altitudeFt
    if (altitudeFt === null) throw new Error('The demo household needs an altitude before its season is logged.')
    for (const demo of season) {
      const canner = cannerOf(demo.canner)
      const lines = demo.lines.map(l => ({ recipe: recipes.get(l.recipeId)!, jarSize: jarSizes.find(j => j.id === l.jarSizeId)! }))
      const required = requiredProcess(lines, jarSizes, canner.gaugeType, altitudeFt)
      const endedAt = new Date(now.getTime() - demo.daysAgo * DAY)
      const startedAt = new Date(endedAt.getTime() - (required.minutes + 90) * 60_000)
      number += 1
      const code = loadCode(number)
      const [load] = await tx.insert(t.canningLoads).values({
        householdId, number, status: 'done', cannerId: canner.id, cannerName: canner.name, gaugeType: canner.gaugeType,
        altitudeFt: altitudeFt, pressurePsi: required.psi, processMinutes: required.minutes,
        requiredPsi: required.psi, requiredMinutes: required.minutes, requiredSource: required.source,
        startedAt, endedAt, shortfall: null, notes: demo.notes, createdBy: owner?.id ?? null, createdAt: startedAt, updatedAt: endedAt,
      }).returning()
      const lineRows = await tx.insert(t.loadLines).values(demo.lines.map((l, i) => ({
        loadId: load!.id, householdId, lineIndex: i, recipeId: l.recipeId, product: l.product, jarSizeId: l.jarSizeId, jars: l.jars,
        ...(demo.checkedAfterHours === null ? {} : { sealed: l.jars - (l.unsealed ?? 0), unsealed: l.unsealed ?? 0, unsealedAction: l.unsealed ? l.action! : null }),
      }))).returning()
      if (demo.checkedAfterHours === null) {
        await tx.insert(t.reminders).values({ householdId, kind: 'seal-check', loadId: load!.id, dueAt: sealWindow(endedAt, endedAt).dueAt })
        continue
      }
      const checkedAt = new Date(endedAt.getTime() + demo.checkedAfterHours * HOUR)
      await tx.insert(t.sealChecks).values({ loadId: load!.id, householdId, checkedAt, checkedBy: owner?.id ?? null, notes: '' })
      const cannedOn = dateIn(startedAt, DEMO_TIME_ZONE)
      for (const [i, l] of demo.lines.entries()) {
        const line = lineRows[i]!
        const sealed = l.jars - (l.unsealed ?? 0)
        const [lot] = await tx.insert(t.shelfLots).values({
          householdId, loadId: load!.id, loadLineId: line.id, recipeId: l.recipeId, product: l.product, jarSizeId: l.jarSizeId, loadCode: code,
          cannedOn, bestBy: bestByDate(cannedOn, household!.bestByMonths), jarsIn: sealed, jarsLeft: sealed, source: 'seal-check', shelvedAt: checkedAt,
        }).returning()
        lots.push({ id: lot!.id, jarsLeft: sealed, cannedOn })
        if (l.unsealed && l.action === 'refrigerate') {
          await tx.insert(t.fridgeItems).values({ householdId, loadId: load!.id, loadLineId: line.id, product: l.product, jarSizeId: l.jarSizeId, jars: l.unsealed, refrigeratedAt: checkedAt, clearedAt: new Date(checkedAt.getTime() + 3 * DAY) })
        }
        if (l.unsealed && l.action === 'reprocess') {
          number += 1
          const again = new Date(checkedAt.getTime() + 2 * HOUR)
          const againEnd = new Date(again.getTime() + (required.minutes + 80) * 60_000)
          const [re] = await tx.insert(t.canningLoads).values({
            householdId, number, status: 'done', reprocessOfId: load!.id, cannerId: canner.id, cannerName: canner.name, gaugeType: canner.gaugeType,
            altitudeFt: altitudeFt, pressurePsi: required.psi, processMinutes: required.minutes, requiredPsi: required.psi,
            requiredMinutes: required.minutes, requiredSource: required.source, startedAt: again, endedAt: againEnd,
            deadlineAt: new Date(endedAt.getTime() + 24 * HOUR), notes: `Reprocessed ${l.unsealed} jars from load ${code} with new lids.`,
            createdBy: owner?.id ?? null, createdAt: checkedAt, updatedAt: againEnd,
          }).returning()
          const [reLine] = await tx.insert(t.loadLines).values({
            loadId: re!.id, householdId, lineIndex: 0, recipeId: l.recipeId, product: l.product, jarSizeId: l.jarSizeId, jars: l.unsealed, sealed: l.unsealed, unsealed: 0,
          }).returning()
          const reChecked = new Date(againEnd.getTime() + 14 * HOUR)
          await tx.insert(t.sealChecks).values({ loadId: re!.id, householdId, checkedAt: reChecked, checkedBy: owner?.id ?? null, notes: 'Both sealed.' })
          const [reLot] = await tx.insert(t.shelfLots).values({
            householdId, loadId: re!.id, loadLineId: reLine!.id, recipeId: l.recipeId, product: l.product, jarSizeId: l.jarSizeId, loadCode: loadCode(number),
            cannedOn, bestBy: bestByDate(cannedOn, household!.bestByMonths), jarsIn: l.unsealed, jarsLeft: l.unsealed, source: 'seal-check', shelvedAt: reChecked,
          }).returning()
          lots.push({ id: reLot!.id, jarsLeft: l.unsealed, cannedOn })
        }
      }
    }

    // Last year's kidney beans, imported from a paper inventory: past their best-by.
    const oldCanned = dateIn(new Date(now.getTime() - 400 * DAY), DEMO_TIME_ZONE)
    const [old] = await tx.insert(t.shelfLots).values({
      householdId, recipeId: 'usda-dried-beans-hot-pack', product: 'Kidney beans, hot pack', jarSizeId: 'pint-regular', loadCode: '2025-B',
      cannedOn: oldCanned, bestBy: bestByDate(oldCanned, household!.bestByMonths), jarsIn: 3, jarsLeft: 3, source: 'import', shelvedAt: new Date(now.getTime() - 330 * DAY),
    }).returning()
    lots.push({ id: old!.id, jarsLeft: 3, cannedOn: oldCanned })

    // Jars eaten month by month, oldest lots first; the old kidney beans were forgotten at the back.
    for (const [m, jars] of monthlyUse.entries()) {
      const movedAt = new Date(now.getTime() - (320 - m * 29) * DAY)
      let left = jars
      const batchId = crypto.randomUUID()
      const shelved = lots.filter(l => l.id !== old!.id && l.jarsLeft > 0).sort((a, b) => a.cannedOn.localeCompare(b.cannedOn))
      for (const lot of shelved) {
        if (left === 0) break
        const [row] = await tx.select({ shelvedAt: t.shelfLots.shelvedAt }).from(t.shelfLots).where(eq(t.shelfLots.id, lot.id))
        if (row!.shelvedAt > movedAt) continue
        // A few jars from each lot: a household eats several products in a month.
        const take = Math.min(left, lot.jarsLeft, 3)
        lot.jarsLeft -= take
        left -= take
        await tx.insert(t.shelfMovements).values({ householdId, batchId, lotId: lot.id, jars: take, jarsReturned: 0, movedAt, movedBy: owner?.id ?? null })
        await tx.update(t.shelfLots).set({ jarsLeft: lot.jarsLeft }).where(eq(t.shelfLots.id, lot.id))
      }
    }
  })
}
