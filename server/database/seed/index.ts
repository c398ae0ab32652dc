import { count } from 'drizzle-orm'
import type { Database } from '../../utils/database'
import * as t from '../schema'
import { ingredientSeed, jarSizeSeed, recipePressureBandSeed, recipeSeed } from './reference'
import { seedDemoHousehold } from './demo'
import { seedDemoSeason } from './demo-season'

/**
 * Insert the published reference data. Idempotent: rows already present (by id) are left as
 * they are, so a restart never duplicates rows and never overwrites an admin's edits.
 */
export async function seedReference(db: Database): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.insert(t.jarSizes).values(jarSizeSeed).onConflictDoNothing()
    await tx.insert(t.ingredients).values(ingredientSeed).onConflictDoNothing()
    await tx.insert(t.recipes)
      .values(recipeSeed.map(({ jarSpecs: _specs, ...recipe }) => recipe))
      .onConflictDoNothing()
    await tx.insert(t.recipeJarSpecs)
      .values(recipeSeed.flatMap(r => r.jarSpecs.map(s => ({ recipeId: r.id, ...s }))))
      .onConflictDoNothing()
    await tx.insert(t.recipePressureBands).values(recipePressureBandSeed).onConflictDoNothing()
  })
}

/** Create the demo household only when nobody has signed up yet. */
export async function seedDemoIfEmpty(
  db: Database,
  hashPassword: (password: string) => Promise<string>,
): Promise<boolean> {
  const [row] = await db.select({ users: count() }).from(t.users)
  if ((row?.users ?? 0) > 0) return false
  await seedDemoSeason(db, await seedDemoHousehold(db, hashPassword))
  return true
}
