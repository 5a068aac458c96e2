import type { Role } from '#shared/utils/permissions'

/** The signed-in user as the API returns it. */
export interface UserDto {
  id: number
  email: string
  name: string
  role: Role
}

/** A user as the admin screens see it. */
export interface AdminUserDto extends UserDto {
  active: boolean
  createdAt: string
}

/** A person of the organisation for pickers and filters: no e-mail, no account state. */
export interface PersonDto {
  id: number
  name: string
  role: Role
}
