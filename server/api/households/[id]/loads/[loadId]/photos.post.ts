import { HouseholdLoadParamsSchema } from '~~/utils/schemas/logbook'

/**
 * Attach a photo to a load (canner and up): multipart field "photo", JPEG, PNG or WebP by its
 * content (magic bytes), at most 8 MB. The body was counted as it streamed and refused past the
 * limit before it reached here (`server/utils/bodyLimit.ts`).
 */
export default defineEventHandler(async (event) => {
  const { params: { id, loadId }, db, user } = await requireHouseholdRole(event, HouseholdLoadParamsSchema, 'canner')
  await requireLoad(db, id, loadId)
  const parts = await readMultipartFormData(event)
  const file = parts?.find(p => p.name === 'photo' && p.filename !== undefined)
  if (!file) badInput('photo', 'Choose a photo to upload.')
  const photo = await savePhoto(db, { householdId: id, loadId, userId: user.id, bytes: file.data, name: file.filename ?? '' })
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'photo', summary: 'Added a photo to a load', detail: { loadId } })
  setResponseStatus(event, 201)
  return photo
})
