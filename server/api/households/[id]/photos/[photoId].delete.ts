import { HouseholdPhotoParamsSchema } from '../../../../../utils/schemas/logbook'

export default defineEventHandler(async (event) => {
  const { id, photoId } = await getValidatedRouterParams(event, validateWith(HouseholdPhotoParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'canner')
  await deletePhoto(db, id, photoId)
  setResponseStatus(event, 204)
  return null
})
