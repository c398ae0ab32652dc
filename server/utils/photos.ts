import { and, eq } from 'drizzle-orm'
import type { Database } from './database'

/** Store a photo of a load: checked by its content, at most 8 MB, keyed by household. */
export async function savePhoto(db: Database, input: { householdId: string, loadId: string, userId: string, bytes: Buffer, name: string }) {
  if (input.bytes.byteLength > MAX_PHOTO_BYTES) {
    tooLarge('That photo is larger than 8 MB. Send a smaller one (phones can share a reduced size).', 'photo')
  }
  const type = detectImageType(input.bytes)
  if (!type) {
    badInput('photo', 'That file is not a JPEG, PNG or WebP picture (checked by its content, not its name).')
  }
  const id = crypto.randomUUID()
  const key = `${input.householdId}:${id}.${imageExtension[type]}`
  // The file first: a photo store that is down leaves no row pointing at a missing file.
  await usePhotoStorage().setItemRaw(key, input.bytes).catch((error) => {
    console.error('[shelfstead] Photo store refused an upload:', error)
    unavailable('The photo store did not answer, so the photo was not saved. Try again in a moment.', 'photo')
  })
  try {
    const [photo] = await db.insert(tables.loadPhotos).values({
      id, householdId: input.householdId, loadId: input.loadId, storageKey: key, contentType: type,
      bytes: input.bytes.byteLength, originalName: input.name.slice(0, 200), uploadedBy: input.userId,
    }).returning()
    return photo!
  }
  catch (error) {
    await usePhotoStorage().removeItem(key).catch(() => {})
    throw error
  }
}

async function requirePhoto(db: Database, householdId: string, photoId: string) {
  const [photo] = await db.select().from(tables.loadPhotos)
    .where(and(eq(tables.loadPhotos.id, photoId), eq(tables.loadPhotos.householdId, householdId)))
  if (!photo) notFound('No such photo in this household.')
  return photo
}

export async function readPhoto(db: Database, householdId: string, photoId: string) {
  const photo = await requirePhoto(db, householdId, photoId)
  const raw = await usePhotoStorage().getItemRaw(photo.storageKey).catch((error) => {
    console.error('[shelfstead] Photo store did not answer a read:', error)
    unavailable('The photo store did not answer. Try again in a moment.')
  })
  if (!raw) notFound('The photo file is missing from storage.')
  const data = Buffer.isBuffer(raw) ? raw : Buffer.from(raw as ArrayBuffer)
  return { photo, data }
}

export async function deletePhoto(db: Database, householdId: string, photoId: string) {
  const photo = await requirePhoto(db, householdId, photoId)
  await db.delete(tables.loadPhotos).where(eq(tables.loadPhotos.id, photo.id))
  // The row is gone, so nothing points at the file; a store that is down only leaves it behind.
  await usePhotoStorage().removeItem(photo.storageKey).catch(error => console.error('[shelfstead] Photo file left in the store:', photo.storageKey, error))
}
