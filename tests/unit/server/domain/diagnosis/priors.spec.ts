import { describe, expect, it } from 'vitest'
import { hypothesesFor } from '#server/domain/diagnosis/hypotheses'
import { defaultPriors, priorsFor, PRIOR_CEILING, PRIOR_FLOOR } from '#server/domain/diagnosis/priors'
import { seedKb } from './scenario-helpers'

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0)

describe('starting odds', () => {
  const kb = seedKb()
  const hyps = hypothesesFor(kb.causes, 'cascade')
  const at = (key: string) => hyps.findIndex((h) => h.key === key)

  it('come from the knowledge base per kind and per equipment class', () => {
    const freezer = defaultPriors(kb.causes, hyps, 'cascade', 'ult-freezer')
    const chamber = defaultPriors(kb.causes, hyps, 'cascade', 'test-chamber')
    expect(sum(freezer)).toBeCloseTo(1, 12)
    // Forced-air chamber evaporators ice up more often than wall-bonded freezer coils.
    expect(chamber[at('evaporator-airflow@low')]).toBeGreaterThan(2 * (freezer[at('evaporator-airflow@low')] ?? 1))
    expect(hyps.some((h) => h.key === 'no-refrigeration-fault')).toBe(true)
    expect(hyps.some((h) => h.key === 'expansion-tank-fault@low')).toBe(true)
  })

  it('move only within bounds however long the history, and keep every cause possible', () => {
    const base = defaultPriors(kb.causes, hyps, 'cascade')
    const pr = priorsFor(kb.causes, 'cascade', hyps, { learnedCounts: [{ cause: 'refrigerant-leak', stage: 'low', count: 1000, definitive: true }] })
    expect(sum(pr.values)).toBeCloseTo(1, 10)
    const leak = at('refrigerant-leak@low')
    expect(pr.values[leak]).toBeLessThanOrEqual(PRIOR_CEILING * (base[leak] ?? 0) + 1e-12)
    for (let i = 0; i < hyps.length; i++) expect(pr.values[i], hyps[i]?.key).toBeGreaterThan(0.8 * PRIOR_FLOOR * (base[i] ?? 0))
    expect(pr.note).toMatch(/adjusted by 1000 definitively confirmed cause\(s\).*weigh as 200 cases.*below 50 % or above 3 times/)
  })

  it('learn only from definitive confirmations, and say how many were left out', () => {
    const base = priorsFor(kb.causes, 'cascade', hyps)
    const pr = priorsFor(kb.causes, 'cascade', hyps, { learnedCounts: [{ cause: 'control-sensor-fault', stage: 'low', count: 40, definitive: false }] })
    expect(pr.values).toEqual(base.values)
    expect(pr.note).toMatch(/40 confirmation\(s\) without a definitive test or repair are not counted/)
    expect(base.note).toMatch(/no definitively confirmed causes/)
  })
})
