/**
 * The rules a shared tested recipe's tables must meet before a site admin can save them. The
 * published shape they are checked against: USDA Complete Guide to Home Canning (2015), Guide 4,
 * Tables 1 and 2 (reference §1.3) — each gauge type's table starts at sea level and its bands
 * follow on without gap or overlap; weighted gauges give 5, 10 or 15 psi (CG Guide 1); low-acid
 * food needs at least 1 inch of headspace (CG Guide 1; reference §5.3).
 */
import { describe, expect, it } from 'vitest'
import { SharedRecipeSchema } from '~~/utils/schemas/curation'
import { libraryRecipe } from '~~/tests/support/recipes'

const issues = (body: unknown) => {
  const parsed = SharedRecipeSchema.safeParse(body)
  return parsed.success ? [] : parsed.error.issues.map(i => ({ field: i.path.join('.'), message: i.message }))
}
const bands = (...rows: Array<[string, number, number | null, number]>) =>
  rows.map(([gaugeType, minFt, maxFt, psi]) => ({ gaugeType, minFt, maxFt, psi, source: 'CG Guide 4, Table 1' }))

describe('a shared tested recipe', () => {
  it('takes the published CG Guide 4 tables as they are', () => {
    expect(issues(libraryRecipe())).toEqual([])
  })

  it('refuses a table that does not start at sea level', () => {
    expect(issues(libraryRecipe({ pressureBands: bands(['dial', 1000, 2000, 11]) }))).toEqual([{ field: 'pressureBands.0.minFt', message: expect.stringMatching(/start at 0 ft/) }])
  })

  it('refuses a gap and an overlap between bands, naming the band that must move', () => {
    const gap = issues(libraryRecipe({ pressureBands: bands(['dial', 0, 2000, 11], ['dial', 2500, 4000, 12]) }))
    expect(gap).toEqual([{ field: 'pressureBands.1.minFt', message: expect.stringMatching(/start at 2,001 ft/) }])
    const overlap = issues(libraryRecipe({ pressureBands: bands(['dial', 0, 2000, 11], ['dial', 1500, 4000, 12]) }))
    expect(overlap.map(i => i.field)).toContain('pressureBands.1.minFt')
  })

  it('checks each gauge type on its own, whatever order the rows come in', () => {
    expect(issues(libraryRecipe({ pressureBands: bands(['weighted', 1001, null, 15], ['dial', 0, 2000, 11], ['weighted', 0, 1000, 10]) }))).toEqual([])
  })

  it('lets only the highest band stay open', () => {
    expect(issues(libraryRecipe({ pressureBands: bands(['weighted', 0, null, 10], ['weighted', 1001, null, 15]) })).map(i => i.field)).toContain('pressureBands.0.maxFt')
  })

  it('refuses a weighted-gauge pressure no weight gives', () => {
    expect(issues(libraryRecipe({ pressureBands: bands(['weighted', 0, null, 11]) }))).toEqual([{ field: 'pressureBands.0.psi', message: 'A weighted gauge gives 5, 10 or 15 psi.' }])
  })

  it('asks for the dry amount per jar when the source gives one', () => {
    const jars = [{ sizeKey: 'pint', processMinutes: 75, dryGrams: null, saltTsp: 0.5 }]
    expect(issues(libraryRecipe({ jars }))).toEqual([{ field: 'jars.0.dryGrams', message: expect.stringMatching(/dry amount per jar/) }])
    expect(issues(libraryRecipe({ jars, fillBasis: 'cap', solidsFillFraction: 0.75 }))).toEqual([])
  })

  it('refuses less than 1 inch of headspace, a process under 10 minutes, no citation and no reason', () => {
    const fields = issues(libraryRecipe({ headspaceMm: 12.7, jars: [{ sizeKey: 'pint', processMinutes: 0, dryGrams: 100, saltTsp: null }], source: 'USDA', reason: '' })).map(i => i.field)
    expect(fields).toEqual(expect.arrayContaining(['headspaceMm', 'jars.0.processMinutes', 'source', 'reason']))
  })

  it('refuses a jar size given twice', () => {
    const jar = { sizeKey: 'pint', processMinutes: 75, dryGrams: 160, saltTsp: 0.5 }
    expect(issues(libraryRecipe({ jars: [jar, jar] })).map(i => i.field)).toEqual(['jars'])
  })
})
