import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { LabelQuerySchema } from '~~/utils/schemas/shelf'

/** The jar labels to print: ?lots=<id,id> (default the whole Shelf), one label per jar left (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const query = validQuery(event, LabelQuerySchema)
  const ids = query.lots ? query.lots.split(',').map(s => s.trim()).filter(Boolean) : null
  return { layout: query.layout, lots: await labelLots(db, id, ids) }
})
