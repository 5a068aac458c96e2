// Which statements the connection retries by itself: reads outside a transaction only.
import { describe, expect, it } from 'vitest'
import { isStandaloneRead } from '#server/db/connection'

describe('isStandaloneRead', () => {
  it('is true for a finder (type SELECT) and a raw SELECT outside a transaction', () => {
    expect(isStandaloneRead('SELECT "id" FROM "cases"', { type: 'SELECT' } as never)).toBe(true)
    expect(isStandaloneRead('  select 1 AS ok')).toBe(true)
    expect(isStandaloneRead({ query: 'SELECT 1', values: [] })).toBe(true)
  })

  it('is false for writes, for anything inside a transaction and for a single-try probe', () => {
    expect(isStandaloneRead('UPDATE cases SET notes = $2 WHERE id = $1')).toBe(false)
    expect(isStandaloneRead('WITH upd AS (UPDATE cases SET lock_version = lock_version + 1 RETURNING id) INSERT INTO case_events SELECT 1')).toBe(false)
    expect(isStandaloneRead('INSERT INTO case_events (case_id) VALUES ($1)')).toBe(false)
    expect(isStandaloneRead('SELECT 1', { transaction: {} } as never)).toBe(false)
    expect(isStandaloneRead('SELECT 1', { type: 'SELECT', retry: { max: 1 } } as never)).toBe(false)
  })
})
