import { describe, expect, it } from 'vitest'
import type { TestDef } from '#server/domain/diagnosis/knowledge-base'
import type { KindModel } from '#server/domain/diagnosis/evidence'
import { entropyBits, OPEN_SYSTEM_MINUTES, proposeTests, testCostMinutes } from '#server/domain/diagnosis/next-test'

const fakeTest = (slug: TestDef['slug'], invasive: boolean): TestDef => ({
  slug,
  title: slug,
  minutes: 10,
  opensSystem: invasive,
  hotWork: false,
  stages: ['single'],
  safetyNotes: ['x'],
  procedure: '1. x',
  outcomes: [
    { slug: 'yes', label: 'yes', likelihoods: { healthy: 0.1, default: 0.1, 'refrigerant-leak': 0.9, other: 0.1 } },
    { slug: 'no', label: 'no', likelihoods: { healthy: 0.9, default: 0.9, 'refrigerant-leak': 0.1, other: 0.9 } },
  ],
})
const model = (): KindModel => ({
  kind: 'single-stage',
  hypotheses: [
    { key: 'refrigerant-leak@single', cause: 'refrigerant-leak', stage: 'single' },
    { key: 'restriction@single', cause: 'restriction', stage: 'single' },
  ],
  findings: new Map(),
  tests: new Map(),
})
const causes = [
  { slug: 'refrigerant-leak' as const, short: 'a leak' },
  { slug: 'restriction' as const, short: 'a blockage' },
]

describe('next test (decision-theoretic troubleshooting, Heckerman, Breese & Rommelse 1995)', () => {
  it('puts a test that opens the system after an equally informative one that does not, and says what it settles', () => {
    const tests = proposeTests({
      kb: { tests: [fakeTest('nitrogen-pressure-test', true), fakeTest('leak-search', false)], causes },
      model: model(),
      kind: 'single-stage',
      posterior: [0.5, 0.5],
      done: [],
      readingsPresent: new Set(),
    })
    expect(tests.map((t) => t.test)).toEqual(['leak-search', 'nitrogen-pressure-test'])
    expect(tests[0]?.expectedGain).toBe(tests[1]?.expectedGain)
    expect(tests[1]?.score).toBeCloseTo(((tests[0]?.score ?? 0) * 10) / (10 + OPEN_SYSTEM_MINUTES), 10)
    // H(0.5, 0.5) = 1 bit; each outcome leaves (0.9, 0.1): gain = 1 − H(0.9, 0.1) ≈ 0.531 bits.
    expect(tests[0]?.expectedGain).toBeCloseTo(1 - entropyBits([0.9, 0.1]), 3)
    expect(tests[0]?.value).toBe('Settles a leak against a blockage.')
    expect(tests[0]?.separates.map((s) => s.cause)).toEqual(['refrigerant-leak', 'restriction'])
  })

  it('proposes a test that opens the system only when it can settle something material', () => {
    // With the leak at 99 %, the nitrogen test gains about 0.07 bits: not worth opening the system; the leak search still helps.
    const input = { kb: { tests: [fakeTest('nitrogen-pressure-test', true), fakeTest('leak-search', false)], causes }, model: model(), kind: 'single-stage' as const, done: [], readingsPresent: new Set<string>() }
    expect(proposeTests({ ...input, posterior: [0.99, 0.01] }).map((t) => t.test)).toEqual(['leak-search'])
    expect(proposeTests({ ...input, posterior: [0.6, 0.4] }).map((t) => t.test)).toEqual(['leak-search', 'nitrogen-pressure-test'])
  })

  it('costs hot work and opening the system in minutes', () => {
    expect(testCostMinutes({ minutes: 20, opensSystem: true, hotWork: true })).toBeGreaterThan(testCostMinutes({ minutes: 20, opensSystem: true, hotWork: false }))
    expect(testCostMinutes({ minutes: 20, opensSystem: false, hotWork: false })).toBe(20)
  })

  it('skips a test a reading already answers, and one already done', () => {
    const answered = { ...fakeTest('standing-pressure-check', false), answeredBy: 'standingPressure' as const }
    const tests = proposeTests({ kb: { tests: [answered, fakeTest('leak-search', false)], causes }, model: model(), kind: 'single-stage', posterior: [0.5, 0.5], done: [], readingsPresent: new Set(['single:standingPressure']) })
    expect(tests.map((t) => t.test)).toEqual(['leak-search'])
  })

  it('does not propose a test for a metering device the stage is not fed by; proposes it where the record does not say', () => {
    const valveCheck = { ...fakeTest('expansion-valve-check', false), meteringDevices: ['expansion-valve' as const] }
    const warmCap = { ...fakeTest('warm-capillary-test', false), meteringDevices: ['capillary' as const] }
    const input = { kb: { tests: [valveCheck, warmCap, fakeTest('leak-search', false)], causes }, model: model(), kind: 'single-stage' as const, posterior: [0.5, 0.5], done: [], readingsPresent: new Set<string>() }
    expect(proposeTests({ ...input, meteringDevices: { single: 'capillary' } }).map((t) => t.test).sort()).toEqual(['leak-search', 'warm-capillary-test'])
    expect(proposeTests({ ...input, meteringDevices: { single: 'expansion-valve' } }).map((t) => t.test).sort()).toEqual(['expansion-valve-check', 'leak-search'])
    expect(proposeTests(input)).toHaveLength(3)
  })

  it('names the cause a test speaks to when it tells no two likely causes apart, never a cause it cannot show', () => {
    const inspection: TestDef = {
      ...fakeTest('condenser-inspection', false),
      outcomes: [
        { slug: 'fouled', label: 'fouled', likelihoods: { healthy: 0.05, default: 0.05, 'condenser-airflow': 0.95, other: 0.1 } },
        { slug: 'clean', label: 'clean', likelihoods: { healthy: 0.95, default: 0.95, 'condenser-airflow': 0.05, other: 0.9 } },
      ],
    }
    const three: KindModel = {
      ...model(),
      hypotheses: [
        { key: 'compressor-electrical@single', cause: 'compressor-electrical', stage: 'single' },
        { key: 'condenser-airflow@single', cause: 'condenser-airflow', stage: 'single' },
        { key: 'refrigerant-leak@single', cause: 'refrigerant-leak', stage: 'single' },
      ],
    }
    const names = [...causes, { slug: 'compressor-electrical' as const, short: 'an electrical fault' }, { slug: 'condenser-airflow' as const, short: 'poor condenser airflow' }]
    const [proposed] = proposeTests({ kb: { tests: [inspection], causes: names }, model: three, kind: 'single-stage', posterior: [0.97, 0.01, 0.02], done: [], readingsPresent: new Set() })
    expect(proposed?.value).toBe('Rules poor condenser airflow in or out.')
    expect(proposed?.separates).toEqual([{ cause: 'condenser-airflow', stage: 'single' }])
  })

  it('puts only the best few in words when a limit is given, in the same order as the whole list', () => {
    const input = {
      kb: { tests: [fakeTest('nitrogen-pressure-test', true), fakeTest('leak-search', false), fakeTest('standing-pressure-check', false)], causes },
      model: model(),
      kind: 'single-stage' as const,
      posterior: [0.5, 0.5],
      done: [],
      readingsPresent: new Set<string>(),
    }
    const all = proposeTests(input)
    const best = proposeTests({ ...input, limit: 2 })
    expect(all).toHaveLength(3)
    expect(best).toEqual(all.slice(0, 2))
    expect(best.map((t) => t.test)).not.toContain('nitrogen-pressure-test')
  })
})
