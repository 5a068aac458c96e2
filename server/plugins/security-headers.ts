// Headers every response carries: no MIME sniffing, no framing by other sites, a referrer that
// never carries a path to another origin, and no product banner.
const HEADERS: Record<string, string> = {
  'x-content-type-options': 'nosniff',
  'x-frame-options': 'DENY',
  'referrer-policy': 'strict-origin-when-cross-origin',
  'content-security-policy': "frame-ancestors 'none'; base-uri 'self'; object-src 'none'",
  'cross-origin-opener-policy': 'same-origin',
}

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('request', (event) => {
    setResponseHeaders(event, HEADERS)
  })
  nitroApp.hooks.hook('beforeResponse', (event) => {
    removeResponseHeader(event, 'x-powered-by')
  })
})
