import { HouseholdPhotoParamsSchema } from '~~/utils/schemas/logbook'

export default defineEventHandler(async (event) => {
  const { params: { id, photoId }, db, user } = await requireHouseholdRole(event, HouseholdPhotoParamsSchema, 'canner')
  await deletePhoto(db, id, photoId)
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'photo', summary: 'Removed a photo of a load' })
  setResponseStatus(event, 204)
  return null
})
