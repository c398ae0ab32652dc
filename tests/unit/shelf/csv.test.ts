/**
 * Shelf CSV cells: neutralised against formula injection on the way out, read back unchanged.
 * The rule checked is OWASP's, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection):
 * a cell must not begin with =, +, -, @, tab or carriage return; such a cell gets a leading
 * single quote.
 */
import { parse } from 'csv-parse/sync'
import { stringify } from 'csv-stringify/sync'
import { fc, test } from '@fast-check/vitest'
import { describe, expect, it } from 'vitest'
import { forgivingCsv, formulaSafeCsv, restoreCell } from '~~/utils/csv'

const written = (cell: string) => stringify([[cell, 'x']], formulaSafeCsv)
const readBack = (cell: string) => restoreCell((parse(written(cell), forgivingCsv) as string[][])[0]![0]!)
const OWASP_START = ['=', '+', '-', '@', '\t', '\r']

describe('Shelf CSV cells', () => {
  it.each(OWASP_START)('a cell starting with %j is written with a leading single quote, quoted', (start) => {
    const line = written(`${start}1+2`)
    expect(line.startsWith(`"'${start}1+2"`)).toBe(true)
  })

  it('writes =HYPERLINK("http://x","y") as OWASP shows: quote-prefixed, quoted, inner quotes doubled', () => {
    expect(written('=HYPERLINK("http://x","y")')).toBe('"\'=HYPERLINK(""http://x"",""y"")",x\n')
  })

  it('leaves ordinary cells as they are', () => {
    expect(written('Pinto beans, hot pack')).toBe('"Pinto beans, hot pack",x\n')
    expect(written('Navy bean soup')).toBe('Navy bean soup,x\n')
  })

  it.each(['-5 bean soup', '=HYPERLINK("http://x","y")', '+1 jar', '@home', '\'=already quoted', '\'\'', '\'Tis the season', '\'', '\uFF1Dfull-width'])('reads %j back unchanged', (cell) => {
    expect(readBack(cell)).toBe(cell)
  })

  it('reads a cell a spreadsheet neutralised itself back to its text', () => {
    expect(restoreCell('\'=SUM(A1)')).toBe('=SUM(A1)')
    expect(restoreCell('\'Tis')).toBe('\'Tis')
  })

  // The import trims cells, so the property covers what a product name can be: no padding.
  test.prop([fc.string({ unit: fc.constantFrom('=', '+', '-', '@', '\'', '\t', '"', ',', 'a', ' ', '\n'), maxLength: 12 }).filter(s => s === s.trim())])(
    'any cell reads back as written, and no written cell starts a formula',
    (cell) => {
      expect(readBack(cell)).toBe(cell)
      const raw = (parse(written(cell), { ...forgivingCsv, trim: false }) as string[][])[0]![0]!
      expect(OWASP_START).not.toContain(raw[0])
    },
  )
})
