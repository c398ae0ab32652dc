import { join } from 'node:path'
import { createStorage, type Storage } from 'unstorage'
import fsDriver from 'unstorage/drivers/fs'
import s3Driver from 'unstorage/drivers/s3'
import { resolveDataDir } from './dataDir'
import { serverSettings } from './settings'

/**
 * Where photos are kept. SHELFSTEAD_STORAGE=s3 uses an S3-compatible bucket (S3_ENDPOINT,
 * S3_BUCKET, S3_REGION, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY); anything else keeps them in
 * `photos/` under the data directory.
 */
let storage: Storage | undefined

export function usePhotoStorage(): Storage {
  if (storage) return storage
  const { storage: kind, s3 } = serverSettings()
  if (kind === 's3') {
    const { endpoint, bucket, region, accessKeyId, secretAccessKey } = s3
    if (!endpoint || !bucket || !accessKeyId || !secretAccessKey) {
      const missing = Object.entries({ S3_ENDPOINT: endpoint, S3_BUCKET: bucket, S3_ACCESS_KEY_ID: accessKeyId, S3_SECRET_ACCESS_KEY: secretAccessKey })
        .filter(([, value]) => !value).map(([name]) => name)
      throw new Error(`SHELFSTEAD_STORAGE=s3 needs ${missing.join(', ')}.`)
    }
    storage = createStorage({ driver: s3Driver({ endpoint, bucket, region, accessKeyId, secretAccessKey }) })
  }
  else {
    storage = createStorage({ driver: fsDriver({ base: join(resolveDataDir(), 'photos') }) })
  }
  return storage
}

export { MAX_PHOTO_BYTES } from '~~/utils/defaults'

export type { ImageType } from '~~/utils/vocabulary'

/** The image type from the file's first bytes (its "magic number"), never from its name or the browser's claim. */
export function detectImageType(bytes: Uint8Array): ImageType | null {
  const starts = (sig: number[], at = 0) => sig.every((b, i) => bytes[at + i] === b)
  if (bytes.length >= 3 && starts([0xFF, 0xD8, 0xFF])) return 'image/jpeg'
  if (bytes.length >= 8 && starts([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A])) return 'image/png'
  // RIFF <size> WEBP
  if (bytes.length >= 12 && starts([0x52, 0x49, 0x46, 0x46]) && starts([0x57, 0x45, 0x42, 0x50], 8)) return 'image/webp'
  return null
}

export const imageExtension: Record<ImageType, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' }
