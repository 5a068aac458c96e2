// Every response, page or API, carries the protective headers and no product banner.
import { describe, expect, it } from 'vitest'
import { BASE_URL, DEMO, signedIn } from '../helpers'

describe('response headers', () => {
  it('protect pages, API answers and errors alike', async () => {
    const tech = await signedIn(DEMO.tech)
    const responses = [
      await fetch(`${BASE_URL}/login`),
      await fetch(`${BASE_URL}/api/health`),
      await fetch(`${BASE_URL}/api/units`, { headers: { cookie: tech.cookie } }),
      await fetch(`${BASE_URL}/api/units`),
      await fetch(`${BASE_URL}/api/no-such-route`),
    ]
    for (const res of responses) {
      const where = `${res.url} (${res.status})`
      expect(res.headers.get('x-content-type-options'), where).toBe('nosniff')
      expect(res.headers.get('x-frame-options'), where).toBe('DENY')
      // Error answers get the stricter 'no-referrer'.
      expect(['strict-origin-when-cross-origin', 'no-referrer'], where).toContain(res.headers.get('referrer-policy'))
      expect(res.headers.get('content-security-policy'), where).toContain("frame-ancestors 'none'")
      expect(res.headers.get('x-powered-by'), where).toBeNull()
    }
  })
})
