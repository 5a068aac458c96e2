// Knowledge-base authoring: the organisation's versions, bundles out and in, and the impact of a
// version on past cases (a background job). Every change is written to the knowledge-base audit
// log in the transaction that makes it.
import { findUnits } from '#server/db/repositories/equipment'
import {
  closedCasesWithConfirmedCauses, findVersion, insertAudit, insertKnowledgeBaseVersion, listVersions, loadVersionContent, loadVersionExamples,
  type KbVersionListRow,
} from '#server/db/repositories/knowledge'
import { toBundle, type KnowledgeBaseBundle } from '#server/domain/knowledge/bundle'
import { impactOf, type ReplayedCase } from '#server/domain/knowledge/impact'
import { rankStoredCaseCauses } from '#server/domain/knowledge/replay'
import { NotFoundError } from '#server/domain/errors'
import type { KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import type { RankedCause } from '#shared/types/diagnosis'
import type { ImpactJobDto, ImpactResult, ImportedBundleDto, KbVersionDto } from '#shared/types/knowledge'
import { defineJob, enqueueJob } from './jobs'
import { knowledgeBaseVersion, publishedVersionId } from './replay'
import type { Actor } from './types'

const iso = (d: Date | null) => (d ? d.toISOString() : null)

function versionDto(v: KbVersionListRow): KbVersionDto {
  return {
    id: v.id, status: v.status, label: v.label, createdAt: v.createdAt.toISOString(), createdBy: v.createdByName, createdById: v.createdBy,
    publishedAt: iso(v.publishedAt), publishedBy: v.publishedByName, basedOnId: v.basedOnId, submittedAt: iso(v.submittedAt),
    submittedBy: v.submittedByName, reviewedAt: iso(v.reviewedAt), reviewedBy: v.reviewedByName, reviewComment: v.reviewComment, revision: v.revision,
  }
}

/** `GET /api/knowledge-base/versions`: every version of the organisation, newest first. */
export async function listKnowledgeBaseVersions(actor: Actor): Promise<KbVersionDto[]> {
  return (await listVersions(actor.organisationId)).map(versionDto)
}

/** One version of the organisation, or 404. */
export async function getKnowledgeBaseVersion(actor: Actor, input: { versionId: number }): Promise<KbVersionDto> {
  const [row] = await listVersions(actor.organisationId, input.versionId)
  if (!row) throw new NotFoundError('Knowledge-base version not found')
  return versionDto(row)
}

/** `GET /api/knowledge-base/versions/{id}/bundle`: the version with its examples as one bundle. */
export async function exportBundle(actor: Actor, input: { versionId: number }, now: Date): Promise<KnowledgeBaseBundle> {
  const version = await findVersion(actor.organisationId, input.versionId)
  if (!version) throw new NotFoundError('Knowledge-base version not found')
  const [content, examples] = await Promise.all([loadVersionContent(version), loadVersionExamples(version.id)])
  return toBundle(content, examples, { label: version.label, versionId: version.id, status: version.status, exportedAt: now })
}

/** `POST /api/knowledge-base/bundles`: stores a checked bundle as a new draft of the organisation. */
export async function importBundle(actor: Actor, bundle: KnowledgeBaseBundle, now: Date): Promise<ImportedBundleDto> {
  const id = await useDb().transaction(async (transaction) => {
    const { causes, tests, rules } = bundle
    const version = await insertKnowledgeBaseVersion(
      actor.organisationId, { causes, tests, rules },
      { label: bundle.label, status: 'draft', createdBy: actor.id, notes: 'Imported from a bundle', examples: bundle.examples ?? {} }, transaction,
    )
    await insertAudit(actor.organisationId, actor.id, now, {
      versionId: version.id, action: 'bundle-imported', details: { label: bundle.label, causes: causes.length, tests: tests.length, findings: rules.length },
    }, transaction)
    return version.id
  })
  return { id, status: 'draft' }
}

// ------------------------------------------------------------------ impact on past cases

const top = (causes: RankedCause[]) => causes.slice(0, 3).map((c) => (c.stage ? { cause: c.cause, stage: c.stage } : { cause: c.cause }))

/**
 * Ranks every closed case of the organisation with confirmed causes with the candidate and the
 * published version (each unit's equipment class sets the starting odds; learned priors are left
 * out so that both versions start alike) and compares them. `progress` is told how far it got.
 */
export async function computeImpact(organisationId: number, versionId: number, progress: (fraction: number) => Promise<void> = async () => {}): Promise<ImpactResult> {
  const publishedId = await publishedVersionId(organisationId)
  const candidate = await knowledgeBaseVersion(organisationId, versionId)
  const published = publishedId === null ? null : await knowledgeBaseVersion(organisationId, publishedId)
  const [cases, units] = await Promise.all([closedCasesWithConfirmedCauses(organisationId), findUnits(organisationId)])
  const unitById = new Map(units.map((u) => [u.id, u]))
  const kbs: KnowledgeBase[] = published && published !== candidate ? [candidate, published] : [candidate]
  const replayed: ReplayedCase[] = []
  for (let i = 0; i < cases.length; i++) {
    const c = cases[i]!
    const unit = unitById.get(c.unitId)
    let rankings: RankedCause[][] = []
    // A case that no longer ranks (its unit gone, a test result the version cannot read) counts as a miss on both sides.
    if (unit) rankings = await rankStoredCaseCauses(kbs, unit, c).catch(() => [])
    const cand = top(rankings[0] ?? [])
    const pub = published ? (kbs.length === 2 ? top(rankings[1] ?? []) : cand) : []
    replayed.push({ caseId: c.id, confirmed: c.confirmedCauses, candidate: cand, published: pub })
    if (i % 250 === 249) await progress((i + 1) / cases.length)
  }
  return { ...impactOf(replayed), candidateVersionId: versionId, publishedVersionId: publishedId }
}

/** The impact of a version on past cases, worked out in the background. */
export const impactJob = defineJob<{ versionId: number }, ImpactResult>('kb-impact', {
  retryLimit: 0,
  expireInSeconds: 15 * 60,
  run: ({ versionId }, job) => computeImpact(job.organisationId, versionId, (f) => job.progress(f)),
})

/** `POST /api/knowledge-base/versions/{id}/impact`: queues the impact job of a version of the organisation. */
export async function startImpact(actor: Actor, input: { versionId: number }): Promise<ImpactJobDto> {
  const version = await findVersion(actor.organisationId, input.versionId)
  if (!version) throw new NotFoundError('Knowledge-base version not found')
  const jobId = await enqueueJob(impactJob, { versionId: version.id }, { organisationId: actor.organisationId, createdBy: actor.id })
  return { jobId }
}
