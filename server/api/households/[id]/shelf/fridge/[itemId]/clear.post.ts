import { FridgeParamsSchema } from '../../../../../../../utils/schemas/shelf'

/** The refrigerated jars were eaten (or thrown out): off the list, jars back to jar stock (canner and up). */
export default defineEventHandler(async (event) => {
  const { id, itemId } = await getValidatedRouterParams(event, validateWith(FridgeParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'canner')
  return clearFridgeItem(db, id, itemId)
})
