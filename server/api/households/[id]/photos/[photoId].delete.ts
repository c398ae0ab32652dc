import { HouseholdPhotoParamsSchema } from '~~/utils/schemas/logbook'

export default defineEventHandler(async (event) => {
  const { params: { id, photoId }, db } = await requireHouseholdRole(event, HouseholdPhotoParamsSchema, 'canner')
  await deletePhoto(db, id, photoId)
  setResponseStatus(event, 204)
  return null
})
