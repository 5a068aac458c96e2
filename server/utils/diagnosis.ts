import { confirmedCauseCounts } from '#server/db/repositories/cases'
import { findPublishedVersion, loadVersionContent } from '#server/db/repositories/knowledge'
import { knowledgeBaseSourceSchema, type KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import { rankDiagnosis, RankInputError, type LearnedCount } from '#server/domain/diagnosis/rank'
import type { Cause, RankRequest, RankResponse, Stage } from '#shared/types/diagnosis'

// Published versions never change (a new publish makes a new version), so a loaded and validated
// version is kept for the life of the process. The published-version id per organisation and the
// learned prior counts are kept for a few seconds, and dropped at once when a case closes or a
// version is published, so ranking requests do not query them every time.
const versions = new Map<number, KnowledgeBase>()
const publishedIds = new Map<number, { id: number | null; until: number }>()
const learned = new Map<string, { counts: LearnedCount[]; until: number }>()
const TTL_MS = 5_000

/** Forgets cached published-version ids and learned counts of an organisation. */
export function invalidateDiagnosisCache(organisationId: number) {
  publishedIds.delete(organisationId)
  for (const key of learned.keys()) if (key.startsWith(`${organisationId}|`)) learned.delete(key)
}

/** The organisation's published knowledge base, validated; 503 when none is published. */
export async function publishedKnowledgeBase(organisationId: number): Promise<KnowledgeBase> {
  const now = Date.now()
  let entry = publishedIds.get(organisationId)
  if (!entry || entry.until < now) {
    const version = await findPublishedVersion(organisationId)
    entry = { id: version?.id ?? null, until: now + TTL_MS }
    publishedIds.set(organisationId, entry)
    if (version && !versions.has(version.id)) {
      const content = await loadVersionContent(version)
      const checked = knowledgeBaseSourceSchema.parse({ causes: content.causes, tests: content.tests, rules: content.rules })
      versions.set(version.id, { ...checked, version: content.version })
    }
  }
  const kb = entry.id === null ? undefined : versions.get(entry.id)
  if (!kb) throw createError({ status: 503, statusText: 'Service Unavailable', message: 'No knowledge base is published for your organisation yet' })
  return kb
}

async function learnedCounts(organisationId: number, group: { equipmentClass: string } | { kind: string }): Promise<LearnedCount[]> {
  const key = `${organisationId}|${JSON.stringify(group)}`
  const hit = learned.get(key)
  if (hit && hit.until > Date.now()) return hit.counts
  const rows = await confirmedCauseCounts(organisationId, group)
  const counts = rows.map((r) => ({ cause: r.cause as Cause, stage: (r.stage ?? undefined) as Stage | undefined, count: r.count }))
  learned.set(key, { counts, until: Date.now() + TTL_MS })
  return counts
}

/**
 * Ranks causes with the organisation's published base and the priors its closed cases taught:
 * those of the unit's equipment class when known (cases), else of the same unit kind.
 */
export async function rankForOrganisation(organisationId: number, request: RankRequest, equipmentClass?: string): Promise<RankResponse> {
  const kb = await publishedKnowledgeBase(organisationId)
  const group = equipmentClass ? { equipmentClass } : { kind: request.unit.kind }
  const counts = await learnedCounts(organisationId, group)
  try {
    return await rankDiagnosis(kb, request, { learnedCounts: counts, equipmentClass: equipmentClass ?? request.unit.kind })
  } catch (error) {
    if (error instanceof RankInputError) {
      throw createError({ status: 400, statusText: 'Bad Request', message: error.message, data: { fieldErrors: { testResults: error.issues } } })
    }
    throw error
  }
}
