import { HouseholdPhotoParamsSchema } from '~~/utils/schemas/logbook'

/** A load photo, for members of its household only; another household's photo is a 404. */
export default defineEventHandler(async (event) => {
  const { params: { id, photoId }, db } = await requireHouseholdRole(event, HouseholdPhotoParamsSchema, 'helper')
  const { photo, data } = await readPhoto(db, id, photoId)
  setResponseHeaders(event, {
    'content-type': photo.contentType,
    'content-length': data.byteLength,
    'cache-control': 'private, max-age=3600',
    'x-content-type-options': 'nosniff',
  })
  return data
})
