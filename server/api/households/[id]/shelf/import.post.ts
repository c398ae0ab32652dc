import { MAX_CSV_BYTES } from '~~/utils/defaults'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/**
 * Import a Shelf inventory from CSV (canner and up): the body is the CSV text (text/csv) or
 * JSON { csv }. All rows or none: any bad row answers 400 with every problem by line number.
 * Rows naming a lot already on this Shelf (an export read back) are skipped and counted;
 * 201 when lots were added, 200 when every row was skipped.
 */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'canner')
  const type = getRequestHeader(event, 'content-type') ?? ''
  const text = type.includes('json')
    ? (await readBody<{ csv?: unknown } | null>(event).catch(() => badInput('body', 'Send the inventory as JSON { csv } or as text/csv.')))?.csv
    : await readRawBody(event, 'utf8')
  if (typeof text !== 'string' || !text.trim()) {
    badInput('csv', 'Send the inventory as CSV text.')
  }
  if (Buffer.byteLength(text) > MAX_CSV_BYTES) tooLarge('That file is larger than 2 MB; split it.', 'csv')
  const result = await importShelfCsv(db, id, user.id, text)
  if (result.imported === undefined) {
    const first = result.issues[0]!
    badInput(first.field, `Nothing was imported. Line ${first.line}: ${first.message}`, result.issues)
  }
  if (result.imported) setResponseStatus(event, 201)
  return result
})
