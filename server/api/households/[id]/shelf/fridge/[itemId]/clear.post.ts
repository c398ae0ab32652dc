import { FridgeParamsSchema } from '~~/utils/schemas/shelf'

/** The refrigerated jars were eaten (or thrown out): off the list, jars back to jar stock (canner and up). */
export default defineEventHandler(async (event) => {
  const { params: { id, itemId }, db } = await requireHouseholdRole(event, FridgeParamsSchema, 'canner')
  return clearFridgeItem(db, id, itemId)
})
