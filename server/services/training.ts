// Training: replaying a case step by step with the knowledge-base version it recorded for each step.
import { findCase } from '#server/db/repositories/case-records'
import type { KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import { rankStoredCase } from '#server/domain/knowledge/replay'
import { NotFoundError } from '#server/domain/errors'
import { replayPoints, type ReplayPoint } from '#server/domain/training/replay'
import type { RankResponse } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import type { CaseReplayDto, ReplayStep } from '#shared/types/training'
import { inPlainWords } from '#shared/utils/vocabulary'
import { publishedKnowledgeBase, stampsFor } from './diagnosis'
import { knowledgeBaseVersion } from './replay'
import type { Actor } from './types'

// A replayed step depends only on the version and what was known, so it is kept by both.
const replayRankings = createCache<RankResponse>('replayed rankings', { max: 2_000 })

/** Evidence lines kept per cause in a replay: enough to say why, small enough for every step. */
const EVIDENCE_PER_CAUSE = 4

/**
 * Ranks what was known with one version. Replays use the knowledge base's own starting odds, not
 * what the organisation's confirmed cases taught later, so a replay never leans towards the answer
 * its own case went on to confirm and gives the same steps whenever it is run.
 */
export function rankKnownFacts(kb: KnowledgeBase, unit: UnitDto, known: Pick<ReplayPoint, 'symptoms' | 'readings' | 'testResults'>): Promise<RankResponse> {
  const rank = async () => {
    const ranked = await rankStoredCase(kb, unit, known)
    return { ...ranked, warnings: ranked.warnings.map(inPlainWords), priorNote: inPlainWords(ranked.priorNote) }
  }
  // A draft can still be edited under the same id; only versions that no longer change are kept.
  if (kb.version.status === 'draft') return rank()
  const facts = { kind: unit.kind, stages: unit.stages, design: unit.design, altitude: unit.siteAltitudeM, cls: unit.equipmentClass, ...known }
  return replayRankings.load(`${kb.version.id}|${JSON.stringify(facts)}`, rank)
}

/** The version a step recorded, or the published one with a note saying so. */
async function versionForStep(actor: Actor, versionId: number | null, fallback: () => Promise<KnowledgeBase>): Promise<{ kb: KnowledgeBase; note: string | null }> {
  if (versionId !== null) {
    try {
      return { kb: await knowledgeBaseVersion(actor.organisationId, versionId), note: null }
    } catch {
      const kb = await fallback()
      return { kb, note: `The knowledge-base version this step was ranked with (number ${versionId}) can no longer be read; ranked with the published version "${kb.version.label}" instead.` }
    }
  }
  const kb = await fallback()
  return { kb, note: `The case recorded no knowledge-base version for this step; ranked with the published version "${kb.version.label}".` }
}

function stepOf(point: ReplayPoint, ranking: RankResponse, note: string | null): ReplayStep {
  return {
    at: point.event.at,
    event: point.event,
    ranking: {
      causes: ranking.causes.map((c) => ({
        cause: c.cause, ...(c.stage ? { stage: c.stage } : {}), probability: c.probability, title: c.title, evidence: c.evidence.slice(0, EVIDENCE_PER_CAUSE),
      })),
      tests: ranking.tests.slice(0, 3).map((t) => ({ test: t.test, stage: t.stage, title: t.title, minutes: t.minutes, value: t.value, opensSystem: t.opensSystem })),
      knowledgeBaseVersion: ranking.knowledgeBaseVersion,
      warnings: ranking.warnings,
    },
    versionNote: note,
    recorded: point.recorded,
  }
}

/** `GET /api/cases/{id}/replay`: the case step by step, each step ranked with the version it recorded. */
export async function replayCase(actor: Actor, input: { caseId: number }): Promise<CaseReplayDto> {
  const found = await findCase(actor.organisationId, input.caseId)
  if (!found) throw new NotFoundError('Case not found')
  const stamps = await stampsFor(actor)
  let published: Promise<KnowledgeBase> | undefined
  const fallback = () => (published ??= publishedKnowledgeBase(actor.organisationId, stamps))
  const steps: ReplayStep[] = []
  let priorNote = ''
  for (const point of replayPoints(found)) {
    const { kb, note } = await versionForStep(actor, point.versionId, fallback)
    const ranking = await rankKnownFacts(kb, found.unit, point)
    priorNote = ranking.priorNote
    steps.push(stepOf(point, ranking, note))
  }
  return {
    caseId: found.id,
    status: found.status,
    complaint: found.complaint,
    unit: {
      id: found.unit.id, name: found.unit.name, kind: found.unit.kind, equipmentClass: found.unit.equipmentClass,
      stages: found.unit.stages.map((s) => ({ stage: s.stage, refrigerant: s.refrigerant })),
    },
    confirmedCauses: found.closure?.confirmedCauses ?? [],
    priorNote,
    steps,
  }
}
