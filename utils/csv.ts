/**
 * CSV cells that a spreadsheet will not run as formulas, and read back as they were written.
 *
 * OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): no cell may begin with
 * `=`, `+`, `-`, `@`, tab or carriage return; prefix such a cell with a single quote and quote the
 * field. csv-stringify's `escape_formulas` does exactly that (and also for the full-width forms
 * of the four signs). To read an export back unchanged, a cell that already began with a quote
 * before one of those characters, or before another quote, gets one more quote on the way out;
 * the import then drops one leading quote wherever it stands before one of them.
 */
import type { Options as ParseOptions } from 'csv-parse'
import type { Options as StringifyOptions } from 'csv-stringify'

/** The characters that start a formula, with csv-stringify's full-width forms of = + - @. */
const FORMULA_START = '=+\\-@\\t\\r\\uFF1D\\uFF0B\\uFF0D\\uFF20'
const NEUTRALISED = new RegExp(`^'(?=['${FORMULA_START}])`)
const QUOTE_NEEDED = new RegExp(`^['${FORMULA_START}]`)

/** csv-stringify options for a file that opens safely in a spreadsheet. */
export const formulaSafeCsv: StringifyOptions = {
  escape_formulas: true,
  quoted_match: [QUOTE_NEEDED],
  cast: { string: value => (NEUTRALISED.test(value) ? `'${value}` : value) },
}

/** csv-parse options for a file a person may have edited: a BOM, blank lines, short rows and padding around cells. */
export const forgivingCsv: ParseOptions = { bom: true, skip_empty_lines: true, relax_column_count: true, trim: true }

/** A cell as it was before export: one neutralising quote dropped. Other cells are unchanged. */
export function restoreCell(cell: string): string {
  return NEUTRALISED.test(cell) ? cell.slice(1) : cell
}
