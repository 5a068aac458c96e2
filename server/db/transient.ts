// Which database errors are passing ones (the server restarting, a dropped connection, a
// serialization failure or deadlock), and a bounded retry for work that is safe to repeat.
// Plain TypeScript: the errors are told apart by the codes PostgreSQL, node-postgres, Node's
// sockets and Sequelize put on them, so the module needs neither.

/** SQLSTATEs after which the same work, tried again a moment later, can succeed. */
const TRANSIENT_SQLSTATES = new Set([
  '40001', // serialization_failure: the transaction was rolled back
  '40P01', // deadlock_detected: the transaction was rolled back
  '57P01', // admin_shutdown: the server is stopping or restarting
  '57P02', // crash_shutdown
  '57P03', // cannot_connect_now: the server is starting up
  '53300', // too_many_connections
])
/** Class 08: connection exceptions. */
const CONNECTION_CLASS = '08'

/** Socket errors of a connection that could not be opened or was cut. */
const TRANSIENT_ERRNOS = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'EAI_AGAIN', 'ENOTCONN'])

/** Sequelize's own connection error types (it wraps the driver's error in them). */
const TRANSIENT_NAMES = new Set([
  'SequelizeConnectionError', 'SequelizeConnectionRefusedError', 'SequelizeConnectionAcquireTimeoutError', 'SequelizeHostNotReachableError',
  'SequelizeConnectionTimedOutError',
])

/** node-postgres reports a connection cut mid-query with a plain Error and one of these messages. */
const TRANSIENT_MESSAGES = [/connection terminated/i, /server closed the connection unexpectedly/i, /terminating connection/i, /connection (?:is )?(?:closed|ended)/i]

/** Errors that certainly rolled back: the work did not happen and can be repeated as it is. */
const ROLLED_BACK_SQLSTATES = new Set(['40001', '40P01', '57P03', '53300'])

type ErrorLike = { code?: unknown; name?: unknown; message?: unknown; parent?: unknown; original?: unknown; cause?: unknown }

/** The error and the errors it wraps (Sequelize's parent/original, a cause), outermost first. */
function chain(error: unknown): ErrorLike[] {
  const seen: ErrorLike[] = []
  const queue: unknown[] = [error]
  while (queue.length && seen.length < 8) {
    const next = queue.shift()
    if (!next || typeof next !== 'object' || seen.includes(next as ErrorLike)) continue
    const e = next as ErrorLike
    seen.push(e)
    queue.push(e.parent, e.original, e.cause)
  }
  return seen
}

const codeOf = (e: ErrorLike) => (typeof e.code === 'string' ? e.code : undefined)

/** True when the error is a passing database failure that trying again may get past. */
export function isTransientDbError(error: unknown): boolean {
  return chain(error).some((e) => {
    const code = codeOf(e)
    if (code && (TRANSIENT_SQLSTATES.has(code) || (code.length === 5 && code.startsWith(CONNECTION_CLASS)) || TRANSIENT_ERRNOS.has(code))) return true
    if (typeof e.name === 'string' && TRANSIENT_NAMES.has(e.name)) return true
    return typeof e.message === 'string' && TRANSIENT_MESSAGES.some((m) => m.test(e.message as string))
  })
}

/**
 * True when the error is worth another try: a passing failure, but not a pool that stayed full for
 * its whole acquire timeout (the server is overloaded; waiting again would only add to the queue).
 */
export function isRetryableDbError(error: unknown): boolean {
  return isTransientDbError(error) && !chain(error).some((e) => e.name === 'SequelizeConnectionAcquireTimeoutError')
}

/**
 * True when the failed work certainly did not take effect: the server rolled it back (serialization
 * failure, deadlock) or no connection was ever made. A connection cut while a statement ran leaves
 * its outcome unknown, so this is false for it.
 */
export function certainlyNotApplied(error: unknown): boolean {
  return chain(error).some((e) => {
    const code = codeOf(e)
    if (code && (ROLLED_BACK_SQLSTATES.has(code) || code === 'ECONNREFUSED' || code === '08001' || code === '08004')) return true
    return e.name === 'SequelizeConnectionRefusedError' || e.name === 'SequelizeConnectionAcquireTimeoutError'
  })
}

export interface RetryOptions {
  /** Tries in all, the first included. */
  attempts?: number
  /** Wait before the second try; it doubles for each later one, up to `maxDelayMs`. */
  baseDelayMs?: number
  maxDelayMs?: number
  /** Which errors are worth another try (default: isRetryableDbError). */
  retryable?: (error: unknown) => boolean
  /** Told before each wait, e.g. to log it. */
  onRetry?: (error: unknown, attempt: number, delayMs: number) => void
  sleep?: (ms: number) => Promise<void>
  /** 0..1, for the jitter that spreads the retries of many requests (default Math.random). */
  random?: () => number
}

export const DEFAULT_RETRY = { attempts: 4, baseDelayMs: 100, maxDelayMs: 1_000 } as const

/** The wait before try `attempt + 1` (attempt counts from 0): doubling, capped, with ±25 % jitter. */
export function backoffDelay(attempt: number, baseDelayMs: number, maxDelayMs: number, random: () => number = Math.random): number {
  const plain = Math.min(maxDelayMs, baseDelayMs * 2 ** attempt)
  return Math.round(plain * (0.75 + random() * 0.5))
}

const defaultSleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms))

/**
 * Runs `work` and, when it fails with a retryable error, again after a growing wait, at most
 * `attempts` times in all; the last error is thrown as it is. `work` gets the try's index (0 first),
 * so a write can check before repeating whether its earlier try landed.
 */
export async function retryTransient<T>(work: (attempt: number) => Promise<T>, options: RetryOptions = {}): Promise<T> {
  const attempts = Math.max(1, options.attempts ?? DEFAULT_RETRY.attempts)
  const base = options.baseDelayMs ?? DEFAULT_RETRY.baseDelayMs
  const max = options.maxDelayMs ?? DEFAULT_RETRY.maxDelayMs
  const retryable = options.retryable ?? isRetryableDbError
  const sleep = options.sleep ?? defaultSleep
  for (let attempt = 0; ; attempt++) {
    try {
      return await work(attempt)
    } catch (error) {
      if (attempt + 1 >= attempts || !retryable(error)) throw error
      const delay = backoffDelay(attempt, base, max, options.random)
      options.onRetry?.(error, attempt, delay)
      await sleep(delay)
    }
  }
}
