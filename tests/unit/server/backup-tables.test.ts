/**
 * The household backup carries every table the household owns: read from the schema itself, so
 * a table added later with household_id (or a child of a household table) fails here until it
 * is listed in server/utils/backupTables.ts or left out with a reason.
 */
import { describe, expect, it } from 'vitest'
import { getTableConfig } from 'drizzle-orm/pg-core'
import { householdTables, notHouseholdTables, schemaTables, tableName, userColumns } from '~~/server/utils/backupTables'

const listed = householdTables.map(h => tableName(h.table))

describe('the tables of a household backup', () => {
  it('finds the schema\'s tables (more than twenty of them)', () => {
    expect(schemaTables().length).toBeGreaterThan(20)
  })

  it('lists every table with a household_id column', () => {
    const withHousehold = schemaTables().filter(t => getTableConfig(t).columns.some(c => c.name === 'household_id')).map(tableName)
    expect(withHousehold.filter(name => !listed.includes(name) && name !== 'sessions')).toEqual([])
    expect(withHousehold).toContain('load_lines')
  })

  it('puts every table of the schema in exactly one list', () => {
    const all = schemaTables().map(tableName)
    expect(all.filter(name => !listed.includes(name) && !(name in notHouseholdTables))).toEqual([])
    expect(all.filter(name => listed.includes(name) && name in notHouseholdTables)).toEqual([])
    expect(new Set(listed).size).toBe(listed.length)
  })

  it('inserts parents before children: each listed table\'s references point to tables listed earlier or to reference data', () => {
    const late: string[] = []
    householdTables.forEach(({ table }, i) => {
      for (const fk of getTableConfig(table).foreignKeys) {
        const parent = getTableConfig(fk.reference().foreignTable).name
        const at = listed.indexOf(parent)
        if (at > i) late.push(`${tableName(table)} → ${parent}`)
      }
    })
    expect(late).toEqual([])
  })

  it('knows which columns name a person, so a former member is never carried along', () => {
    expect(userColumns(householdTables.find(h => tableName(h.table) === 'canning_loads')!.table).sort()).toEqual(['confirmed_by', 'created_by'])
  })
})
