// People and their accounts: signing in, the organisation's people for pickers, and the admin's
// user management. Passwords are hashed with nuxt-auth-utils' scrypt.
import { createUser as insertUser, emailTaken, findUserForLogin, listUsers as findUsers, updateUser as saveUser, type UserRecord } from '#server/db/repositories/users'
import { FieldConflictError, InvalidStateError, NotFoundError, UnauthenticatedError } from '#server/domain/errors'
import type { LoginInput, NewUserInput, UserChangeInput } from '#shared/schemas/auth'
import type { AdminUserDto, PersonDto, UserDto } from '#shared/types/api'
import type { Actor } from './types'

const BAD_CREDENTIALS = 'E-mail or password is not right'
// Verified against when the e-mail is unknown, so both failures take about the same time.
let decoyHash: Promise<string> | undefined

const adminView = (u: UserRecord): AdminUserDto => ({ id: u.id, email: u.email, name: u.name, role: u.role, active: u.active, createdAt: u.createdAt.toISOString() })

/** Checks e-mail and password; the same 401 whether the e-mail exists or not. Returns who signed in. */
export async function signIn(input: LoginInput): Promise<UserDto & { organisationId: number }> {
  const user = await findUserForLogin(input.email)
  decoyHash ??= hashPassword('decoy-password-for-timing')
  const ok = await verifyPassword(user?.passwordHash ?? (await decoyHash), input.password)
  if (!user || !ok || !user.active) throw new UnauthenticatedError(BAD_CREDENTIALS)
  return { id: user.id, email: user.email, name: user.name, role: user.role, organisationId: user.organisationId }
}

/** `GET /api/people`: names and roles of the organisation's active people (no e-mail or account state). */
export async function listPeople(actor: Actor): Promise<PersonDto[]> {
  const people = await findUsers(actor.organisationId)
  return people.filter((p) => p.active).map((p) => ({ id: p.id, name: p.name, role: p.role }))
}

/** `GET /api/admin/users`: every account of the organisation. */
export async function listUsers(actor: Actor): Promise<AdminUserDto[]> {
  return (await findUsers(actor.organisationId)).map(adminView)
}

/** `POST /api/admin/users`: a new account in the organisation (409 on an e-mail used anywhere). */
export async function createUser(actor: Actor, input: NewUserInput): Promise<AdminUserDto> {
  if (await emailTaken(input.email)) throw new FieldConflictError('An account with this e-mail already exists', 'email')
  const { password, ...rest } = input
  return adminView(await insertUser({ ...rest, organisationId: actor.organisationId, passwordHash: await hashPassword(password) }))
}

/** `PATCH /api/admin/users/{id}`: role, name or active flag; an admin cannot lock themselves out. */
export async function updateUser(actor: Actor, input: { userId: number; changes: UserChangeInput }): Promise<AdminUserDto> {
  const { userId, changes } = input
  if (userId === actor.id && (changes.active === false || (changes.role && changes.role !== 'admin'))) {
    throw new InvalidStateError('You cannot deactivate yourself or remove your own admin role')
  }
  const user = await saveUser(actor.organisationId, userId, changes)
  if (!user) throw new NotFoundError('User not found')
  return adminView(user)
}
