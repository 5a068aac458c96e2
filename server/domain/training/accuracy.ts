// How well a knowledge base ranks the causes cases went on to confirm: top-1 and top-3 over
// confirmed cases, overall, per confirmed cause, per equipment class and per month. No I/O here.
import type { Cause, Stage } from '#shared/types/diagnosis'
import type { AccuracyCell, KbAccuracyDto } from '#shared/types/training'

/** One confirmed case as the knowledge base ranked it. */
export interface RankedCase {
  caseId: number
  unitName: string
  equipmentClass: string
  /** ISO time the case was closed. */
  closedAt: string
  confirmed: { cause: Cause; stage?: Stage }[]
  /** The ranked hypotheses, best first. */
  ranked: { cause: Cause; stage?: Stage; probability: number }[]
}

/** Most wrongly ranked cases listed; the counts cover every case. */
export const MAX_WRONG_LISTED = 50

/** A ranked hypothesis names a confirmed cause when the causes agree and so do their stages (a cause tied to no circuit matches any). */
export function names(h: { cause: Cause; stage?: Stage }, c: { cause: Cause; stage?: Stage }): boolean {
  return h.cause === c.cause && (!h.stage || !c.stage || h.stage === c.stage)
}

/** Position (1-based) of the best-ranked hypothesis naming any confirmed cause, or null. */
export function rankOfConfirmed(ranked: RankedCase['ranked'], confirmed: RankedCase['confirmed']): number | null {
  const i = ranked.findIndex((h) => confirmed.some((c) => names(h, c)))
  return i < 0 ? null : i + 1
}

function tally(map: Map<string, AccuracyCell>, key: string, rank: number | null) {
  const cell = map.get(key) ?? { key, cases: 0, top1: 0, top3: 0 }
  cell.cases++
  if (rank === 1) cell.top1++
  if (rank !== null && rank <= 3) cell.top3++
  map.set(key, cell)
}

/** The accuracy tables of a set of ranked confirmed cases; `month` groups by the closing month in UTC. */
export function accuracyOf(cases: RankedCase[], version: { id: number | string; label: string }): KbAccuracyDto {
  const overall = new Map<string, AccuracyCell>()
  const byCause = new Map<string, AccuracyCell>()
  const byClass = new Map<string, AccuracyCell>()
  const byMonth = new Map<string, AccuracyCell>()
  const wrong: KbAccuracyDto['wrong'] = []
  for (const c of [...cases].sort((a, b) => b.closedAt.localeCompare(a.closedAt))) {
    if (!c.confirmed.length) continue
    const rank = rankOfConfirmed(c.ranked, c.confirmed)
    tally(overall, 'all', rank)
    for (const cause of new Set(c.confirmed.map((x) => x.cause))) tally(byCause, cause, rank)
    tally(byClass, c.equipmentClass, rank)
    tally(byMonth, c.closedAt.slice(0, 7), rank)
    if (rank !== 1 && wrong.length < MAX_WRONG_LISTED) {
      wrong.push({ caseId: c.caseId, unitName: c.unitName, closedAt: c.closedAt, confirmed: c.confirmed, rankOfConfirmed: rank, top: c.ranked.slice(0, 3) })
    }
  }
  const byCases = (a: AccuracyCell, b: AccuracyCell) => b.cases - a.cases || a.key.localeCompare(b.key)
  return {
    knowledgeBaseVersion: { id: version.id, label: version.label },
    overall: overall.get('all') ?? { key: 'all', cases: 0, top1: 0, top3: 0 },
    byCause: [...byCause.values()].sort(byCases),
    byEquipmentClass: [...byClass.values()].sort(byCases),
    byMonth: [...byMonth.values()].sort((a, b) => a.key.localeCompare(b.key)),
    wrong,
  }
}
