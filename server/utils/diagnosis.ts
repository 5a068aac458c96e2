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
const published = new Map<number, { kb: Promise<KnowledgeBase | null>; until: number }>()
const learned = new Map<string, { counts: LearnedCount[]; until: number }>()
const TTL_MS = 5_000

/** Forgets cached published-version ids and learned counts of an organisation. */
export function invalidateDiagnosisCache(organisationId: number) {
  published.delete(organisationId)
  for (const key of learned.keys()) if (key.startsWith(`${organisationId}|`)) learned.delete(key)
}

async function loadPublished(organisationId: number): Promise<KnowledgeBase | null> {
  const version = await findPublishedVersion(organisationId)
  if (!version) return null
  const known = versions.get(version.id)
  if (known) return known
  const content = await loadVersionContent(version)
  const checked = knowledgeBaseSourceSchema.parse({ causes: content.causes, tests: content.tests, rules: content.rules })
  const kb = { ...checked, version: content.version }
  versions.set(version.id, kb)
  return kb
}

/** The organisation's published knowledge base, validated; 503 when none is published. */
export async function publishedKnowledgeBase(organisationId: number): Promise<KnowledgeBase> {
  const now = Date.now()
  let entry = published.get(organisationId)
  if (!entry || entry.until < now) {
    // One lookup per organisation at a time; concurrent requests share it.
    entry = { kb: loadPublished(organisationId), until: now + TTL_MS }
    published.set(organisationId, entry)
    entry.kb.catch(() => published.delete(organisationId))
  }
  const kb = await entry.kb
  if (!kb) throw createError({ status: 503, statusText: 'Service Unavailable', message: 'No knowledge base is published for your organisation yet' })
  return kb
}

async function learnedCounts(organisationId: number, group: { equipmentClass: string } | { kind: string }): Promise<LearnedCount[]> {
  const key = `${organisationId}|${JSON.stringify(group)}`
  const hit = learned.get(key)
  if (hit && hit.until > Date.now()) return hit.counts
  const rows = await confirmedCauseCounts(organisationId, group)
  // The case record does not yet say how each cause was confirmed; closing a case requires the work
  // done, so confirmations at close are counted as confirmed by repair until that is recorded.
  const counts = rows.map((r) => ({ cause: r.cause as Cause, stage: (r.stage ?? undefined) as Stage | undefined, count: r.count, definitive: true }))
  learned.set(key, { counts, until: Date.now() + TTL_MS })
  return counts
}

// Ranking is a pure function of (published version, learned counts, request). Identical requests
// (a logger re-posting the same readings, a screen refreshing) are answered from a small LRU memo;
// a different reading, outcome, version or count is a different key and is ranked afresh.
const MEMO_SIZE = 500
const memo = new Map<string, RankResponse>()

function remember(key: string, value: RankResponse) {
  memo.set(key, value)
  if (memo.size > MEMO_SIZE) memo.delete(memo.keys().next().value!)
}

/** Ranks with a prepared base and counts; maps unknown test outcomes to a 400. */
async function rankWith(kb: KnowledgeBase, counts: LearnedCount[], request: RankRequest, equipmentClass: string): Promise<RankResponse> {
  const key = `${kb.version.id}|${equipmentClass}|${JSON.stringify(counts)}|${JSON.stringify(request)}`
  const hit = memo.get(key)
  if (hit) {
    memo.delete(key)
    memo.set(key, hit)
    return hit
  }
  try {
    const ranked = await rankDiagnosis(kb, request, { learnedCounts: counts, equipmentClass })
    remember(key, ranked)
    return ranked
  } catch (error) {
    if (error instanceof RankInputError) {
      throw createError({ status: 400, statusText: 'Bad Request', message: error.message, data: { fieldErrors: { testResults: error.issues } } })
    }
    throw error
  }
}

/**
 * Loads what ranking needs from the database (published base, learned counts of the unit's
 * equipment class or, without one, of the unit kind) and returns a ranker that needs no database:
 * code holding a row lock can rank without asking the pool for a second connection.
 */
export async function prepareRanker(organisationId: number, group: { equipmentClass: string } | { kind: string }) {
  const kb = await publishedKnowledgeBase(organisationId)
  const counts = await learnedCounts(organisationId, group)
  const label = 'equipmentClass' in group ? group.equipmentClass : group.kind
  return (request: RankRequest) => rankWith(kb, counts, request, label)
}

/** Ranks causes with the organisation's published base and the priors its closed cases taught. */
export async function rankForOrganisation(organisationId: number, request: RankRequest, equipmentClass?: string): Promise<RankResponse> {
  const rank = await prepareRanker(organisationId, equipmentClass ? { equipmentClass } : { kind: request.unit.kind })
  return rank(request)
}
