import { describe, expect, it } from 'vitest'
import { hitWithin, impactOf, matchesConfirmed, type ReplayedCase } from '#server/domain/knowledge/impact'

// A small fixed history; every figure below is counted by hand from these five cases.
const HISTORY: ReplayedCase[] = [
  // 1: both versions put the confirmed leak first.
  { caseId: 1, confirmed: [{ cause: 'refrigerant-leak', stage: 'low' }], candidate: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'restriction', stage: 'low' }], published: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'restriction', stage: 'low' }] },
  // 2: candidate first, published second.
  { caseId: 2, confirmed: [{ cause: 'restriction', stage: 'single' }], candidate: [{ cause: 'restriction', stage: 'single' }, { cause: 'overcharge', stage: 'single' }], published: [{ cause: 'overcharge', stage: 'single' }, { cause: 'restriction', stage: 'single' }] },
  // 3: the right cause on the wrong stage first in both; candidate has it third, published not in three.
  { caseId: 3, confirmed: [{ cause: 'refrigerant-leak', stage: 'high' }], candidate: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'other' }, { cause: 'refrigerant-leak', stage: 'high' }], published: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'other' }, { cause: 'condenser-airflow', stage: 'high' }, { cause: 'refrigerant-leak', stage: 'high' }] },
  // 4: two confirmed causes; a confirmation without a stage matches any stage. Published first, candidate second.
  { caseId: 4, confirmed: [{ cause: 'condenser-airflow' }, { cause: 'overcharge', stage: 'single' }], candidate: [{ cause: 'high-heat-load' }, { cause: 'condenser-airflow', stage: 'single' }], published: [{ cause: 'condenser-airflow', stage: 'single' }] },
  // 5: no confirmed cause: not counted at all.
  { caseId: 5, confirmed: [], candidate: [{ cause: 'other' }], published: [{ cause: 'restriction', stage: 'low' }] },
]

describe('impact of a candidate version on past cases', () => {
  it('matches a confirmed cause by cause and, when named, by stage', () => {
    expect(matchesConfirmed({ cause: 'restriction', stage: 'low' }, { cause: 'restriction', stage: 'low' })).toBe(true)
    expect(matchesConfirmed({ cause: 'restriction', stage: 'low' }, { cause: 'restriction', stage: 'high' })).toBe(false)
    expect(matchesConfirmed({ cause: 'restriction', stage: 'low' }, { cause: 'restriction' })).toBe(true)
    expect(hitWithin([{ cause: 'other' }, { cause: 'restriction', stage: 'low' }], [{ cause: 'restriction' }], 1)).toBe(false)
    expect(hitWithin([{ cause: 'other' }, { cause: 'restriction', stage: 'low' }], [{ cause: 'restriction' }], 3)).toBe(true)
  })

  it('gives top-1 and top-3 of both versions, the cases whose first cause changes and a confusion table', () => {
    const impact = impactOf(HISTORY)
    expect(impact.cases).toBe(4)
    // Candidate: top-1 on cases 1, 2 (2 of 4); top-3 on 1, 2, 3, 4 (4 of 4).
    expect(impact.candidate).toEqual({ top1: 0.5, top3: 1, top1Cases: 2, top3Cases: 4 })
    // Published: top-1 on cases 1, 4 (2 of 4); top-3 on 1, 2, 4 (3 of 4; case 3 has the leak fourth).
    expect(impact.published).toEqual({ top1: 0.5, top3: 0.75, top1Cases: 2, top3Cases: 3 })
    // First causes differ on case 2 (restriction vs overcharge) and case 4 (high-heat-load vs condenser-airflow).
    expect(impact.changedFirst).toEqual([2, 4])
    const byCause = Object.fromEntries(impact.confusion.map((r) => [r.cause, r]))
    expect(Object.keys(byCause).sort()).toEqual(['condenser-airflow', 'overcharge', 'refrigerant-leak', 'restriction'])
    // Leak confirmed twice (cases 1, 3): candidate and published both put a leak first both times, right on case 1 only.
    expect(byCause['refrigerant-leak']).toEqual({
      cause: 'refrigerant-leak', cases: 2, candidateFirst: { 'refrigerant-leak': 2 }, publishedFirst: { 'refrigerant-leak': 2 }, candidateTop1: 1, publishedTop1: 1,
    })
    expect(byCause.restriction).toMatchObject({ cases: 1, candidateFirst: { restriction: 1 }, publishedFirst: { overcharge: 1 }, candidateTop1: 1, publishedTop1: 0 })
    expect(byCause['condenser-airflow']).toMatchObject({ cases: 1, candidateFirst: { 'high-heat-load': 1 }, publishedFirst: { 'condenser-airflow': 1 }, candidateTop1: 0, publishedTop1: 1 })
    expect(byCause.overcharge).toMatchObject({ cases: 1, candidateTop1: 0, publishedTop1: 0 })
    // Largest rows first.
    expect(impact.confusion[0]!.cause).toBe('refrigerant-leak')
  })

  it('reports zero shares, not NaN, without cases', () => {
    expect(impactOf([])).toMatchObject({ cases: 0, candidate: { top1: 0, top3: 0 }, published: { top1: 0, top3: 0 }, changedFirst: [], confusion: [] })
  })
})
