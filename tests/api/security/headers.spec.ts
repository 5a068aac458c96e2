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

  it('give pages a content security policy with a fresh script nonce and nothing inline or foreign', async () => {
    const first = await fetch(`${BASE_URL}/login`)
    const second = await fetch(`${BASE_URL}/login`)
    const policy = first.headers.get('content-security-policy') ?? ''
    const directives = Object.fromEntries(policy.split(';').map((d) => d.trim()).filter(Boolean).map((d) => [d.split(/\s+/)[0], d.split(/\s+/).slice(1)]))
    const nonce = /'nonce-([^']+)'/.exec(directives['script-src']?.join(' ') ?? '')?.[1]
    expect(nonce, policy).toBeTruthy()
    expect(directives['script-src']).toContain("'strict-dynamic'")
    expect(directives['script-src']).not.toContain("'unsafe-inline'")
    expect(directives['script-src']).not.toContain("'unsafe-eval'")
    expect(directives['script-src-attr']).toEqual(["'none'"])
    expect(directives['object-src']).toEqual(["'none'"])
    expect(directives['frame-ancestors']).toEqual(["'none'"])
    expect(directives['base-uri']).toEqual(["'none'"])
    expect(policy).not.toMatch(/https:|http:|\*/)
    // Every script tag of the page carries this response's nonce, and the next response has another.
    const html = await first.text()
    const scripts = html.match(/<script\b[^>]*>/g) ?? []
    expect(scripts.length).toBeGreaterThan(0)
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`)
    // The chunk preloader finds the nonce here for the preloads it adds later.
    expect(html).toContain(`<meta property="csp-nonce" nonce="${nonce}">`)
    expect(second.headers.get('content-security-policy')).not.toContain(nonce!)
    expect(first.headers.get('cross-origin-opener-policy')).toBe('same-origin')
  })

  it('give API answers a policy that loads nothing', async () => {
    const res = await fetch(`${BASE_URL}/api/health`)
    expect(res.headers.get('content-security-policy')).toContain("default-src 'none'")
  })
})
