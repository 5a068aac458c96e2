// A server whose database cannot be reached says so: the health probe answers 503 with the reason,
// and a request that needs the database gets a 503 to try again later, never a 500.
import { createServer, type Server } from 'node:net'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startApp, type AppProcess } from '../app-process'
import { ApiClient, BASE_URL } from '../helpers'

let app: AppProcess
let closedPort: number
let holder: Server

beforeAll(async () => {
  // A loopback port that was free a moment ago and is closed again: connecting is refused.
  holder = createServer()
  await new Promise<void>((resolve) => holder.listen(0, '127.0.0.1', resolve))
  closedPort = (holder.address() as { port: number }).port
  await new Promise<void>((resolve) => holder.close(() => resolve()))
  app = await startApp({ NUXT_DATABASE_URL: `postgres://rimecase:x@127.0.0.1:${closedPort}/rimecase` }, 503)
}, 60_000)
afterAll(async () => {
  await app?.stop()
})

describe('GET /api/health', () => {
  it('answers 200 with the database up', async () => {
    const res = await fetch(`${BASE_URL}/api/health`)
    expect(res.status).toBe(200)
    expect(await res.json()).toEqual({ status: 'ok', db: true })
  })

  it('answers 503 with the reason when the database is unreachable', async () => {
    const res = await fetch(`${app.baseUrl}/api/health`)
    expect(res.status).toBe(503)
    expect(res.headers.get('retry-after')).toBe('5')
    expect(await res.json()).toEqual({ status: 'unavailable', reason: 'database unreachable', db: false })
  })
})

describe('a request that needs the database while it is unreachable', () => {
  it('gets a 503 with Retry-After after the bounded retries, not a 500', async () => {
    const client = new ApiClient(app.baseUrl)
    const started = Date.now()
    const res = await client.post('/api/auth/login', { email: 'tech@rimecase.demo', password: 'rimecase-demo' })
    expect(res.status).toBe(503)
    expect(res.headers.get('retry-after')).toBe('5')
    expect(res.body.message).toMatch(/database cannot be reached/i)
    // Four tries with waits of about 0.1, 0.2 and 0.4 s: bounded, not a hang.
    expect(Date.now() - started).toBeLessThan(10_000)
  })
})
