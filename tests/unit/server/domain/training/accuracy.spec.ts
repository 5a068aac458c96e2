import { describe, expect, it } from 'vitest'
import { accuracyOf, rankOfConfirmed, type RankedCase } from '#server/domain/training/accuracy'

const ranked = (...hs: [string, string?][]) => hs.map(([cause, stage], i) => ({ cause, ...(stage ? { stage } : {}), probability: 0.5 / (i + 1) })) as RankedCase['ranked']

describe('knowledge-base accuracy', () => {
  it('finds the best rank of any confirmed cause, matching stages', () => {
    const r = ranked(['restriction', 'low'], ['refrigerant-leak', 'high'], ['refrigerant-leak', 'low'], ['other'])
    expect(rankOfConfirmed(r, [{ cause: 'refrigerant-leak', stage: 'low' }])).toBe(3)
    expect(rankOfConfirmed(r, [{ cause: 'refrigerant-leak' }])).toBe(2)
    expect(rankOfConfirmed(r, [{ cause: 'other' }])).toBe(4)
    expect(rankOfConfirmed(r, [{ cause: 'overcharge', stage: 'low' }])).toBeNull()
  })

  it('counts top-1 and top-3 overall, per cause, per class and per month, and lists the misses', () => {
    const cases: RankedCase[] = [
      { caseId: 1, unitName: 'A', equipmentClass: 'ult-freezer', closedAt: '2026-10-03T10:00:00.000Z', confirmed: [{ cause: 'refrigerant-leak', stage: 'low' }], ranked: ranked(['refrigerant-leak', 'low'], ['restriction', 'low']) },
      { caseId: 2, unitName: 'B', equipmentClass: 'ult-freezer', closedAt: '2026-11-04T10:00:00.000Z', confirmed: [{ cause: 'restriction', stage: 'low' }], ranked: ranked(['refrigerant-leak', 'low'], ['restriction', 'low']) },
      { caseId: 3, unitName: 'C', equipmentClass: 'cold-trap', closedAt: '2026-11-20T10:00:00.000Z', confirmed: [{ cause: 'overcharge', stage: 'single' }], ranked: ranked(['other'], ['restriction', 'single'], ['refrigerant-leak', 'single'], ['overcharge', 'single']) },
      { caseId: 4, unitName: 'D', equipmentClass: 'cold-trap', closedAt: '2026-11-21T10:00:00.000Z', confirmed: [], ranked: ranked(['other']) },
    ]
    const out = accuracyOf(cases, { id: 7, label: 'v7' })
    // Case 4 has no confirmed cause and is left out: 3 cases, 1 first, 2 in the first three.
    expect(out.overall).toEqual({ key: 'all', cases: 3, top1: 1, top3: 2 })
    expect(out.byEquipmentClass).toEqual([{ key: 'ult-freezer', cases: 2, top1: 1, top3: 2 }, { key: 'cold-trap', cases: 1, top1: 0, top3: 0 }])
    expect(out.byMonth).toEqual([{ key: '2026-10', cases: 1, top1: 1, top3: 1 }, { key: '2026-11', cases: 2, top1: 0, top3: 1 }])
    expect(out.byCause.find((c) => c.key === 'restriction')).toEqual({ key: 'restriction', cases: 1, top1: 0, top3: 1 })
    expect(out.wrong.map((w) => [w.caseId, w.rankOfConfirmed])).toEqual([[3, 4], [2, 2]])
    expect(out.wrong[0]!.top).toHaveLength(3)
  })
})
