// Writes from other sites and bodies the API does not take: a form posted from a page of another
// origin must not reach a case, a body of another type is refused by its type, and a body larger
// than the limit is refused before it is read.
import { request as httpRequest } from 'node:http'
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, BASE_URL, DEMO, signedIn } from '../helpers'
import { openCase } from '../uploads/fixtures'

let tech: ApiClient
let caseId: number

beforeAll(async () => {
  tech = await signedIn(DEMO.tech)
  ;({ id: caseId } = await openCase(tech, 'Cross-site checks'))
})

const notesOf = async () => ((await tech.get(`/api/cases/${caseId}`)).body.events as { kind: string }[]).length

describe('cross-site writes', () => {
  it('refuses a write carrying another origin with 403, and writes nothing', async () => {
    const before = await notesOf()
    for (const origin of ['http://127.0.0.1:1', 'http://evil.example', 'null']) {
      const res = await tech.request('POST', `/api/cases/${caseId}/notes`, { text: 'From elsewhere' }, { headers: { origin } })
      expect(res.status, origin).toBe(403)
      expect(res.body.message).toBe('Requests from other sites are refused')
    }
    const fetchSite = await tech.request('POST', `/api/cases/${caseId}/notes`, { text: 'From elsewhere' }, { headers: { 'sec-fetch-site': 'cross-site' } })
    expect(fetchSite.status).toBe(403)
    expect(await notesOf()).toBe(before)
    // The site's own origin writes.
    const own = await tech.request('POST', `/api/cases/${caseId}/notes`, { text: 'From the app' }, { headers: { origin: BASE_URL } })
    expect(own.status).toBe(200)
  })

  it('refuses form-encoded, multipart and plain-text bodies on JSON routes with 415', async () => {
    const before = await notesOf()
    const form = new FormData()
    form.append('text', 'A form note')
    const bodies: [string, BodyInit, Record<string, string>][] = [
      ['form-encoded', 'text=A+form+note', { 'content-type': 'application/x-www-form-urlencoded' }],
      ['plain text', '{"text":"A text note"}', { 'content-type': 'text/plain' }],
      ['multipart', form, {}],
    ]
    for (const [what, body, headers] of bodies) {
      const res = await fetch(`${BASE_URL}/api/cases/${caseId}/notes`, { method: 'POST', body, headers: { ...headers, cookie: tech.cookie } })
      expect(res.status, what).toBe(415)
    }
    // Signing in takes JSON only too.
    const login = await fetch(`${BASE_URL}/api/auth/login`, { method: 'POST', body: `email=${DEMO.tech}&password=x`, headers: { 'content-type': 'application/x-www-form-urlencoded' } })
    expect(login.status).toBe(415)
    expect(await notesOf()).toBe(before)
  })
})

/**
 * Sends a raw request, optionally chunked (no length declared), and resolves with the status as
 * soon as it comes; with `end` false the body is left unfinished, as a client still sending would.
 */
function rawPost(path: string, chunks: Buffer[], headers: Record<string, string>, end = true): Promise<number> {
  return new Promise((resolve, reject) => {
    const url = new URL(path, BASE_URL)
    const req = httpRequest({ host: url.hostname, port: url.port, path: url.pathname, method: 'POST', headers }, (res) => {
      res.resume()
      resolve(res.statusCode ?? 0)
      req.destroy()
    })
    req.on('error', (error) => ((error as NodeJS.ErrnoException).code === 'EPIPE' || (error as NodeJS.ErrnoException).code === 'ECONNRESET' ? undefined : reject(error)))
    let i = 0
    const next = () => {
      if (i >= chunks.length) return end ? req.end() : undefined
      if (req.write(chunks[i++]!)) setImmediate(next)
      else req.once('drain', next)
    }
    next()
  })
}

describe('body size', () => {
  it('refuses a JSON body over 1 MB with 413, declared or chunked, and signs in with a small one', async () => {
    const big = Buffer.from(JSON.stringify({ email: DEMO.tech, password: 'x'.repeat(2 * 1024 * 1024) }))
    expect(await rawPost('/api/auth/login', [big.subarray(0, 65536)], { 'content-type': 'application/json', 'content-length': String(big.length) }, false)).toBe(413)
    const pieces = Array.from({ length: 40 }, (_, i) => big.subarray(i * 65536, (i + 1) * 65536)).filter((b) => b.length)
    expect(await rawPost('/api/auth/login', pieces, { 'content-type': 'application/json', 'transfer-encoding': 'chunked' })).toBe(413)
    // A small chunked body still reads.
    const small = Buffer.from(JSON.stringify({ email: DEMO.tech, password: 'rimecase-demo' }))
    expect(await rawPost('/api/auth/login', [small.subarray(0, 10), small.subarray(10)], { 'content-type': 'application/json', 'transfer-encoding': 'chunked' })).toBe(200)
  })

  it('lets a client that sends the whole of a body somewhat over the limit read its 413, every time', async () => {
    // fetch writes the body before it reads the answer: a socket closed under it would fail with
    // EPIPE or a reset instead of the 413.
    const statuses: (number | string)[] = []
    for (const size of [1.2, 2, 4, 8, 12]) {
      const body = JSON.stringify({ email: DEMO.tech, password: 'x'.repeat(Math.round(size * 1024 * 1024)) })
      for (let i = 0; i < 6; i++) {
        try {
          const res = await fetch(`${BASE_URL}/api/auth/login`, { method: 'POST', body, headers: { 'content-type': 'application/json' } })
          await res.arrayBuffer()
          statuses.push(res.status)
        } catch (error) {
          const cause = (error as Error).cause as NodeJS.ErrnoException | undefined
          statuses.push(`${size} MB: ${cause?.code ?? (error as Error).message}`)
        }
      }
    }
    expect(statuses).toEqual(statuses.map(() => 413))
  })

  it('answers before reading a body declared too large, and keeps answering others', async () => {
    const started = Date.now()
    // 64 MB announced, 64 KB sent: the answer comes without waiting for the rest.
    const refused = await Promise.all(Array.from({ length: 4 }, () =>
      rawPost('/api/auth/login', [Buffer.alloc(65536, 'a')], { 'content-type': 'application/json', 'content-length': String(64 * 1024 * 1024) }, false)))
    expect(refused).toEqual([413, 413, 413, 413])
    const health = await fetch(`${BASE_URL}/api/health`)
    expect(health.status).toBe(200)
    expect(Date.now() - started).toBeLessThan(10_000)
  })
})
