import { UnauthenticatedError } from '#server/domain/errors'
import { isSessionOpen, signOut } from '#server/services/users'

// The session module's own GET /api/_auth/session answers only for a session that is still open,
// and the cookie is Secure whenever the site is served over https (NUXT_SITE_URL).
export default defineNitroPlugin(() => {
  if (siteIsHttps()) process.env.NUXT_SESSION_COOKIE_SECURE = 'true'
  sessionHooks.hook('fetch', async (session, event) => {
    if (session.sid && (await isSessionOpen(session.sid, new Date()))) return
    await clearUserSession(event)
    throw toHttpError(new UnauthenticatedError('Your session has ended. Sign in again.'))
  })
  // Clearing the cookie through the module's DELETE route ends the session too.
  sessionHooks.hook('clear', async (session) => {
    await signOut((session as { sid?: string }).sid, new Date())
  })
})
