import { describe, expect, it } from 'vitest'
import { cylinderLedger, stageRefrigerantLog, type LogTransaction } from '#server/domain/compliance/refrigerant-log'
import { BadInputError } from '#server/domain/errors'

const LB = 453.59237 // g per lb, exact
const add = (at: string, grams: number, extra: Partial<LogTransaction> = {}): LogTransaction => ({ at, stage: 'single', refrigerant: 'R22', grams, direction: 'added', cylinder: 'V-01', technician: 'T. Frost', ...extra })
const recover = (at: string, grams: number, extra: Partial<LogTransaction> = {}): LogTransaction => ({ at, stage: 'single', refrigerant: 'R22', grams, direction: 'recovered', cylinder: 'REC-7', technician: 'T. Frost', ...extra })
const stage = { stage: 'single', refrigerant: 'R22', fullChargeG: 100 * LB } as const

describe('stageRefrigerantLog', () => {
  // 40 CFR 82.152 annualizing method on each addition: 5 lb after 365 d (first, log started a year
  // before) = 5 %; then 10 lb 180 d later = (10/100)/(180/365) × 100 = 20.28 %.
  it('computes the leak rate after each addition by both methods', () => {
    const log = stageRefrigerantLog({ ...stage, since: '2025-01-01' }, [add('2026-01-01T10:00:00Z', 5 * LB), add('2026-06-30T09:00:00Z', 10 * LB)])
    expect(log.additions).toHaveLength(2)
    const [first, second] = log.additions
    expect(first).toMatchObject({ daysSinceLastAddition: null, daysUsed: 365 })
    expect(first!.annualizingPercent).toBeCloseTo(5, 9)
    expect(second).toMatchObject({ daysSinceLastAddition: 180, daysUsed: 180 })
    expect(second!.annualizingPercent).toBeCloseTo(20.2778, 4)
    // rolling average (40 CFR 82.152): 5 + 10 lb within 365 days of a 100 lb charge = 15 %
    expect(second!.rollingAveragePercent).toBeCloseTo(15, 9)
  })

  // Rolling average window: only the past 365 days. 3 + 2 + 4 lb to a 60 lb charge within a year = 15 %;
  // an addition 400 days earlier is outside it.
  it('keeps the rolling average to the past 365 days', () => {
    const s = { ...stage, fullChargeG: 60 * LB }
    const log = stageRefrigerantLog(s, [add('2024-11-01', 6 * LB), add('2025-12-10', 3 * LB), add('2026-03-01', 2 * LB), add('2026-06-01', 4 * LB)])
    expect(log.additions.at(-1)!.rollingAveragePercent).toBeCloseTo(15, 9)
  })

  it('restarts the rolling average after a passed follow-up verification test (40 CFR 82.152)', () => {
    const log = stageRefrigerantLog(stage, [add('2026-01-10', 5 * LB), add('2026-03-01', 5 * LB)], { checks: [{ at: '2026-02-01', kind: 'follow-up-verification', passed: true }] })
    expect(log.additions[1]!.rollingAveragePercent).toBeCloseTo(5, 9)
    expect(log.additions[1]!.note).toMatch(/follow-up verification of 2026-02-01/)
  })

  it('treats additions of the same case or the same day as one addition', () => {
    const log = stageRefrigerantLog(stage, [add('2026-01-01', 5 * LB), add('2026-03-02T08:00:00Z', 2 * LB, { caseId: 9 }), add('2026-03-03T15:00:00Z', 1 * LB, { caseId: 9 })])
    expect(log.additions).toHaveLength(2)
    expect(log.additions[1]).toMatchObject({ entryIndexes: [1, 2], daysSinceLastAddition: 61 })
    expect(log.additions[1]!.addedG).toBeCloseTo(3 * LB, 6)
  })

  it('counts only what goes beyond the recovered refrigerant when a repaired stage is recharged', () => {
    // 100 lb stage; 90 lb recovered for a repair (10 lb had leaked), 100 lb charged back: 10 lb is the loss.
    const log = stageRefrigerantLog(stage, [add('2025-06-01', 1 * LB), recover('2026-02-01', 90 * LB, { caseId: 4 }), add('2026-02-03', 100 * LB, { caseId: 4 })])
    const recharge = log.additions[1]!
    expect(recharge.countedAsLossG).toBeCloseTo(10 * LB, 6)
    expect(recharge.note).toMatch(/put back refrigerant recovered/)
    expect(log.currentChargeG).toBeCloseTo(100 * LB, 6)
    expect(log.presumedLostG).toBeCloseTo(11 * LB, 6) // 1 lb topped up in 2025 + the 10 lb found missing
    expect(log.recoveredByCylinder).toEqual([{ cylinder: 'REC-7', refrigerant: 'R22', grams: 90 * LB }])
  })

  // 40 CFR 82.157(b): no leak rate for an addition right after installation or a retrofit, or for seasonal variance.
  it('gives no leak rate for a first charge, a retrofit or seasonal variance', () => {
    const log = stageRefrigerantLog(stage, [add('2025-01-01', 100 * LB, { purpose: 'initial-charge' }), add('2025-11-01', 4 * LB, { purpose: 'seasonal-variance' })])
    expect(log.additions.map((a) => a.annualizingPercent)).toEqual([null, null])
    expect(log.additions[0]!.exemptBecause).toMatch(/first charge/)
    expect(log.entries[0]!.chargeAfterG).toBeCloseTo(100 * LB, 6) // the log opened empty
  })

  it('keeps the charge history, the current charge and the totals', () => {
    const log = stageRefrigerantLog({ ...stage, fullChargeG: 1000 }, [add('2026-01-01', 200), recover('2026-02-01', 1000), add('2026-02-02', 600)])
    expect(log.entries.map((e) => e.chargeAfterG)).toEqual([1000, 0, 600])
    expect(log).toMatchObject({ currentChargeG: 600, totalAddedG: 800, totalRecoveredG: 1000, presumedLostG: 200 })
  })

  it('judges each addition against the limit in force on its day', () => {
    const log = stageRefrigerantLog({ ...stage, since: '2025-01-01' }, [add('2026-01-01', 5 * LB), add('2026-06-30', 10 * LB)], { jurisdiction: 'us-federal', applianceType: 'commercial-refrigeration' })
    // 40 CFR 82.157(c)(2)(i): 20 % limit; 20.28 % exceeds it.
    expect(log.additions.map((a) => a.assessment?.exceedsThreshold)).toEqual([false, true])
    const rolling = stageRefrigerantLog({ ...stage, since: '2025-01-01' }, [add('2026-01-01', 5 * LB), add('2026-06-30', 10 * LB)], { jurisdiction: 'us-federal', applianceType: 'commercial-refrigeration', method: 'rolling-average' })
    expect(rolling.additions[1]!.assessment?.exceedsThreshold).toBe(false) // 15 % by the rolling average
  })

  it('warns about a line of another refrigerant, a recovery without cylinder and more recovered than charged', () => {
    const log = stageRefrigerantLog({ ...stage, fullChargeG: 500 }, [recover('2026-01-01', 700, { cylinder: '' }), add('2026-01-02', 500, { refrigerant: 'R404A' })])
    expect(log.warnings.join(' ')).toMatch(/R404A logged on a R22 stage/)
    expect(log.warnings.join(' ')).toMatch(/without a cylinder/)
    expect(log.warnings.join(' ')).toMatch(/more than the 500 g/)
  })

  it('ignores other stages and refuses broken lines', () => {
    const log = stageRefrigerantLog(stage, [add('2026-01-01', 100, { stage: 'low' })])
    expect(log.entries).toHaveLength(0)
    expect(() => stageRefrigerantLog(stage, [add('2026-01-01', -5)])).toThrow(BadInputError)
    expect(() => stageRefrigerantLog(stage, [add('not a date', 5)])).toThrow(BadInputError)
    expect(() => stageRefrigerantLog({ ...stage, fullChargeG: 0 }, [])).toThrow(BadInputError)
  })
})

describe('cylinderLedger', () => {
  it('tracks recovered refrigerant to its cylinder and warns when a cylinder holds two refrigerants', () => {
    const ledger = cylinderLedger([
      { ...recover('2026-01-01', 300), unitId: 1 },
      { ...recover('2026-01-05', 200, { refrigerant: 'R404A' }), unitId: 2 },
      { ...add('2026-01-06', 250), unitId: 1 },
    ])
    const rec = ledger.find((c) => c.cylinder === 'REC-7')!
    expect(rec.recovered).toEqual([{ refrigerant: 'R22', grams: 300 }, { refrigerant: 'R404A', grams: 200 }])
    expect(rec.units).toEqual(['1', '2'])
    expect(rec.warnings[0]).toMatch(/one refrigerant per cylinder/)
    expect(ledger.find((c) => c.cylinder === 'V-01')!.charged).toEqual([{ refrigerant: 'R22', grams: 250 }])
  })
})
