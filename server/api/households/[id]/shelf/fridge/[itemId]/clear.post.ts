import { FridgeParamsSchema } from '~~/utils/schemas/shelf'

/** The refrigerated jars were eaten (or thrown out): off the list, jars back to jar stock (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id, itemId }, db, user } = await requireHouseholdRole(event, FridgeParamsSchema, 'helper')
  const shelf = await clearFridgeItem(db, id, itemId)
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'shelf', summary: 'Cleared jars from the refrigerator list' })
  return shelf
})
