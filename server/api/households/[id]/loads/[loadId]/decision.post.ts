import { UnsafeLoadDecisionSchema } from '~~/utils/schemas/day'
import { HouseholdLoadParamsSchema } from '~~/utils/schemas/logbook'

/** An under-processed load's jars: refrigerate or reprocess, decided at once, with no seal check to wait for (helpers too). */
export default defineEventHandler(async (event) => {
  const { params: { id, loadId }, db, user } = await requireHouseholdRole(event, HouseholdLoadParamsSchema, 'helper')
  const { action } = await validBody(event, UnsafeLoadDecisionSchema)
  return decideUnsafeLoad(db, id, user.id, loadId, action)
})
