import { createServer, type Server } from 'node:http'
import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { createStorage } from 'unstorage'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openStoredStream, uploadDriverFrom, uploadKeys } from '#server/utils/upload-storage'

async function drain(stream: NodeJS.ReadableStream): Promise<{ bytes: Buffer; chunks: number }> {
  const chunks: Buffer[] = []
  for await (const c of stream) chunks.push(Buffer.from(c as Uint8Array))
  return { bytes: Buffer.concat(chunks), chunks: chunks.length }
}

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

  it('streams a stored file from the disk in chunks, whole or only its head, and answers null for a missing one', async () => {
    const storage = createStorage({ driver: uploadDriverFrom({ uploadDriver: 'fs', uploadDir: base }) })
    const big = Buffer.alloc(300 * 1024, 0x61)
    await storage.setItemRaw('org-7/logger-big', big)
    const whole = await openStoredStream({ uploadDriver: 'fs', uploadDir: base }, 'org-7/logger-big')
    expect(whole!.size).toBe(big.length)
    const read = await drain(whole!.stream)
    expect(read.bytes.equals(big)).toBe(true)
    // 64 KB chunks: the file is never held whole by the reader.
    expect(read.chunks).toBeGreaterThanOrEqual(5)
    const head = await openStoredStream({ uploadDriver: 'fs', uploadDir: base }, 'org-7/logger-big', 1000)
    expect((await drain(head!.stream)).bytes.length).toBe(1000)
    expect(await openStoredStream({ uploadDriver: 'fs', uploadDir: base }, 'org-7/none')).toBeNull()
    await expect(openStoredStream({ uploadDriver: 'fs', uploadDir: base }, 'org-7/../../etc/passwd')).rejects.toThrow(/Not a storage key/)
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
        else if (req.method === 'GET' && objects.has(req.url!)) {
          const body = objects.get(req.url!)!
          const range = /^bytes=0-(\d+)$/.exec(String(req.headers.range ?? ''))
          if (!range) return void res.writeHead(200, { 'content-length': body.length }).end(body)
          const part = body.subarray(0, Number(range[1]) + 1)
          return void res.writeHead(206, { 'content-range': `bytes 0-${part.length - 1}/${body.length}` }).end(part)
        }
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

  it('streams a stored object from the bucket, whole or only its head by a signed range request', async () => {
    const s3 = { endpoint, bucket: 'rimecase-test', region: 'auto', accessKeyId: 'test-key', secretAccessKey: 'test-secret' }
    const storage = createStorage({ driver: uploadDriverFrom({ uploadDriver: 's3', s3 }) })
    const big = Buffer.from('time,cabinet\n'.repeat(5000))
    await storage.setItemRaw('org-7/logger-s3', big)
    const whole = await openStoredStream({ uploadDriver: 's3', s3 }, 'org-7/logger-s3')
    expect(whole!.size).toBe(big.length)
    expect((await drain(whole!.stream)).bytes.equals(big)).toBe(true)
    const head = await openStoredStream({ uploadDriver: 's3', s3 }, 'org-7/logger-s3', 100)
    expect(head!.size).toBe(big.length)
    expect((await drain(head!.stream)).bytes.equals(big.subarray(0, 100))).toBe(true)
    expect(await openStoredStream({ uploadDriver: 's3', s3 }, 'org-7/none')).toBeNull()
  })

  it('names the missing setting when S3 is chosen but not configured', () => {
    expect(() => uploadDriverFrom({ uploadDriver: 's3', s3: { endpoint, bucket: 'b', region: '', accessKeyId: 'k', secretAccessKey: 's' } })).toThrow(/NUXT_S3_REGION/)
    expect(() => uploadDriverFrom({ uploadDriver: 'ftp' })).toThrow(/"fs" or "s3"/)
  })
})
