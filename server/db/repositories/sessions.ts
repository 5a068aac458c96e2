import { randomUUID } from 'node:crypto'
import { QueryTypes, type Transaction } from 'sequelize'
import { User } from '../models'
import { CACHE_STAMP_COLUMNS, cacheStampsFrom, type CacheStampColumns, type CacheStamps } from './cache-stamps'
import type { UserRecord } from './users'

export type SessionEnd = 'sign-out' | 'deactivated' | 'password-changed'

/** Opens a session for the user, valid for `lifetimeS` seconds; returns its id (the cookie carries it). */
export async function openSession(userId: number, now: Date, lifetimeS: number, userAgent: string): Promise<string> {
  const id = randomUUID()
  await User.sequelize!.query(
    'INSERT INTO user_sessions (id, user_id, created_at, expires_at, user_agent) VALUES ($1, $2, $3, $4, $5)',
    { bind: [id, userId, now, new Date(now.getTime() + lifetimeS * 1000), userAgent.slice(0, 300)] },
  )
  return id
}

/**
 * The active user of an open, unexpired session and the cache stamps of their organisation, or null.
 * Runs on every request, so it is one indexed statement.
 */
export async function findSessionUser(sessionId: string, now: Date): Promise<(UserRecord & { cacheStamps: CacheStamps }) | null> {
  const [row] = await User.sequelize!.query<UserRecord & CacheStampColumns>(
    `SELECT u.id, u.organisation_id AS "organisationId", u.email, u.name, u.role, u.active, u.created_at AS "createdAt", ${CACHE_STAMP_COLUMNS}
       FROM user_sessions ss
       JOIN users u ON u.id = ss.user_id AND u.active
       LEFT JOIN organisation_cache_stamps s ON s.organisation_id = u.organisation_id
      WHERE ss.id = $1 AND ss.ended_at IS NULL AND ss.expires_at > $2`,
    { bind: [sessionId, now], type: QueryTypes.SELECT },
  )
  if (!row) return null
  const { kb, learned, equipment, ...user } = row
  return { ...user, cacheStamps: cacheStampsFrom(user.organisationId, { kb, learned, equipment }) }
}

/** True when the session is open and unexpired. */
export async function sessionIsOpen(sessionId: string, now: Date): Promise<boolean> {
  const rows = await User.sequelize!.query('SELECT 1 FROM user_sessions WHERE id = $1 AND ended_at IS NULL AND expires_at > $2', {
    bind: [sessionId, now], type: QueryTypes.SELECT,
  })
  return rows.length > 0
}

/** Ends one session. */
export async function endSession(sessionId: string, now: Date, because: SessionEnd): Promise<void> {
  await User.sequelize!.query('UPDATE user_sessions SET ended_at = $2, ended_because = $3 WHERE id = $1 AND ended_at IS NULL', {
    bind: [sessionId, now, because],
  })
}

/** Ends every open session of a user (all devices), except `keep` when given. */
export async function endUserSessions(userId: number, now: Date, because: SessionEnd, options: { keep?: string; transaction?: Transaction } = {}): Promise<void> {
  await User.sequelize!.query(
    `UPDATE user_sessions SET ended_at = $2, ended_because = $3 WHERE user_id = $1 AND ended_at IS NULL${options.keep ? ' AND id <> $4' : ''}`,
    { bind: options.keep ? [userId, now, because, options.keep] : [userId, now, because], transaction: options.transaction },
  )
}
