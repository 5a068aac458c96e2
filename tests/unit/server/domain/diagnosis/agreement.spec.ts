import { describe, expect, it } from 'vitest'
import { rankingAgreement } from '#server/domain/diagnosis/agreement'

describe('rankingAgreement', () => {
  it('counts a case when a confirmed cause and stage is first, or within the first three', () => {
    const result = rankingAgreement([
      { confirmed: [{ cause: 'refrigerant-leak', stage: 'low' }], ranked: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'other' }] },
      { confirmed: [{ cause: 'restriction', stage: 'low' }], ranked: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'moisture-freeze', stage: 'low' }, { cause: 'restriction', stage: 'low' }] },
      // Same cause on the other stage is not a match.
      { confirmed: [{ cause: 'refrigerant-leak', stage: 'high' }], ranked: [{ cause: 'refrigerant-leak', stage: 'low' }] },
      { confirmed: [{ cause: 'other' }], ranked: [{ cause: 'other' }] },
    ])
    expect(result).toEqual({ closedCases: 4, topMatches: 2, topThreeMatches: 3, topShare: 0.5, topThreeShare: 0.75 })
  })

  it('says nothing rather than 0 % when there are no closed cases', () => {
    expect(rankingAgreement([])).toMatchObject({ closedCases: 0, topShare: null, topThreeShare: null })
  })
})
