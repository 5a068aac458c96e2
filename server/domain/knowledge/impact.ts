/**
 * Impact of a candidate knowledge-base version on past cases: every closed case with confirmed
 * causes is ranked again with the candidate and with the published version, and the two are
 * compared: how often the first cause (top-1) or one of the first three (top-3) is a confirmed
 * cause, which cases get another first cause, and per confirmed cause which cause each version puts
 * first (a confusion table). Pure: the rankings come in, the figures go out.
 */

import type { CauseRef, ConfusionRow, ImpactResult, TopShares } from '#shared/types/knowledge'

export type { CauseRef, ConfusionRow, ImpactResult, TopShares } from '#shared/types/knowledge'

export interface ReplayedCase {
  caseId: number
  confirmed: CauseRef[]
  /** The causes in ranked order, first the most likely. */
  candidate: CauseRef[]
  published: CauseRef[]
}

/** A ranked cause is a confirmed one when the cause agrees and so does the stage, if the confirmation names one. */
export function matchesConfirmed(ranked: CauseRef, confirmed: CauseRef): boolean {
  return ranked.cause === confirmed.cause && (confirmed.stage === undefined || confirmed.stage === null || ranked.stage === confirmed.stage)
}

/** True when one of the first `n` ranked causes is a confirmed one. */
export function hitWithin(ranked: CauseRef[], confirmed: CauseRef[], n: number): boolean {
  return ranked.slice(0, n).some((r) => confirmed.some((c) => matchesConfirmed(r, c)))
}

const sameRef = (a: CauseRef | undefined, b: CauseRef | undefined) => a?.cause === b?.cause && (a?.stage ?? null) === (b?.stage ?? null)

function shares(cases: ReplayedCase[], side: 'candidate' | 'published'): TopShares {
  const top1Cases = cases.filter((c) => hitWithin(c[side], c.confirmed, 1)).length
  const top3Cases = cases.filter((c) => hitWithin(c[side], c.confirmed, 3)).length
  const n = cases.length
  return { top1: n ? top1Cases / n : 0, top3: n ? top3Cases / n : 0, top1Cases, top3Cases }
}

function confusion(cases: ReplayedCase[]): ConfusionRow[] {
  const rows = new Map<string, ConfusionRow>()
  for (const c of cases) {
    for (const cause of new Set(c.confirmed.map((k) => k.cause))) {
      const row = rows.get(cause) ?? { cause, cases: 0, candidateFirst: {}, publishedFirst: {}, candidateTop1: 0, publishedTop1: 0 }
      rows.set(cause, row)
      row.cases++
      const own = c.confirmed.filter((k) => k.cause === cause)
      const cand = c.candidate[0]
      const pub = c.published[0]
      if (cand) row.candidateFirst[cand.cause] = (row.candidateFirst[cand.cause] ?? 0) + 1
      if (pub) row.publishedFirst[pub.cause] = (row.publishedFirst[pub.cause] ?? 0) + 1
      if (hitWithin(c.candidate, own, 1)) row.candidateTop1++
      if (hitWithin(c.published, own, 1)) row.publishedTop1++
    }
  }
  return [...rows.values()].sort((a, b) => b.cases - a.cases || a.cause.localeCompare(b.cause))
}

/** The impact figures of a set of replayed cases (only cases with at least one confirmed cause count). */
export function impactOf(replayed: ReplayedCase[]): ImpactResult {
  const cases = replayed.filter((c) => c.confirmed.length > 0)
  return {
    cases: cases.length,
    candidate: shares(cases, 'candidate'),
    published: shares(cases, 'published'),
    changedFirst: cases
      .filter((c) => !sameRef(c.candidate[0], c.published[0]))
      .map((c) => c.caseId)
      .sort((a, b) => a - b),
    confusion: confusion(cases),
  }
}
