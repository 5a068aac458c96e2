// People and their accounts: signing in, the organisation's people for pickers, and the admin's
// user management. Passwords are hashed with nuxt-auth-utils' scrypt.
import { endSession, endUserSessions, findSessionUser, openSession, sessionIsOpen } from '#server/db/repositories/sessions'
import {
  createUser as insertUser, emailTakenIn, findUsersForLogin, listUsers as findUsers, passwordHashOf, setPasswordHash, updateUser as saveUser, type UserRecord,
} from '#server/db/repositories/users'
import { BadInputError, FieldConflictError, InvalidStateError, NotFoundError, UnauthenticatedError } from '#server/domain/errors'
import type { LoginInput, NewUserInput, PasswordChangeInput, UserChangeInput } from '#shared/schemas/auth'
import type { AdminUserDto, PersonDto, UserDto } from '#shared/types/api'
import { assertSignInAllowed, clearFailedSignIns, countFailedSignIn } from './rate-limits'
import type { Actor } from './types'

const BAD_CREDENTIALS = 'E-mail or password is not right'
// Verified against when the e-mail is unknown, so both failures take about the same time.
let decoyHash: Promise<string> | undefined

const adminView = (u: UserRecord): AdminUserDto => ({ id: u.id, email: u.email, name: u.name, role: u.role, active: u.active, createdAt: u.createdAt.toISOString() })

/** Where a sign-in comes from: the network address (for its failure limit) and the browser. */
export interface SignInClient {
  address: string
  userAgent: string
  /** Lifetime of the session in seconds. */
  lifetimeS: number
}

/**
 * Checks e-mail and password (the same 401 whether the e-mail exists or not) and opens a
 * server-side session. Failures count against the address and the account; over either limit,
 * sign-in is refused with 429 until the wait is over. Returns who signed in and the session id.
 */
export async function signIn(input: LoginInput, now: Date, client: SignInClient): Promise<{ user: UserDto & { organisationId: number }; sessionId: string }> {
  await assertSignInAllowed(client.address, input.email)
  const candidates = await findUsersForLogin(input.email)
  decoyHash ??= hashPassword('decoy-password-for-timing')
  let user: (typeof candidates)[number] | undefined
  // One address may have an account in several organisations: the password says which.
  for (const candidate of candidates.length ? candidates : [undefined]) {
    const ok = await verifyPassword(candidate?.passwordHash ?? (await decoyHash), input.password)
    if (ok && candidate?.active) {
      user = candidate
      break
    }
  }
  if (!user) {
    await countFailedSignIn(client.address, input.email)
    throw new UnauthenticatedError(BAD_CREDENTIALS)
  }
  await clearFailedSignIns(input.email)
  const sessionId = await openSession(user.id, now, client.lifetimeS, client.userAgent)
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role, organisationId: user.organisationId }, sessionId }
}

/** The active user of an open session (with the organisation's cache stamps), or null. */
export function userOfSession(sessionId: string, now: Date) {
  return findSessionUser(sessionId, now)
}

/** True when the session is still open (not signed out, not ended by a deactivation or a password change, not expired). */
export function isSessionOpen(sessionId: string, now: Date): Promise<boolean> {
  return sessionIsOpen(sessionId, now)
}

/** `POST /api/auth/logout`: ends the session, wherever copies of its cookie are. */
export async function signOut(sessionId: string | undefined, now: Date): Promise<void> {
  if (sessionId) await endSession(sessionId, now, 'sign-out')
}

/** `POST /api/auth/password`: the signed-in person changes their password; their other sessions end. */
export async function changeOwnPassword(actor: Actor, input: PasswordChangeInput, sessionId: string, now: Date): Promise<void> {
  const hash = await passwordHashOf(actor.id)
  if (!hash || !(await verifyPassword(hash, input.currentPassword))) {
    throw new BadInputError('The current password is not right', { currentPassword: ['The current password is not right'] })
  }
  await setPasswordHash(actor.organisationId, actor.id, await hashPassword(input.newPassword))
  await endUserSessions(actor.id, now, 'password-changed', { keep: sessionId })
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

/**
 * `POST /api/admin/users`: a new account in the organisation; 409 when the organisation already has
 * one with this e-mail. Other organisations are not looked at, so the answer says nothing about them.
 */
export async function createUser(actor: Actor, input: NewUserInput): Promise<AdminUserDto> {
  if (await emailTakenIn(actor.organisationId, input.email)) throw new FieldConflictError('An account with this e-mail already exists', 'email')
  const { password, ...rest } = input
  return adminView(await insertUser({ ...rest, organisationId: actor.organisationId, passwordHash: await hashPassword(password) }))
}

/**
 * `PATCH /api/admin/users/{id}`: role, name, active flag or a new password; an admin cannot lock
 * themselves out. Deactivating a user or setting their password ends all their sessions.
 */
export async function updateUser(actor: Actor, input: { userId: number; changes: UserChangeInput }, now = new Date()): Promise<AdminUserDto> {
  const { userId, changes: { password, ...changes } } = input
  if (userId === actor.id && (changes.active === false || (changes.role && changes.role !== 'admin'))) {
    throw new InvalidStateError('You cannot deactivate yourself or remove your own admin role')
  }
  const user = await saveUser(actor.organisationId, userId, changes)
  if (!user) throw new NotFoundError('User not found')
  if (password !== undefined) {
    await setPasswordHash(actor.organisationId, userId, await hashPassword(password))
    await endUserSessions(userId, now, 'password-changed')
  }
  if (changes.active === false) await endUserSessions(userId, now, 'deactivated')
  return adminView(user)
}
