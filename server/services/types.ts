import type { CacheStamps } from '#server/db/repositories/cache-stamps'
import type { Role } from '#shared/utils/permissions'

/** Who acts: every service function takes the signed-in user it acts for (scoping, authorship). */
export interface Actor {
  id: number
  name: string
  role: Role
  organisationId: number
  /** The organisation's cache stamps read with the user at the start of the request (saves a read); absent, they are read when needed. */
  cacheStamps?: CacheStamps
}
