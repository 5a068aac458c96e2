// Telling passing database failures from real ones, and the bounded retry built on it. The codes
// are PostgreSQL's SQLSTATEs (PostgreSQL documentation, appendix A "Error Codes") and Node's socket
// errnos; the wrapped shapes are the ones Sequelize 6 and node-postgres throw.
import { describe, expect, it, vi } from 'vitest'
import { backoffDelay, certainlyNotApplied, isRetryableDbError, isTransientDbError, retryTransient } from '#server/db/transient'

const pgError = (code: string, message = 'database error') => Object.assign(new Error(message), { code })
/** How Sequelize wraps a driver error: its own error type with the driver's error as `parent` and `original`. */
const wrapped = (name: string, inner: Error) => Object.assign(new Error(inner.message), { name, parent: inner, original: inner })

describe('isTransientDbError', () => {
  it.each([
    ['40001 serialization_failure', pgError('40001')],
    ['40P01 deadlock_detected', pgError('40P01')],
    ['57P01 admin_shutdown', pgError('57P01', 'terminating connection due to administrator command')],
    ['57P03 cannot_connect_now', pgError('57P03', 'the database system is starting up')],
    ['08006 connection_failure', pgError('08006')],
    ['08003 connection_does_not_exist', pgError('08003')],
    ['08P01 protocol_violation (class 08)', pgError('08P01')],
    ['ECONNREFUSED', pgError('ECONNREFUSED', 'connect ECONNREFUSED 127.0.0.1:5432')],
    ['ECONNRESET', pgError('ECONNRESET', 'read ECONNRESET')],
    ['a cut connection (node-postgres, no code)', new Error('Connection terminated unexpectedly')],
  ])('%s is transient', (_label, error) => {
    expect(isTransientDbError(error)).toBe(true)
  })

  it('finds the code under Sequelize wrappers', () => {
    expect(isTransientDbError(wrapped('SequelizeDatabaseError', pgError('40P01')))).toBe(true)
    expect(isTransientDbError(wrapped('SequelizeConnectionRefusedError', pgError('ECONNREFUSED')))).toBe(true)
    expect(isTransientDbError(Object.assign(new Error('Operation timeout'), { name: 'SequelizeConnectionAcquireTimeoutError' }))).toBe(true)
    expect(isTransientDbError(new Error('outer', { cause: pgError('57P01') }))).toBe(true)
  })

  it.each([
    ['23505 unique_violation', pgError('23505')],
    ['22P02 invalid_text_representation', pgError('22P02')],
    ['42P01 undefined_table', pgError('42P01')],
    ['28P01 invalid_password', pgError('28P01')],
    ['a unique violation wrapped by Sequelize', wrapped('SequelizeUniqueConstraintError', pgError('23505'))],
    ['a plain bug', new TypeError('x is undefined')],
    ['not an error at all', 'oops'],
    ['nothing', undefined],
  ])('%s is not transient', (_label, error) => {
    expect(isTransientDbError(error)).toBe(false)
  })

  it('survives an error that wraps itself', () => {
    const loop = new Error('loop') as Error & { parent?: unknown }
    loop.parent = loop
    expect(isTransientDbError(loop)).toBe(false)
  })
})

describe('isRetryableDbError', () => {
  it('retries passing failures but not a pool that stayed full for its whole timeout', () => {
    expect(isRetryableDbError(wrapped('SequelizeConnectionRefusedError', pgError('ECONNREFUSED')))).toBe(true)
    expect(isRetryableDbError(pgError('40P01'))).toBe(true)
    const poolFull = Object.assign(new Error('Operation timeout'), { name: 'SequelizeConnectionAcquireTimeoutError' })
    expect(isTransientDbError(poolFull)).toBe(true)
    expect(isRetryableDbError(poolFull)).toBe(false)
    expect(isRetryableDbError(pgError('23505'))).toBe(false)
  })
})

describe('certainlyNotApplied', () => {
  it('is true where the server rolled back or no connection was made', () => {
    for (const code of ['40001', '40P01', '57P03', 'ECONNREFUSED', '08001']) expect(certainlyNotApplied(pgError(code)), code).toBe(true)
  })
  it('is false where a running statement was cut and its outcome is unknown', () => {
    for (const code of ['57P01', 'ECONNRESET', '08006']) expect(certainlyNotApplied(pgError(code)), code).toBe(false)
    expect(certainlyNotApplied(new Error('Connection terminated unexpectedly'))).toBe(false)
  })
})

describe('backoffDelay', () => {
  it('doubles from the base, stops at the cap, and jitters by at most a quarter', () => {
    const mid = () => 0.5
    expect([0, 1, 2, 3, 4, 5].map((a) => backoffDelay(a, 100, 1_000, mid))).toEqual([100, 200, 400, 800, 1_000, 1_000])
    expect(backoffDelay(2, 100, 1_000, () => 0)).toBe(300)
    expect(backoffDelay(2, 100, 1_000, () => 1)).toBe(500)
  })
})

describe('retryTransient', () => {
  const noWait = { sleep: async () => {}, random: () => 0.5 }

  it('returns at once when the first try works', async () => {
    const work = vi.fn(async () => 'ok')
    await expect(retryTransient(work, noWait)).resolves.toBe('ok')
    expect(work).toHaveBeenCalledTimes(1)
  })

  it('tries again after transient errors and tells each try its index', async () => {
    const seen: number[] = []
    const result = await retryTransient(async (attempt) => {
      seen.push(attempt)
      if (attempt < 2) throw pgError('ECONNREFUSED')
      return attempt
    }, noWait)
    expect(result).toBe(2)
    expect(seen).toEqual([0, 1, 2])
  })

  it('gives up after the set number of tries with the last error, having waited a growing time', async () => {
    const waits: number[] = []
    let tries = 0
    const error = pgError('57P01')
    await expect(retryTransient(async () => {
      tries++
      throw error
    }, { attempts: 4, baseDelayMs: 50, maxDelayMs: 120, sleep: async (ms) => { waits.push(ms) }, random: () => 0.5 })).rejects.toBe(error)
    expect(tries).toBe(4)
    expect(waits).toEqual([50, 100, 120])
  })

  it('does not wait again for a pool that stayed full', async () => {
    const work = vi.fn(async () => {
      throw Object.assign(new Error('Operation timeout'), { name: 'SequelizeConnectionAcquireTimeoutError' })
    })
    await expect(retryTransient(work, noWait)).rejects.toThrow('Operation timeout')
    expect(work).toHaveBeenCalledTimes(1)
  })

  it('never repeats work that failed for a real reason', async () => {
    const work = vi.fn(async () => {
      throw pgError('23505')
    })
    await expect(retryTransient(work, noWait)).rejects.toMatchObject({ code: '23505' })
    expect(work).toHaveBeenCalledTimes(1)
  })

  it('reports each retry before waiting', async () => {
    const onRetry = vi.fn()
    await retryTransient(async (attempt) => {
      if (attempt === 0) throw pgError('40001')
      return 1
    }, { ...noWait, onRetry })
    expect(onRetry).toHaveBeenCalledOnce()
    expect(onRetry.mock.calls[0]![1]).toBe(0)
  })

  it('bounds the total wait with the defaults (4 tries, under 2 s of waiting)', async () => {
    const waits: number[] = []
    await expect(retryTransient(async () => {
      throw pgError('ECONNREFUSED')
    }, { sleep: async (ms) => { waits.push(ms) }, random: () => 1 })).rejects.toThrow()
    expect(waits).toHaveLength(3)
    expect(waits.reduce((a, b) => a + b, 0)).toBeLessThan(2_000)
  })
})
