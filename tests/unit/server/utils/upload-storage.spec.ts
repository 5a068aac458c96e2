import { createServer, type Server } from 'node:http'
import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { createStorage } from 'unstorage'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { uploadDriverFrom, uploadKeys } from '#server/utils/upload-storage'

const bytes = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 1, 2, 3, 255])
const keys = uploadKeys(7, '0b5c-uuid')

describe('upload storage on the local disk', () => {
  const base = mkdtempSync(join(tmpdir(), 'rimecase-uploads-'))
  afterAll(() => rmSync(base, { recursive: true, force: true }))

  it('writes raw bytes under org-{id}/{uuid} and reads them back', async () => {
    const storage = createStorage({ driver: uploadDriverFrom({ uploadDriver: 'fs', uploadDir: base }) })
    await storage.setItemRaw(keys.file, bytes)
    expect(readFileSync(join(base, 'org-7', '0b5c-uuid')).equals(bytes)).toBe(true)
    expect(Buffer.from((await storage.getItemRaw(keys.file)) as Uint8Array).equals(bytes)).toBe(true)
    expect(await storage.getItemRaw(keys.thumb)).toBeNull()
  })

  it('uses the disk when no driver is named', () => {
    expect(uploadDriverFrom({ uploadDriver: '', uploadDir: base }).name).toBe('fs')
  })
})

// A few lines of S3: PUT stores, GET returns, both under /{bucket}/{key}. Enough to see that the
// driver is wired to the configured endpoint and bucket and signs its requests.
describe('upload storage in an S3-compatible bucket', () => {
  const objects = new Map<string, Buffer>()
  let server: Server
  let endpoint = ''

  beforeAll(async () => {
    server = createServer((req, res) => {
      const chunks: Buffer[] = []
      req.on('data', (c: Buffer) => chunks.push(c)).on('end', () => {
        if (!String(req.headers.authorization).startsWith('AWS4-HMAC-SHA256')) return void res.writeHead(403).end()
        if (req.method === 'PUT') objects.set(req.url!, Buffer.concat(chunks))
        else if (req.method === 'GET' && objects.has(req.url!)) return void res.writeHead(200).end(objects.get(req.url!))
        else if (req.method !== 'PUT') return void res.writeHead(404).end()
        res.writeHead(200).end()
      })
    })
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
    const address = server.address()
    endpoint = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`
  })
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())))

  it('stores and reads bytes through the configured bucket', async () => {
    const s3 = { endpoint, bucket: 'rimecase-test', region: 'auto', accessKeyId: 'test-key', secretAccessKey: 'test-secret' }
    const storage = createStorage({ driver: uploadDriverFrom({ uploadDriver: 's3', s3 }) })
    await storage.setItemRaw(keys.file, bytes)
    expect(objects.get('/rimecase-test/org-7/0b5c-uuid')?.equals(bytes)).toBe(true)
    const back = await storage.getItemRaw(keys.file)
    expect(Buffer.from(back as ArrayBuffer).equals(bytes)).toBe(true)
  })

  it('names the missing setting when S3 is chosen but not configured', () => {
    expect(() => uploadDriverFrom({ uploadDriver: 's3', s3: { endpoint, bucket: 'b', region: '', accessKeyId: 'k', secretAccessKey: 's' } })).toThrow(/NUXT_S3_REGION/)
    expect(() => uploadDriverFrom({ uploadDriver: 'ftp' })).toThrow(/"fs" or "s3"/)
  })
})
