import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** The Shelf, oldest first, with best-by warnings, the refrigerator list and the last take-off (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  return listShelf(db, id)
})
