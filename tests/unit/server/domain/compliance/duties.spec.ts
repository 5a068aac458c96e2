import { describe, expect, it } from 'vitest'
import { complianceDuties, type DutyUnit } from '#server/domain/compliance/duties'
import type { LogTransaction } from '#server/domain/compliance/refrigerant-log'

const LB = 453.59237 // g per lb, exact

const rack: DutyUnit = { id: 1, name: 'Cold store rack', applianceType: 'commercial-refrigeration', stages: [{ stage: 'single', refrigerant: 'R22', fullChargeG: 100 * LB, since: '2025-01-01' }] }
const tx = (unitId: number, at: string, grams: number, refrigerant = 'R22', stage: LogTransaction['stage'] = 'single'): LogTransaction & { unitId: number } => ({ unitId, at, stage, refrigerant, grams, direction: 'added', cylinder: 'V-1' })

describe('complianceDuties, US federal rules', () => {
  // 10 lb into 100 lb of R22 180 days after the last addition: 20.28 % > 20 % for commercial refrigeration
  // (40 CFR 82.152, 82.157(c)(2)(i)); repair within 30 days of the addition (82.157(d), from memory).
  const transactions = [tx(1, '2026-01-01', 5 * LB), tx(1, '2026-06-30', 10 * LB)]

  it('asks for a repair within 30 days of an addition over the limit, and leak inspections', () => {
    const r = complianceDuties({ units: [rack], transactions, jurisdiction: 'us-federal', today: '2026-07-10' })
    const repair = r.duties.find((d) => d.kind === 'repair')!
    expect(repair).toMatchObject({ unitId: 1, stage: 'single', dueBy: '2026-07-30', daysLeft: 20, overdue: false })
    expect(repair.citation).toMatch(/82\.157/)
    // 50 to 500 lb commercial refrigeration: inspect once a year after exceeding (82.157(g), from memory).
    expect(r.duties.find((d) => d.kind === 'leak-inspection')).toMatchObject({ dueBy: '2027-06-30' })
    expect(r.due.map((d) => d.kind)).toEqual(['repair'])
  })

  it('turns the repair into a verification duty once a repair is recorded, and clears it once verified', () => {
    const repaired = complianceDuties({ units: [rack], transactions, checks: [{ unitId: 1, at: '2026-07-05', kind: 'repair', passed: true }], jurisdiction: 'us-federal', today: '2026-07-10' })
    expect(repaired.duties.map((d) => d.kind)).toEqual(['verification-test', 'leak-inspection'])
    const verified = complianceDuties({
      units: [rack],
      transactions,
      checks: [{ unitId: 1, at: '2026-07-05', kind: 'repair', passed: true }, { unitId: 1, at: '2026-07-08', kind: 'follow-up-verification', passed: true }],
      jurisdiction: 'us-federal',
      today: '2026-07-10',
    })
    expect(verified.duties.map((d) => d.kind)).toEqual(['leak-inspection'])
  })

  it('marks overdue duties', () => {
    const r = complianceDuties({ units: [rack], transactions, jurisdiction: 'us-federal', today: '2026-08-15' })
    expect(r.duties.find((d) => d.kind === 'repair')).toMatchObject({ overdue: true, daysLeft: -16 })
  })

  it('asks for nothing when the leak rate stays within the limit, or the stage is too small to be covered', () => {
    expect(complianceDuties({ units: [rack], transactions: [tx(1, '2026-01-01', 5 * LB), tx(1, '2026-06-30', 5 * LB)], jurisdiction: 'us-federal', today: '2026-07-10' }).duties).toEqual([])
    // A ULT freezer's 250 g R508B low stage: far below the 15 lb of 40 CFR 84.106.
    const ult: DutyUnit = { id: 2, name: 'ULT freezer', applianceType: 'other', stages: [{ stage: 'low', refrigerant: 'R508B', fullChargeG: 250 }] }
    expect(complianceDuties({ units: [ult], transactions: [tx(2, '2026-03-01', 200, 'R508B', 'low')], jurisdiction: 'us-federal', today: '2026-03-10' }).duties).toEqual([])
  })

  // 125 % or more of the full charge lost in a calendar year: report by 1 March (82.157(m), from memory).
  it('asks for a chronic-leak report after 125 % of the charge was added in a year', () => {
    const leaky = [tx(1, '2026-02-01', 40 * LB), tx(1, '2026-05-01', 45 * LB), tx(1, '2026-09-01', 45 * LB)]
    const r = complianceDuties({ units: [rack], transactions: leaky, jurisdiction: 'us-federal', today: '2026-12-20' })
    expect(r.duties.find((d) => d.kind === 'chronic-leak-report')).toMatchObject({ dueBy: '2027-03-01' })
  })
})

