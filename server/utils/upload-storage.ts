// Where upload bytes live: Nitro storage mount "uploads", on the local disk by default or in an
// S3-compatible bucket when NUXT_UPLOAD_DRIVER=s3. server/plugins/upload-storage.ts mounts it;
// server/utils/uploads.ts reads and writes through useStorage('uploads').
import { z } from 'zod'
import fsDriver from 'unstorage/drivers/fs'
import s3Driver from 'unstorage/drivers/s3'
import type { Driver } from 'unstorage'

const required = (what: string) => z.string({ error: `${what} is required for S3 uploads` }).trim().min(1, `${what} is required for S3 uploads`)

const UploadStorageConfigSchema = z.discriminatedUnion('uploadDriver', [
  z.object({ uploadDriver: z.literal('fs'), uploadDir: z.string().trim().min(1).default('.data/uploads') }),
  z.object({
    uploadDriver: z.literal('s3'),
    s3: z.object({
      endpoint: z.url({ error: 'NUXT_S3_ENDPOINT must be a URL' }),
      bucket: required('NUXT_S3_BUCKET'),
      region: required('NUXT_S3_REGION'),
      accessKeyId: required('NUXT_S3_ACCESS_KEY_ID'),
      secretAccessKey: required('NUXT_S3_SECRET_ACCESS_KEY'),
    }),
  }),
], { error: 'NUXT_UPLOAD_DRIVER must be "fs" or "s3"' })

/** The runtime config fields that choose and configure the driver, as strings from the environment. */
export interface UploadStorageSettings {
  uploadDriver?: string
  uploadDir?: string
  s3?: { endpoint?: string; bucket?: string; region?: string; accessKeyId?: string; secretAccessKey?: string }
}

/**
 * The storage driver for uploads from runtime config. Throws at start-up with the missing
 * setting named, rather than failing on the first photo a technician sends.
 */
export function uploadDriverFrom(config: UploadStorageSettings): Driver {
  const parsed = UploadStorageConfigSchema.safeParse({ ...config, uploadDriver: config.uploadDriver || 'fs' })
  if (!parsed.success) {
    throw new Error(`Upload storage is misconfigured: ${parsed.error.issues.map((i) => i.message).join('; ')}`)
  }
  const c = parsed.data
  return c.uploadDriver === 's3' ? s3Driver({ ...c.s3 }) : fsDriver({ base: c.uploadDir })
}

/** The storage key of an upload's file; the thumbnail sits beside it. */
export function uploadKeys(organisationId: number, uuid: string) {
  return { file: `org-${organisationId}/${uuid}`, thumb: `org-${organisationId}/${uuid}-thumb` }
}
