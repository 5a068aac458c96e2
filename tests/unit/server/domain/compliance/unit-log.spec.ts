import { describe, expect, it } from 'vitest'
import type { LogTransaction } from '#server/domain/compliance/refrigerant-log'
import { dutyUnit, fGasViews, unitLogView, type LogUnit } from '#server/domain/compliance/unit-log'

const LB = 453.59237 // g per lb, exact
const cascade: LogUnit = {
  id: 7,
  name: 'Freezer F-7',
  settings: { applianceType: 'other', hermeticallySealed: false, leakDetectionSystem: false },
  stages: [
    { stage: 'high', refrigerant: 'R404A', chargeG: 600 },
    { stage: 'low', refrigerant: 'R23', chargeG: 250 },
  ],
}
const add = (at: string, grams: number, extra: Partial<LogTransaction> = {}): LogTransaction => ({ at, stage: 'low', refrigerant: 'R23', grams, direction: 'added', cylinder: 'S-1', ...extra })

describe('fGasViews', () => {
  // Regulation (EU) No 517/2014 Art. 4(3) and Annex IV; 2024/573 Art. 5 and Annex VI (AR4 GWPs for HFCs):
  // R404A 0.6 kg × 3922 = 2.353 t, R23 0.25 kg × 14800 = 3.7 t; together 6.053 t CO2e, from 5 t: every 12 months.
  it('adds the circuits of a cascade and gives the check interval under both regulations', () => {
    const views = fGasViews(cascade)
    expect(views.map((v) => v.basis).sort()).toEqual(['eu-2014', 'eu-2024'])
    for (const v of views) {
      expect(v.annexITonnesCo2e).toBeCloseTo(0.6 * 3922 / 1000 + 0.25 * 14800 / 1000, 9)
      expect(v.leakCheckIntervalMonths).toBe(12)
    }
  })

  // With a leak detection system fitted the 5–50 t band checks every 24 months (517/2014 Art. 4(3)(a)).
  it('doubles the interval with a leak detection system', () => {
    const views = fGasViews({ ...cascade, settings: { ...cascade.settings, leakDetectionSystem: true } })
    expect(views.every((v) => v.leakCheckIntervalMonths === 24)).toBe(true)
  })

  it('leaves out a stage without a nameplate charge and says so', () => {
    const views = fGasViews({ ...cascade, stages: [cascade.stages[0]!, { stage: 'low', refrigerant: 'R23', chargeG: null }] })
    expect(views[0]!.circuits).toHaveLength(1)
    expect(views[0]!.text.join(' ')).toMatch(/low stage \(R23\) is left out/)
    expect(dutyUnit({ ...cascade, stages: [{ stage: 'low', refrigerant: 'R23', chargeG: null }] }).stages).toEqual([])
  })
})

describe('unitLogView', () => {
  // 40 CFR 82.152 annualizing method: 25 g into a 250 g charge 73 days after the last addition
  // = (25/250) / (73/365) × 100 = 50 %; rolling average 50 g / 250 g = 20 % (figures invented).
  it('gives each stage its own log and leak rates, and keeps the other stage apart', () => {
    const view = unitLogView(cascade, [add('2026-01-01', 25), add('2026-03-15', 25)], [], { jurisdiction: 'us-federal', method: 'annualizing', today: new Date('2026-04-01T00:00:00Z') })
    const low = view.stages.find((s) => s.stage === 'low')!
    const high = view.stages.find((s) => s.stage === 'high')!
    expect(high.entries).toEqual([])
    expect(low.additions[1]!.daysSinceLastAddition).toBe(73)
    expect(low.additions[1]!.annualizingPercent).toBeCloseTo(50, 9)
    expect(low.additions[1]!.rollingAveragePercent).toBeCloseTo(20, 9)
    // 40 CFR 84.106 covers HFC appliances from 15 lb; 250 g is far below, so no limit applies.
    expect(low.additions[1]!.assessment).toMatchObject({ applies: false })
    expect(view.duties).toEqual([])
  })

  // Under the EU regulation the same unit owes a periodic leak check; with none on record it is due now.
  it('lists the leak check the EU rules require when none is on record', () => {
    const view = unitLogView(cascade, [], [], { jurisdiction: 'eu', method: 'annualizing', today: new Date('2026-04-01T00:00:00Z') })
    expect(view.duties).toEqual([expect.objectContaining({ kind: 'leak-check', stage: null, dueBy: '2026-04-01' })])
    const checked = unitLogView(cascade, [], [{ at: '2026-03-10', kind: 'leak-check', passed: true }], { jurisdiction: 'eu', method: 'annualizing', today: new Date('2026-04-01T00:00:00Z') })
    // 12 months from the check, to the day before its anniversary (common reading of "every 12 months").
    expect(checked.duties[0]).toMatchObject({ kind: 'leak-check', dueBy: '2027-03-09', overdue: false })
  })

  it('keeps the lines of a stage whose charge is unknown, without leak rates', () => {
    const unit = { ...cascade, stages: [cascade.stages[0]!, { stage: 'low' as const, refrigerant: 'R23', chargeG: null }] }
    const view = unitLogView(unit, [add('2026-01-01', 25), add('2026-02-01', 40, { direction: 'recovered', cylinder: 'R-9' })], [], { jurisdiction: 'us-federal', method: 'annualizing', today: new Date('2026-04-01T00:00:00Z') })
    const low = view.stages.find((s) => s.stage === 'low')!
    expect(low).toMatchObject({ fullChargeG: null, currentChargeG: null, totalAddedG: 25, totalRecoveredG: 40, additions: [] })
    expect(low.entries.map((e) => e.direction)).toEqual(['added', 'recovered'])
    expect(low.warnings[0]).toMatch(/no nameplate charge/)
  })

  // 100 lb R404A commercial refrigeration: 10 lb, then 10 lb 180 days later = 20.28 % (40 CFR 82.152),
  // over the 20 % limit of 40 CFR 84.106 for commercial refrigeration: repair within 30 days.
  it('judges a large commercial system against the US limit and owes a repair', () => {
    const unit: LogUnit = { id: 1, name: 'Walk-in', settings: { applianceType: 'commercial-refrigeration', hermeticallySealed: false, leakDetectionSystem: false }, stages: [{ stage: 'single', refrigerant: 'R404A', chargeG: 100 * LB }] }
    const lines = [add('2026-01-05', 10 * LB, { stage: 'single', refrigerant: 'R404A' }), add('2026-07-04', 10 * LB, { stage: 'single', refrigerant: 'R404A' })]
    const view = unitLogView(unit, lines, [], { jurisdiction: 'us-federal', method: 'annualizing', today: new Date('2026-07-10T00:00:00Z') })
    expect(view.stages[0]!.additions[1]!.assessment).toMatchObject({ thresholdPercent: 20, exceedsThreshold: true, repairWithinDays: 30 })
    expect(view.duties).toContainEqual(expect.objectContaining({ kind: 'repair', dueBy: '2026-08-03', overdue: false, daysLeft: 24 }))
  })
})
