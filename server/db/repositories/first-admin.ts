// The first administrator of a deployment without the demo: the organisation they run, a one-time
// set-up link (only its hash is stored) and the account itself.
import { createHash } from 'node:crypto'
import { QueryTypes, type Transaction } from 'sequelize'
import { Organisation, User } from '../models'
import type { UserRecord } from './users'

const sequelize = () => User.sequelize!

/** What is stored of a set-up link's secret. */
export const setupTokenHash = (token: string) => createHash('sha256').update(token).digest('hex')

/** True when some organisation has an active administrator. */
export async function activeAdminExists(transaction?: Transaction): Promise<boolean> {
  return (await User.count({ where: { role: 'admin', active: true }, transaction })) > 0
}

/** True when an account with this e-mail exists in any organisation. */
export async function accountWithEmailExists(email: string, transaction?: Transaction): Promise<boolean> {
  return (await User.count({ where: { email: email.toLowerCase() }, transaction })) > 0
}

/** The accounts of the demo's published sign-ins present in the database (e-mails), to warn about. */
export async function demoAccountsPresent(emails: readonly string[]): Promise<string[]> {
  const rows = await User.findAll({ where: { email: [...emails], active: true }, attributes: ['email'] })
  return rows.map((r) => r.email)
}

/**
 * The organisation the first administrator will run: the oldest organisation without an active
 * administrator, or a new one named `name`. Returns its id and whether it was created.
 */
export async function organisationForFirstAdmin(name: string, transaction: Transaction): Promise<{ id: number; created: boolean }> {
  const [row] = await sequelize().query<{ id: number }>(
    `SELECT o.id FROM organisations o
      WHERE NOT EXISTS (SELECT 1 FROM users u WHERE u.organisation_id = o.id AND u.role = 'admin' AND u.active)
      ORDER BY o.id LIMIT 1`,
    { type: QueryTypes.SELECT, transaction },
  )
  if (row) return { id: row.id, created: false }
  let slug = name.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'organisation'
  if (await Organisation.count({ where: { slug }, transaction })) slug = `${slug}-${Date.now().toString(36)}`
  const org = await Organisation.create({ name, slug }, { transaction })
  return { id: org.id, created: true }
}

/** Creates the administrator account in the organisation; the caller hashes the password. */
export async function insertAdmin(input: { organisationId: number; email: string; name: string; passwordHash: string }, transaction: Transaction): Promise<UserRecord> {
  const u = await User.create({ ...input, email: input.email.toLowerCase(), role: 'admin' }, { transaction })
  return { id: u.id, organisationId: u.organisationId, email: u.email, name: u.name, role: u.role, active: u.active, createdAt: u.createdAt }
}

/** Stores a new set-up link for the organisation; earlier unused links stop working. */
export async function storeSetupLink(organisationId: number, tokenHash: string, now: Date, expiresAt: Date, transaction: Transaction): Promise<void> {
  await sequelize().query('DELETE FROM setup_links WHERE used_at IS NULL', { transaction })
  await sequelize().query(
    'INSERT INTO setup_links (organisation_id, token_hash, created_at, expires_at) VALUES ($1, $2, $3, $4)',
    { bind: [organisationId, tokenHash, now, expiresAt], transaction },
  )
}

/** The organisation of an unused, unexpired set-up link, or null. */
export async function findUsableSetupLink(tokenHash: string, now: Date, transaction?: Transaction): Promise<{ id: number; organisationId: number } | null> {
  const [row] = await sequelize().query<{ id: number; organisationId: number }>(
    'SELECT id, organisation_id AS "organisationId" FROM setup_links WHERE token_hash = $1 AND used_at IS NULL AND expires_at > $2',
    { bind: [tokenHash, now], type: QueryTypes.SELECT, transaction },
  )
  return row ?? null
}

/**
 * Marks the link used, if it still is usable (one statement, so two simultaneous uses cannot both
 * succeed); returns its organisation, or null when it was used, expired or never existed.
 */
export async function claimSetupLink(tokenHash: string, now: Date, transaction: Transaction): Promise<number | null> {
  const [rows] = await sequelize().query(
    'UPDATE setup_links SET used_at = $2 WHERE token_hash = $1 AND used_at IS NULL AND expires_at > $2 RETURNING organisation_id AS "organisationId"',
    { bind: [tokenHash, now], transaction },
  )
  return (rows as { organisationId: number }[])[0]?.organisationId ?? null
}

/** Renames the organisation (the first administrator names it). */
export async function renameOrganisation(organisationId: number, name: string, transaction: Transaction): Promise<void> {
  await Organisation.update({ name }, { where: { id: organisationId }, transaction })
}

/** Runs `work` in one transaction. */
export function inTransaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  return sequelize().transaction(work)
}
