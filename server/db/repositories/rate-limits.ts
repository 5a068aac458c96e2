// Rate-limit counters in PostgreSQL (rate-limiter-flexible's store, table rate_limits), so a limit
// holds across every app process and machine on the database.
import pg from 'pg'
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible'
import { databaseUrl } from '#server/utils/db'

export interface RatePolicy {
  /** Prefix of the counters' keys. */
  name: string
  /** Uses allowed within `durationS`. */
  points: number
  durationS: number
  /** Once over the limit, refused for this long (else until the window ends). */
  blockS?: number
}

const limiters = new Map<string, RateLimiterPostgres>()
// A small pool of its own: the limiter runs its statements on a connection it holds meanwhile.
let pool: pg.Pool | undefined

function limiterPool(): pg.Pool {
  if (!pool) {
    pool = new pg.Pool({ connectionString: databaseUrl(), max: 3 })
    // A connection that drops while idle (a database restart) is replaced on the next use; it must not end the process.
    pool.on('error', () => {})
  }
  return pool
}

function limiterFor(policy: RatePolicy): RateLimiterPostgres {
  let limiter = limiters.get(policy.name)
  if (!limiter) {
    limiter = new RateLimiterPostgres({
      storeClient: limiterPool(), storeType: 'pool', tableName: 'rate_limits', tableCreated: true, clearExpiredByTimeout: false,
      keyPrefix: policy.name, points: policy.points, duration: policy.durationS, blockDuration: policy.blockS ?? 0,
    })
    limiters.set(policy.name, limiter)
  }
  return limiter
}

/** Counts one use of `key`; the seconds to wait when that went over the limit, else 0. */
export async function takePoint(policy: RatePolicy, key: string): Promise<number> {
  try {
    await limiterFor(policy).consume(key)
    return 0
  } catch (error) {
    if (error instanceof RateLimiterRes) return Math.max(1, Math.ceil(error.msBeforeNext / 1000))
    throw error
  }
}

/** The seconds `key` must still wait (0 while it has uses left), without counting a use. */
export async function secondsToWait(policy: RatePolicy, key: string): Promise<number> {
  const res = await limiterFor(policy).get(key)
  return res && res.consumedPoints >= policy.points ? Math.max(1, Math.ceil(res.msBeforeNext / 1000)) : 0
}

/** Forgets the uses of `key` (a successful sign-in clears the account's failures). */
export async function clearPoints(policy: RatePolicy, key: string): Promise<void> {
  await limiterFor(policy).delete(key)
}
