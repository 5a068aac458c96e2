import type { Role } from '#shared/utils/permissions'

declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: Role
    organisationId: number
  }
  interface UserSession {
    loggedInAt: number
    /** Id of the server-side session record (table user_sessions). */
    sid?: string
  }
}

export {}
