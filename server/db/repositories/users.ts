import { QueryTypes, type Transaction } from 'sequelize'
import type { Role } from '#shared/utils/permissions'
import { Organisation, User } from '../models'
import { CACHE_STAMP_COLUMNS, cacheStampsFrom, type CacheStampColumns, type CacheStamps } from './cache-stamps'

export interface UserRecord {
  id: number
  organisationId: number
  email: string
  name: string
  role: Role
  active: boolean
  createdAt: Date
}
const plain = (u: User): UserRecord => ({
  id: u.id, organisationId: u.organisationId, email: u.email, name: u.name, role: u.role, active: u.active, createdAt: u.createdAt,
})

/** The accounts with this e-mail (one per organisation at most) and their password hashes. */
export async function findUsersForLogin(email: string) {
  const users = await User.findAll({ where: { email: email.toLowerCase() }, order: [['id', 'ASC']] })
  return users.map((user) => ({ ...plain(user), passwordHash: user.passwordHash }))
}

/**
 * The active user with this id and the cache stamps of their organisation, or null (deactivated
 * users count as absent). Runs on every request (deactivation must bite at once), so it is one
 * indexed statement, and the stamps come with it: caches of the request need no read of their own.
 */
export async function findActiveUser(id: number): Promise<(UserRecord & { cacheStamps: CacheStamps }) | null> {
  const [row] = await User.sequelize!.query<UserRecord & CacheStampColumns>(
    `SELECT u.id, u.organisation_id AS "organisationId", u.email, u.name, u.role, u.active, u.created_at AS "createdAt", ${CACHE_STAMP_COLUMNS}
       FROM users u LEFT JOIN organisation_cache_stamps s ON s.organisation_id = u.organisation_id
      WHERE u.id = $1 AND u.active`,
    { bind: [id], type: QueryTypes.SELECT },
  )
  if (!row) return null
  const { kb, learned, equipment, ...user } = row
  return { ...user, cacheStamps: cacheStampsFrom(user.organisationId, { kb, learned, equipment }) }
}

/** All users of one organisation, by name. */
export async function listUsers(organisationId: number): Promise<UserRecord[]> {
  const users = await User.findAll({ where: { organisationId }, order: [['name', 'ASC']] })
  return users.map(plain)
}

/** Creates a user in the organisation; the caller hashes the password. */
export async function createUser(input: { organisationId: number; email: string; name: string; role: Role; passwordHash: string }) {
  return plain(await User.create({ ...input, email: input.email.toLowerCase() }))
}

/** Updates role, name or active flag of a user of the organisation; null when not found there. */
export async function updateUser(organisationId: number, id: number, changes: Partial<Pick<UserRecord, 'name' | 'role' | 'active'>>) {
  const user = await User.findOne({ where: { id, organisationId } })
  if (!user) return null
  await user.update(changes)
  return plain(user)
}

/** True when an account with this e-mail exists anywhere. */
/** True when the organisation already has an account with this e-mail (other organisations are not looked at). */
export async function emailTakenIn(organisationId: number, email: string) {
  return (await User.count({ where: { organisationId, email: email.toLowerCase() } })) > 0
}

/** Sets a user's password hash; false when the user is not in the organisation. */
export async function setPasswordHash(organisationId: number, id: number, passwordHash: string, transaction?: Transaction): Promise<boolean> {
  const [count] = await User.update({ passwordHash }, { where: { id, organisationId }, transaction })
  return count > 0
}

/** The password hash of a user, or null. */
export async function passwordHashOf(id: number): Promise<string | null> {
  return (await User.findByPk(id, { attributes: ['passwordHash'] }))?.passwordHash ?? null
}

/** Name and time zone of an organisation. */
export async function organisationSettings(id: number): Promise<{ name: string; timeZone: string }> {
  const org = await Organisation.findByPk(id)
  return { name: org?.name ?? '', timeZone: org?.timeZone ?? 'UTC' }
}
