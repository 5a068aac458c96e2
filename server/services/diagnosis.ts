// Diagnosis for an organisation: its published knowledge base, the priors its closed cases taught,
// and the ranking itself. Several app processes share the database, so every cache here is keyed
// by the organisation's cache stamps (published version, learned generation, equipment generation):
// a version published, a case closed or a unit edited through any process changes the keys at once.
import { readCacheStamps, type CacheStamps } from '#server/db/repositories/cache-stamps'
import { closedCaseRankings, confirmedCauseCounts } from '#server/db/repositories/case-statistics'
import { findVersion, loadVersionContent } from '#server/db/repositories/knowledge'
import { rankingAgreement } from '#server/domain/diagnosis/agreement'
import { FACT_SPECS } from '#server/domain/diagnosis/fact-vocabulary'
import { knowledgeBaseSourceSchema, type KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import { rankDiagnosis, type LearnedCount } from '#server/domain/diagnosis/rank'
import { UnavailableError } from '#server/domain/errors'
import {
  CAUSES, DIMENSION_UNITS, QUANTITY_DIMENSION, STAGES, STAGE_QUANTITIES, SYMPTOMS, TESTS, UNIT_KINDS, UNIT_WIDE_QUANTITIES,
  type Cause, type RankRequest, type RankResponse, type RankingAgreement, type Stage, type UnitKind,
} from '#shared/types/diagnosis'
import type { DiagnosisVocabularyDto, DiagnosticTestDto } from '#shared/types/diagnosis-catalogue'
import type { EquipmentClass } from '#shared/types/equipment'
import { causeLabel, equipmentClassLabel, inPlainWords, unitKindLabel, type KnowledgeBaseTitles } from '#shared/utils/vocabulary'
import type { Actor } from './types'

/** Which closed cases teach the priors: those of units of one equipment class, or else of one kind. */
export type PriorGroup = { equipmentClass: string } | { kind: string }

const knowledgeBases = createCache<KnowledgeBase>('published knowledge bases', { max: 50 })
const learnedPriors = createCache<{ counts: LearnedCount[] }>('learned priors', { max: 1000 })
const rankings = createCache<RankResponse>('rankings', { max: 500 })
const titleBooks = createCache<KnowledgeBaseTitles>('knowledge-base titles', { max: 50 })

/** Everything ranking needs for one organisation and group, read at one moment. */
export interface RankingContext {
  kb: KnowledgeBase
  counts: LearnedCount[]
  /** The group in words, for the note on where the starting odds come from. */
  group: string
  /** Identifies kb, counts and group together; equal keys rank equal requests equally. */
  key: string
}

/** The actor's organisation's cache stamps as of this request. */
export function stampsFor(actor: Actor): Promise<CacheStamps> | CacheStamps {
  return actor.cacheStamps ?? readCacheStamps(actor.organisationId)
}

// A version's content never changes once stored (publishing makes a new version), so it is
// cached by its id for as long as it is used.
async function loadKnowledgeBase(organisationId: number, versionId: number): Promise<KnowledgeBase> {
  return knowledgeBases.load(String(versionId), async () => {
    const version = await findVersion(organisationId, versionId)
    if (!version) throw new UnavailableError('The published knowledge base could not be read; try again in a moment')
    const content = await loadVersionContent(version)
    const checked = knowledgeBaseSourceSchema.parse({ causes: content.causes, tests: content.tests, rules: content.rules })
    return { ...checked, version: content.version }
  })
}

/** The organisation's published knowledge base, validated; 503 when none is published. */
export async function publishedKnowledgeBase(organisationId: number, stamps?: CacheStamps): Promise<KnowledgeBase> {
  const current = stamps ?? (await readCacheStamps(organisationId))
  if (current.knowledgeBaseVersionId === null) throw new UnavailableError('No knowledge base is published for your organisation yet')
  return loadKnowledgeBase(organisationId, current.knowledgeBaseVersionId)
}

const groupLabel = (group: PriorGroup) =>
  ('equipmentClass' in group ? equipmentClassLabel(group.equipmentClass as EquipmentClass) : unitKindLabel(group.kind as UnitKind)).toLowerCase()

async function learnedCounts(stamps: CacheStamps, group: PriorGroup): Promise<LearnedCount[]> {
  const key = `${stamps.organisationId}|${stamps.learnedGeneration}|${stamps.equipmentGeneration}|${JSON.stringify(group)}`
  const { counts } = await learnedPriors.load(key, async () => {
    const rows = await confirmedCauseCounts(stamps.organisationId, group)
    // Closing records how each cause was settled (a test, the repair, or judgement); only judgement is
    // not definitive. Older confirmations, closed with the work done, count as settled by the repair.
    return { counts: rows.map((r) => ({ cause: r.cause as Cause, stage: (r.stage ?? undefined) as Stage | undefined, count: r.count, definitive: r.definitive })) }
  })
  return counts
}

/**
 * Loads what ranking needs (published base, learned priors of the group) as of `stamps`, so that a
 * caller holding a row lock can rank without asking the pool for another connection.
 */
export async function rankingContext(stamps: CacheStamps, group: PriorGroup): Promise<RankingContext> {
  const [kb, counts] = await Promise.all([publishedKnowledgeBase(stamps.organisationId, stamps), learnedCounts(stamps, group)])
  return { kb, counts, group: groupLabel(group), key: `${kb.version.id}|${stamps.learnedGeneration}|${stamps.equipmentGeneration}|${JSON.stringify(group)}` }
}

/**
 * Ranks a request in a context. Identical requests (a logger re-posting the same readings, a screen
 * refreshing) are answered from memory; any other reading, version or prior is a new key.
 * Warnings are put in people's words here, whatever words the diagnosis wrote them in.
 */
export async function rankInContext(context: RankingContext, request: RankRequest): Promise<RankResponse> {
  return rankings.load(`${context.key}|${JSON.stringify(request)}`, async () => {
    const ranked = await rankDiagnosis(context.kb, request, { learnedCounts: context.counts, equipmentClass: context.group })
    return { ...ranked, warnings: ranked.warnings.map(inPlainWords), priorNote: inPlainWords(ranked.priorNote) }
  })
}

/** `POST /api/diagnosis/rank`: ranks causes for a described unit with the organisation's base and priors; saves nothing. */
export async function rankForActor(actor: Actor, request: RankRequest): Promise<RankResponse> {
  const stamps = await stampsFor(actor)
  return rankInContext(await rankingContext(stamps, { kind: request.unit.kind }), request)
}

/** The published tests with procedures, cautions and outcome words. */
export async function diagnosticTests(actor: Actor): Promise<DiagnosticTestDto[]> {
  const kb = await publishedKnowledgeBase(actor.organisationId, await stampsFor(actor))
  return kb.tests.map((t) => ({
    test: t.slug, title: t.title, minutes: t.minutes, opensSystem: t.opensSystem, hotWork: t.hotWork, stages: t.stages,
    safetyNotes: t.safetyNotes, procedure: t.procedure, outcomes: t.outcomes.map((o) => ({ outcome: o.slug, label: o.label })),
  }))
}

/** The titles the published base stores for causes, tests and outcomes, for labels of words without a vocabulary entry. */
export async function knowledgeBaseTitles(organisationId: number, known?: CacheStamps): Promise<KnowledgeBaseTitles> {
  const stamps = known ?? (await readCacheStamps(organisationId))
  if (stamps.knowledgeBaseVersionId === null) return { causes: {}, tests: {}, outcomes: {} }
  return titleBooks.load(String(stamps.knowledgeBaseVersionId), async () => {
    const kb = await publishedKnowledgeBase(organisationId, stamps)
    return {
      causes: Object.fromEntries(kb.causes.map((c) => [c.slug, c.title])),
      tests: Object.fromEntries(kb.tests.map((t) => [t.slug, t.title])),
      outcomes: Object.fromEntries(kb.tests.map((t) => [t.slug, Object.fromEntries(t.outcomes.map((o) => [o.slug, o.label]))])),
    }
  })
}

/** The words the rank request and the rules use, with the measurement units each quantity accepts. */
export async function diagnosisVocabulary(actor: Actor): Promise<DiagnosisVocabularyDto> {
  const titles = await knowledgeBaseTitles(actor.organisationId, await stampsFor(actor))
  const quantity = (q: (typeof STAGE_QUANTITIES)[number] | (typeof UNIT_WIDE_QUANTITIES)[number], perStage: boolean) => ({
    quantity: q, perStage, dimension: QUANTITY_DIMENSION[q], units: DIMENSION_UNITS[QUANTITY_DIMENSION[q]],
  })
  return {
    unitKinds: UNIT_KINDS,
    stages: STAGES,
    quantities: [...STAGE_QUANTITIES.map((q) => quantity(q, true)), ...UNIT_WIDE_QUANTITIES.map((q) => quantity(q, false))],
    symptoms: SYMPTOMS,
    causes: CAUSES.map((c) => ({ cause: c, title: titles.causes[c] ?? causeLabel(c) })),
    tests: TESTS,
    units: { pressure: DIMENSION_UNITS.pressure, temperature: DIMENSION_UNITS.temperature, current: DIMENSION_UNITS.current, time: DIMENSION_UNITS.time, bool: DIMENSION_UNITS.bool },
    facts: [...FACT_SPECS.values()].map((f) => ({ name: f.name, type: f.type, unit: f.unit, meaning: f.meaning })),
  }
}

/** The knowledge base's track record on the organisation's closed cases. */
export async function rankingTrackRecord(actor: Actor): Promise<RankingAgreement> {
  return rankingAgreement(await closedCaseRankings(actor.organisationId))
}
