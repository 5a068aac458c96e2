import { describe, expect, it } from 'vitest'
import { confirmationIsDefinitive, resolveTestResults } from '#server/domain/diagnosis/test-results'
import { seedKb } from './scenario-helpers'

describe('test results', () => {
  it('keeps the latest outcome of a test repeated before anything was settled', () => {
    const r = resolveTestResults(seedKb(), 'cascade', [
      { test: 'standing-pressure-check', stage: 'low', outcome: 'as-expected' },
      { test: 'standing-pressure-check', stage: 'low', outcome: 'low' },
    ])
    expect(r.diagnosis.map((x) => x.outcome.slug)).toEqual(['low'])
    expect(r.setAside).toEqual([])
  })

  it('tells a confirmation proven by a definitive outcome from one nothing proved', () => {
    const kb = seedKb()
    const found = [{ test: 'leak-search' as const, stage: 'low' as const, outcome: 'leak-found' }]
    expect(confirmationIsDefinitive(kb, 'cascade', { cause: 'refrigerant-leak', stage: 'low' }, found)).toBe(true)
    expect(confirmationIsDefinitive(kb, 'cascade', { cause: 'refrigerant-leak', stage: 'high' }, found)).toBe(false)
    expect(confirmationIsDefinitive(kb, 'cascade', { cause: 'restriction', stage: 'low' }, found)).toBe(false)
    expect(confirmationIsDefinitive(kb, 'cascade', { cause: 'refrigerant-leak', stage: 'low' }, [{ test: 'leak-search', stage: 'low', outcome: 'none-found' }])).toBe(false)
    // The condenser is only on the high stage of a cascade: the stage follows from the test.
    expect(confirmationIsDefinitive(kb, 'cascade', { cause: 'condenser-airflow', stage: 'high' }, [{ test: 'condenser-inspection', outcome: 'fouled-or-fan-fault' }])).toBe(true)
  })
})