describe('complianceDuties, EU F-gas rules', () => {
  // 3 kg R404A = 11.77 t CO2e (Reg. (EU) 2024/573 Annex I, GWP 3 922): a check at least every 12 months.
  const freezer: DutyUnit = { id: 7, name: 'Blast freezer', stages: [{ stage: 'single', refrigerant: 'R404A', fullChargeG: 3000, since: '2024-05-01' }] }

  it('dates the next leak check from the last one, to the day before its anniversary', () => {
    // German Environment Agency F-gas FAQ: checked 31 January → due by 30 January of the next year.
    const r = complianceDuties({ units: [freezer], transactions: [], checks: [{ unitId: 7, at: '2026-01-31', kind: 'leak-check', passed: true }], jurisdiction: 'eu', today: '2026-06-01' })
    expect(r.duties).toEqual([expect.objectContaining({ kind: 'leak-check', dueBy: '2027-01-30', overdue: false })])
    expect(r.due).toEqual([])
  })

  it('counts from commissioning when no check is on record', () => {
    const r = complianceDuties({ units: [freezer], transactions: [], jurisdiction: 'eu', today: '2026-06-01' })
    expect(r.duties[0]).toMatchObject({ kind: 'leak-check', dueBy: '2025-04-30', overdue: true })
    expect(r.duties[0]!.text).toMatch(/none on record/)
  })

  // 2024/573 Art. 4(5): a leak found must be repaired without undue delay and the repair checked within one month.
  it('asks for a repair after a failed check, then a re-check within a month of the repair', () => {
    const found = complianceDuties({ units: [freezer], transactions: [], checks: [{ unitId: 7, at: '2026-05-20', kind: 'leak-check', passed: false }], jurisdiction: 'eu', today: '2026-05-25' })
    expect(found.duties.find((d) => d.kind === 'repair')).toMatchObject({ dueBy: '2026-05-20', overdue: true })
    const repaired = complianceDuties({
      units: [freezer],
      transactions: [],
      checks: [{ unitId: 7, at: '2026-05-20', kind: 'leak-check', passed: false }, { unitId: 7, at: '2026-05-22', kind: 'repair', passed: true }],
      jurisdiction: 'eu',
      today: '2026-05-25',
    })
    expect(repaired.duties.map((d) => d.kind)).toContain('recheck-after-repair')
    expect(repaired.duties.find((d) => d.kind === 'recheck-after-repair')).toMatchObject({ dueBy: '2026-06-22' })
    expect(repaired.duties.map((d) => d.kind)).not.toContain('repair')
  })

  it('asks nothing of a hermetically sealed unit under 10 t, nor of a hydrocarbon unit', () => {
    const sealed = { ...freezer, hermeticallySealed: true, stages: [{ stage: 'single' as const, refrigerant: 'R404A', fullChargeG: 2000 }] }
    const propane: DutyUnit = { id: 8, name: 'Display case', stages: [{ stage: 'single', refrigerant: 'R290', fullChargeG: 150 }] }
    expect(complianceDuties({ units: [sealed, propane], transactions: [], jurisdiction: 'eu', today: '2026-06-01' }).duties).toEqual([])
  })

  it('uses the 2014 regulation in Great Britain', () => {
    const r = complianceDuties({ units: [freezer], transactions: [], checks: [{ unitId: 7, at: '2026-01-31', kind: 'leak-check', passed: true }], jurisdiction: 'gb', today: '2026-06-01' })
    expect(r.duties[0]!.citation).toMatch(/517\/2014/)
  })
})
