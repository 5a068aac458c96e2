// Where upload bytes live: Nitro storage mount "uploads", on the local disk by default or in an
// S3-compatible bucket when NUXT_UPLOAD_DRIVER=s3. server/plugins/upload-storage.ts mounts it;
// server/utils/uploads.ts reads and writes through useStorage('uploads').
import { createReadStream } from 'node:fs'
import { stat } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { Readable } from 'node:stream'
import { AwsClient } from 'aws4fetch'
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

/** A stored file as a stream of bytes, with its size; `end` (exclusive) reads only the head. */
export interface StoredStream {
  stream: Readable
  size: number
}

/**
 * Opens a stored upload as a byte stream, so a large file (a 50 MB logger export) is read in small
 * chunks and never held whole: from the disk for the fs driver, from the bucket's GET body for S3.
 * `end` stops the stream after that many bytes. Resolves to null when the file is missing.
 */
export async function openStoredStream(config: UploadStorageSettings, key: string, end?: number): Promise<StoredStream | null> {
  const parsed = UploadStorageConfigSchema.parse({ ...config, uploadDriver: config.uploadDriver || 'fs' })
  const segments = key.split(/[:/\\]/).filter(Boolean)
  if (!segments.length || segments.some((s) => s === '..' || s === '.')) throw new Error(`Not a storage key: ${JSON.stringify(key)}`)
  if (parsed.uploadDriver === 'fs') {
    const path = join(resolve(parsed.uploadDir), ...segments)
    const size = await stat(path).then((s) => s.size, () => null)
    if (size === null) return null
    const last = end === undefined ? size : Math.min(size, end)
    // An empty range would make createReadStream read nothing only with end = -1.
    const stream = last === 0 ? Readable.from([]) : createReadStream(path, { start: 0, end: last - 1, highWaterMark: 64 * 1024 })
    return { stream, size }
  }
  const s3 = parsed.s3
  const client = new AwsClient({ service: 's3', accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey, region: s3.region })
  const url = `${s3.endpoint.replace(/\/$/, '')}/${s3.bucket}/${segments.map(encodeURIComponent).join('/')}`
  const res = await fetch(await client.sign(url, { method: 'GET', headers: end === undefined ? {} : { range: `bytes=0-${Math.max(0, end - 1)}` } }))
  if (res.status === 404) return null
  if (!res.ok || !res.body) throw new Error(`Reading ${key} from the bucket failed: ${res.status} ${res.statusText}`)
  const range = /\/(\d+)$/.exec(res.headers.get('content-range') ?? '')
  const size = Number(range?.[1] ?? res.headers.get('content-length') ?? 0)
  return { stream: Readable.fromWeb(res.body as import('node:stream/web').ReadableStream<Uint8Array>), size }
}
