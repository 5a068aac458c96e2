// How often the ranking shown when a case was closed already had the confirmed cause on top, or
// in its top three: the knowledge base's own track record, for the senior engineers who tune it.
import type { RankingAgreement as Agreement } from '#shared/types/diagnosis'

export interface ClosedCaseRanking {
  confirmed: { cause: string; stage?: string }[]
  ranked: { cause: string; stage?: string }[]
}


const same = (a: { cause: string; stage?: string }, b: { cause: string; stage?: string }) =>
  a.cause === b.cause && (a.stage ?? null) === (b.stage ?? null)

/** Counts the closed cases whose final ranking put a confirmed cause first / in the first three. */
export function rankingAgreement(cases: ClosedCaseRanking[]): Agreement {
  const hit = (c: ClosedCaseRanking, n: number) => c.ranked.slice(0, n).some((r) => c.confirmed.some((k) => same(r, k)))
  const topMatches = cases.filter((c) => hit(c, 1)).length
  const topThreeMatches = cases.filter((c) => hit(c, 3)).length
  const share = (n: number) => (cases.length ? n / cases.length : null)
  return { closedCases: cases.length, topMatches, topThreeMatches, topShare: share(topMatches), topThreeShare: share(topThreeMatches) }
}
