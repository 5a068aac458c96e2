/** How long a session lasts, in seconds (the cookie's and the server-side record's lifetime). */
export function sessionLifetimeS(): number {
  return Number(useRuntimeConfig().session?.maxAge) || 12 * 60 * 60
}

/** True when the configured site address (NUXT_SITE_URL) is https: the session cookie is then Secure. */
export function siteIsHttps(): boolean {
  return /^https:\/\//i.test(String(useRuntimeConfig().siteUrl || process.env.NUXT_SITE_URL || ''))
}
