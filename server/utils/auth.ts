import type { H3Event } from 'h3'
import type { User } from '#auth-utils'
import type { CacheStamps } from '#server/db/repositories/cache-stamps'
import { ForbiddenError, UnauthenticatedError } from '#server/domain/errors'
import { userOfSession } from '#server/services/users'
import { can, type Permission } from '#shared/utils/permissions'

type ActiveUser = User & { cacheStamps: CacheStamps }

/** The signed-in, still-active user of this request, looked up once per request (401 otherwise). */
async function activeUser(event: H3Event): Promise<ActiveUser> {
  const known = event.context.activeUser as ActiveUser | undefined
  if (known) return known
  const session = await getUserSession(event)
  if (!session.user) throw new UnauthenticatedError('Sign in first')
  // The cookie names a server-side session: signing out, a deactivation or a password change ends
  // it for every copy of the cookie.
  const current = session.sid ? await userOfSession(session.sid, new Date()) : null
  if (!current) {
    await clearUserSession(event)
    throw new UnauthenticatedError('Your session has ended or your account is no longer active. Sign in again.')
  }
  const user: ActiveUser = {
    id: current.id, email: current.email, name: current.name, role: current.role, organisationId: current.organisationId, cacheStamps: current.cacheStamps,
  }
  event.context.activeUser = user
  return user
}

/**
 * Identifies the signed-in, still-active user (401 otherwise) and checks `permission` (403);
 * given a list, any one of them is enough. The route guard calls this with the route's rule before
 * the handler runs, and every protected route calls it again with the same permission; the session
 * alone is not trusted, so a deactivated user is refused on the next request. The user comes with
 * the cache stamps of their organisation as of this request, for the services' caches.
 */
export async function requireUser(event: H3Event, permission?: Permission | readonly Permission[]): Promise<ActiveUser> {
  const current = await activeUser(event)
  const { cacheStamps: _, ...user } = current
  const anyOf = permission === undefined ? [] : typeof permission === 'string' ? [permission] : permission
  if (anyOf.length && !anyOf.some((p) => can(user.role, p))) throw new ForbiddenError('Your role may not do this')
  event.context.user = user
  return { ...current }
}
