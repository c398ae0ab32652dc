/**
 * Which tables a household backup carries, in the order a restore inserts them (parents first).
 * tests/unit/server/backup-tables.test.ts reads the whole schema: a new table with household_id
 * that is not listed here, or a table in neither list, fails it.
 */
import { is } from 'drizzle-orm'
import { getTableConfig, PgTable } from 'drizzle-orm/pg-core'
import * as t from '~~/server/database/schema'

/** How a table's rows of one household are found. */
export type BackupScope = 'household' | 'householdId' | 'houseRecipe' | 'members'

export const householdTables: ReadonlyArray<{ table: PgTable, scope: BackupScope }> = [
  { table: t.users, scope: 'members' },
  { table: t.households, scope: 'household' },
  { table: t.memberships, scope: 'householdId' },
  { table: t.invitations, scope: 'householdId' },
  { table: t.canners, scope: 'householdId' },
  { table: t.priceItems, scope: 'householdId' },
  { table: t.jarStock, scope: 'householdId' },
  { table: t.dryGoodsStock, scope: 'householdId' },
  { table: t.recipes, scope: 'householdId' },
  { table: t.recipeJarSpecs, scope: 'houseRecipe' },
  { table: t.recipePressureBands, scope: 'houseRecipe' },
  { table: t.plans, scope: 'householdId' },
  { table: t.marketChecks, scope: 'householdId' },
  { table: t.canningLoads, scope: 'householdId' },
  { table: t.loadLines, scope: 'householdId' },
  { table: t.sealChecks, scope: 'householdId' },
  { table: t.loadPhotos, scope: 'householdId' },
  { table: t.reminders, scope: 'householdId' },
  { table: t.mailQueue, scope: 'householdId' },
  { table: t.canningDays, scope: 'householdId' },
  { table: t.dayEvents, scope: 'householdId' },
  { table: t.shelfLots, scope: 'householdId' },
  { table: t.shelfMovements, scope: 'householdId' },
  { table: t.fridgeItems, scope: 'householdId' },
  { table: t.activity, scope: 'householdId' },
]

/** Tables that are not the household's, and why a backup leaves them out. */
export const notHouseholdTables: Readonly<Record<string, string>> = {
  sessions: 'a signed-in device, not household data: people sign in again on the restored site',
  password_resets: 'a short-lived secret link for one person',
  reference_data: 'the published reference data is seeded by the app; its version is in the file header',
  reference_changes: 'the history of the shared recipe library, the site\'s and not a household\'s',
  jar_sizes: 'published reference data, seeded by the app',
  ingredients: 'published reference data, seeded by the app',
  mail_outbox: 'the development mail fake\'s store',
  rate_limits: 'sign-in attempts counted against guessing, kept for minutes, per address and not per household',
  test_clock: 'the test clock\'s offset (tests and development only)',
}

/** The SQL name of a table. */
export const tableName = (table: PgTable) => getTableConfig(table).name

/** Every table of the schema. */
export function schemaTables(): PgTable[] {
  return (Object.values(t) as unknown[]).filter((v): v is PgTable => is(v, PgTable))
}

/** The SQL columns of a table that name a user (created_by, checked_by …). */
export function userColumns(table: PgTable): string[] {
  return getTableConfig(table).foreignKeys
    .map(fk => fk.reference())
    .filter(ref => getTableConfig(ref.foreignTable).name === 'users')
    .flatMap(ref => ref.columns.map(c => c.name))
}

/** The primary-key columns, for a stable row order. */
export function keyColumns(table: PgTable): string[] {
  const config = getTableConfig(table)
  const composite = config.primaryKeys[0]?.columns.map(c => c.name)
  return composite ?? config.columns.filter(c => c.primary).map(c => c.name)
}
