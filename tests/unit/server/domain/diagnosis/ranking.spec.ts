import { describe, expect, it } from 'vitest'
import type { RankRequest } from '#shared/types/diagnosis'
import { rankDiagnosis, RankInputError } from '#server/domain/diagnosis/rank'
import { hypothesesFor, priorsFor, PRIOR_STRENGTH } from '#server/domain/diagnosis/ranking'
import { entropyBits, INVASIVE_PENALTY, proposeTests } from '#server/domain/diagnosis/next-test'
import type { TestDef } from '#server/domain/diagnosis/knowledge-base'
import { cascadeFreezer, seedKb, singleStageFreezer } from './scenario-helpers'

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0)
const bare: RankRequest = { unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] } }

describe('ranking', () => {
  it('probabilities sum to 1, are sorted, and include other', async () => {
    const r = await rankDiagnosis(seedKb(), cascadeFreezer({ cabinetC: -45, cascadeHxC: -36 }))
    expect(sum(r.causes.map((c) => c.probability))).toBeCloseTo(1, 10)
    expect(r.causes.some((c) => c.cause === 'other' && c.stage === undefined)).toBe(true)
    const ps = r.causes.map((c) => c.probability)
    expect(ps).toEqual([...ps].sort((a, b) => b - a))
    // Cascade hypotheses only use the cascade's stages.
    expect(r.causes.every((c) => c.stage !== 'single')).toBe(true)
    expect(r.knowledgeBaseVersion.id).toBe('seed-test')
  })

  it('a request with nothing but the unit ranks by priors, proposes tests and lists readings to take', async () => {
    const r = await rankDiagnosis(seedKb(), bare)
    expect(sum(r.causes.map((c) => c.probability))).toBeCloseTo(1, 10)
    expect(r.tests.length).toBeGreaterThan(0)
    expect(r.missingReadings.length).toBeGreaterThan(0)
    expect(r.warnings).toEqual([])
  })

  it('contradictory readings give warnings, not errors', async () => {
    const r = await rankDiagnosis(seedKb(), {
      ...bare,
      readings: [
        { quantity: 'suctionPressure', stage: 'single', value: 9, unit: 'barg' },
        { quantity: 'dischargePressure', stage: 'single', value: 2, unit: 'barg' },
        { quantity: 'condenserAirInTemperature', value: 30, unit: 'C' },
        { quantity: 'condenserAirOutTemperature', value: 20, unit: 'C' },
      ],
    })
    expect(r.warnings.length).toBeGreaterThanOrEqual(2)
  })

  it('learned counts shift the priors and say so (Dirichlet update)', async () => {
    const req = singleStageFreezer({ sstC: -30, sctC: 40, superheatK: 6, subcoolingK: 5, currentPct: 100, airOutC: 33, cabinetC: -12 })
    const plain = await rankDiagnosis(seedKb(), req)
    const learned = await rankDiagnosis(seedKb(), req, { learnedCounts: [{ cause: 'control-sensor-fault', stage: 'single', count: 40 }] })
    const p = (r: typeof plain) => r.causes.find((c) => c.cause === 'control-sensor-fault')
    expect(p(learned)?.prior).toBeGreaterThan(2 * (p(plain)?.prior ?? 1))
    expect(p(learned)?.probability).toBeGreaterThan(p(plain)?.probability ?? 1)
    expect(learned.priorNote).toMatch(/40 confirmed cause\(s\).*closed single-stage cases.*Dirichlet/)
    expect(plain.priorNote).toMatch(/no closed cases/)
  })

  it('priors stay a distribution and keep unseen causes possible', () => {
    const kb = seedKb()
    const hyps = hypothesesFor(kb, 'cascade')
    const pr = priorsFor(kb, 'cascade', hyps, { learnedCounts: [{ cause: 'refrigerant-leak', stage: 'low', count: 1000 }] })
    expect(sum(pr.values)).toBeCloseTo(1, 10)
    expect(Math.min(...pr.values)).toBeGreaterThan(0)
    expect(pr.values[hyps.findIndex((h) => h.key === 'refrigerant-leak@low')]).toBeGreaterThan(1000 / (1000 + PRIOR_STRENGTH) - 0.01)
  })

  it('a test outcome moves the posterior and is listed as evidence', async () => {
    const base = cascadeFreezer({ cabinetC: -45, cascadeHxC: -36 })
    const r = await rankDiagnosis(seedKb(), { ...base, testResults: [{ test: 'standing-pressure-check', stage: 'low', outcome: 'low' }] })
    expect(r.causes[0]).toMatchObject({ cause: 'refrigerant-leak', stage: 'low' })
    expect(r.causes[0]?.evidence.some((e) => e.rule === 'test:standing-pressure-check@low')).toBe(true)
    expect(r.tests.some((t) => t.test === 'standing-pressure-check' && t.stage === 'low')).toBe(false)
  })

  it('unknown outcome words and stages a test does not apply to are rejected with the allowed words', async () => {
    await expect(
      rankDiagnosis(seedKb(), { ...bare, testResults: [{ test: 'standing-pressure-check', stage: 'single', outcome: 'lowish' }] }),
    ).rejects.toThrow('Unknown outcome "lowish" for standing-pressure-check; allowed: low, as-expected, high')
    await expect(
      rankDiagnosis(seedKb(), { ...cascadeFreezer({ cabinetC: -45, cascadeHxC: -36 }), testResults: [{ test: 'condenser-inspection', stage: 'low', outcome: 'clean-and-running' }] }),
    ).rejects.toBeInstanceOf(RankInputError)
  })

  it('the test stage is inferred when only one applies', async () => {
    const r = await rankDiagnosis(seedKb(), { ...cascadeFreezer({ cabinetC: -45, cascadeHxC: -12 }), testResults: [{ test: 'condenser-inspection', outcome: 'fouled-or-fan-fault' }] })
    expect(r.causes[0]).toMatchObject({ cause: 'condenser-airflow', stage: 'high' })
  })
})

