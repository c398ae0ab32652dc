import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** The Shelf as CSV, in the columns the import reads (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  setResponseHeaders(event, { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': 'attachment; filename="shelfstead-shelf.csv"' })
  return shelfCsv(db, id)
})
