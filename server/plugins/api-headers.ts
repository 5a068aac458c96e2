// API answers (JSON, files, errors) are never documents to run or frame: they get a policy that
// loads nothing and may not be framed. A PDF opened in a tab keeps only the framing and base rules,
// so the browser's own PDF viewer can show it. Pages get their policy from nuxt-security
// (nuxt.config.ts), which also sets nosniff, DENY framing and the referrer policy on every response
// and drops X-Powered-By.
const API_POLICY = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'"
const PDF_POLICY = "frame-ancestors 'none'; base-uri 'none'; form-action 'none'"

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('request', (event) => {
    const path = event.path.split('?')[0]!
    if (!path.startsWith('/api/') && path !== '/api') return
    setResponseHeader(event, 'content-security-policy', path.endsWith('.pdf') ? PDF_POLICY : API_POLICY)
  })
})
