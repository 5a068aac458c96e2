import { describe, expect, it } from 'vitest'
import { rankingAsShown } from '#server/domain/cases/case-record'
import type { RankResponse } from '#shared/types/diagnosis'

const ranking = {
  causes: [{ cause: 'refrigerant-leak', stage: 'low', probability: 0.7 }],
  tests: [{ test: 'standing-pressure-check', stage: 'low', minutes: 10 }],
} as unknown as RankResponse

describe('the ranking a case shows', () => {
  it('proposes the next test while the case is open', () => {
    expect(rankingAsShown('open', ranking)).toBe(ranking)
  })

  it('keeps the causes of a closed case but proposes no test', () => {
    const shown = rankingAsShown('closed', ranking)!
    expect(shown.causes).toEqual(ranking.causes)
    expect(shown.tests).toEqual([])
    expect(ranking.tests).toHaveLength(1)
  })

  it('passes a missing ranking through', () => {
    expect(rankingAsShown('closed', null)).toBeNull()
  })
})
