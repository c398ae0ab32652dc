import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** Loads awaiting their seal check, pending reprocessing loads, seal rates and the refrigerator list (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const [awaiting, rates, fridge] = await Promise.all([loadsAwaitingCheck(db, id), sealRates(db, id), fridgeList(db, id)])
  return { ...awaiting, rates, fridge }
})
