import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'

/** The Shelf, oldest first, with best-by warnings, the refrigerator list and the last take-off (any member). */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'helper')
  return listShelf(db, id)
})
