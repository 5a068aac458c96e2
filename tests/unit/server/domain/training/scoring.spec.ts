import { describe, expect, it } from 'vitest'
import { expectedCauses, scoreAttempt, type ScoreInput } from '#server/domain/training/scoring'

// The weights are this product's own scoring rules (no outside source); every figure below is
// worked out by hand from them.
describe('exercise scoring', () => {
  const base: ScoreInput = {
    // A cascade whose low stage runs on ethane (R170, safety class A3: flammable).
    stages: [{ stage: 'high', flammable: false }, { stage: 'low', flammable: true }],
    confirmed: [{ cause: 'refrigerant-leak', stage: 'low' }],
    answer: [{ stage: 'high', cause: 'no-refrigeration-fault' }, { stage: 'low', cause: 'refrigerant-leak' }],
    requests: [
      { kind: 'reading', stage: 'low', minutes: 2, invasive: false },
      { kind: 'reading', minutes: 2, invasive: false },
      { kind: 'test', test: 'standing-pressure-check', stage: 'low', minutes: 20, invasive: false },
    ],
    engineMinutes: 30,
    engineTests: ['standing-pressure-check|low'],
  }

  it('gives full marks for both stages right, within the engine’s minutes and with nothing invasive', () => {
    const score = scoreAttempt(base)
    // 2 + 2 + 20 = 24 minutes, under the engine's 30: full time points.
    expect(score.minutesSpent).toBe(24)
    expect(score.rightStages).toBe(2)
    expect(score.causePoints).toBe(70)
    expect(score.timePoints).toBe(30)
    expect(score.penalty).toBe(0)
    expect(score.points).toBe(100)
  })

  it('scores a half-right, slow attempt with a needless nitrogen test on the flammable stage', () => {
    const score = scoreAttempt({
      ...base,
      answer: [{ stage: 'high', cause: 'condenser-airflow' }, { stage: 'low', cause: 'refrigerant-leak' }],
      requests: [...base.requests, { kind: 'test', test: 'nitrogen-pressure-test', stage: 'low', minutes: 120, invasive: true }],
    })
    // Causes: 1 of 2 stages right -> 70 × 1/2 = 35.
    expect(score.stages).toEqual([
      { stage: 'high', expected: 'no-refrigeration-fault', named: 'condenser-airflow', right: false },
      { stage: 'low', expected: 'refrigerant-leak', named: 'refrigerant-leak', right: true },
    ])
    expect(score.causePoints).toBe(35)
    // Minutes: 24 + 120 = 144; time: 30 × 30/144 = 6.25 -> 6.3 (one decimal).
    expect(score.minutesSpent).toBe(144)
    expect(score.timePoints).toBe(6.3)
    // The nitrogen test is off the engine's path (needless, -10) and opens the ethane stage (unsafe, -20).
    expect(score.needlessInvasive).toEqual([{ test: 'nitrogen-pressure-test', stage: 'low' }])
    expect(score.unsafe).toEqual([{ test: 'nitrogen-pressure-test', stage: 'low' }])
    expect(score.penalty).toBe(30)
    // 35 + 6.3 - 30 = 11.3
    expect(score.points).toBe(11.3)
  })

  it('never goes below zero, and an invasive test on the engine’s path is no penalty', () => {
    const wrong = scoreAttempt({
      ...base,
      answer: [],
      requests: [{ kind: 'test', test: 'vacuum-decay-test', stage: 'low', minutes: 90, invasive: true }, { kind: 'test', test: 'nitrogen-pressure-test', stage: 'high', minutes: 120, invasive: true }],
    })
    // 0 cause points, time 30 × 30/210 = 4.29 -> 4.3, penalty 10 + 20 + 10 = 40: clamped to 0.
    expect(wrong.timePoints).toBe(4.3)
    expect(wrong.penalty).toBe(40)
    expect(wrong.points).toBe(0)
    const onPath = scoreAttempt({ ...base, engineTests: ['vacuum-decay-test|low'], requests: [{ kind: 'test', test: 'vacuum-decay-test', stage: 'low', minutes: 90, invasive: true }] })
    expect(onPath.penalty).toBe(0)
  })

  it('expects a unit-wide confirmed cause on every stage without a cause of its own', () => {
    expect(expectedCauses(['high', 'low'], [{ cause: 'other' }, { cause: 'restriction', stage: 'low' }])).toEqual([
      { stage: 'high', cause: 'other' },
      { stage: 'low', cause: 'restriction' },
    ])
  })
})
