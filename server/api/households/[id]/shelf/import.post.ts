import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'

/**
 * Import a Shelf inventory from CSV (canner and up): the body is the CSV text (text/csv) or
 * JSON { csv }. All rows or none: any bad row answers 400 with every problem by line number.
 */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'canner')
  const type = getRequestHeader(event, 'content-type') ?? ''
  const text = type.includes('json') ? (await readBody<{ csv?: unknown }>(event))?.csv : await readRawBody(event, 'utf8')
  if (typeof text !== 'string' || !text.trim()) {
    throw createError({ statusCode: 400, message: 'csv: Send the inventory as CSV text.', data: { issues: [{ line: 0, field: 'csv', message: 'Send the inventory as CSV text.' }] } })
  }
  if (text.length > 2_000_000) throw createError({ statusCode: 413, message: 'That file is larger than 2 MB; split it.' })
  const result = await importShelfCsv(db, id, text)
  if (result.issues.length) {
    const first = result.issues[0]!
    throw createError({ statusCode: 400, message: `Nothing was imported. Line ${first.line}, ${first.field}: ${first.message}`, data: { issues: result.issues } })
  }
  setResponseStatus(event, 201)
  return result
})