describe('next test (decision-theoretic troubleshooting)', () => {
  const fakeTest = (slug: TestDef['slug'], invasive: boolean): TestDef => ({
    slug,
    title: slug,
    minutes: 10,
    opensSystem: invasive,
    hotWork: false,
    stages: ['single'],
    safetyNotes: [],
    procedure: '1. x',
    outcomes: [
      { slug: 'yes', label: 'yes', likelihoods: { 'refrigerant-leak': 0.9, other: 0.1 } },
      { slug: 'no', label: 'no', likelihoods: { 'refrigerant-leak': 0.1, other: 0.9 } },
    ],
  })

  it('ranks an invasive test after an equally informative non-invasive one', () => {
    const hyps = [
      { key: 'refrigerant-leak@single', cause: 'refrigerant-leak' as const, stage: 'single' as const },
      { key: 'other', cause: 'other' as const },
    ]
    const tests = proposeTests({
      kb: { tests: [fakeTest('nitrogen-pressure-test', true), fakeTest('leak-search', false)] },
      kind: 'single-stage',
      hypotheses: hyps,
      posterior: [0.5, 0.5],
      done: [],
      readingsPresent: new Set(),
    })
    expect(tests.map((t) => t.test)).toEqual(['leak-search', 'nitrogen-pressure-test'])
    expect(tests[0]?.expectedGain).toBe(tests[1]?.expectedGain)
    expect(tests[1]?.score).toBeCloseTo((tests[0]?.score ?? 0) * INVASIVE_PENALTY, 10)
    // H(0.5,0.5) = 1 bit; posterior after either outcome is (0.9, 0.1): gain = 1 − H(0.9) ≈ 0.531 bits.
    expect(tests[0]?.expectedGain).toBeCloseTo(1 - entropyBits([0.9, 0.1]), 3)
    expect(tests[0]?.separates.map((s) => s.cause)).toContain('refrigerant-leak')
  })

  it('every proposal carries minutes, invasiveness and safety notes', async () => {
    const r = await rankDiagnosis(seedKb(), cascadeFreezer({ cabinetC: -45, cascadeHxC: -36 }))
    for (const t of r.tests) {
      expect(t.minutes).toBeGreaterThan(0)
      expect(typeof t.opensSystem).toBe('boolean')
      expect(t.safetyNotes.length).toBeGreaterThan(0)
    }
    const scores = r.tests.map((t) => t.score)
    expect(scores).toEqual([...scores].sort((a, b) => b - a))
  })
})
