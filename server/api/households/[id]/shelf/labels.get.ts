import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { LabelQuerySchema } from '~~/utils/schemas/shelf'

/**
 * The jar labels to print (any member): ?lots=<id,id> or ?load=<id> (default the whole Shelf),
 * one label per jar left or ?count=<n> of each lot. `publicUrl` is SHELFSTEAD_PUBLIC_URL when it
 * is set; otherwise the page builds the QR links from the address it was opened at.
 */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const query = validQuery(event, LabelQuerySchema)
  const settings = serverSettings()
  return { layout: query.layout, lots: await labelLots(db, id, query), publicUrl: settings.publicUrlSet ? settings.publicUrl : null }
})
