import type { Role } from '#shared/utils/permissions'

/** Who acts: every service function takes the signed-in user it acts for (scoping, authorship). */
export interface Actor {
  id: number
  name: string
  role: Role
  organisationId: number
}
