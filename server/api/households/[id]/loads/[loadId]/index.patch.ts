import { HouseholdLoadParamsSchema, LoadUpdateSchema } from '../../../../../../utils/schemas/logbook'

/** Record how a pending reprocessing load was run, or change a load's notes (canner and up). */
export default defineEventHandler(async (event) => {
  const { id, loadId } = await getValidatedRouterParams(event, validateWith(HouseholdLoadParamsSchema))
  const body = await readValidatedBody(event, validateWith(LoadUpdateSchema))
  const { db } = await requireHouseholdRole(event, id, 'canner')
  return updateLoad(db, id, loadId, body)
})
