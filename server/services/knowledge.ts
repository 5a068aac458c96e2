// Knowledge-base authoring: the organisation's versions, bundles out and in, and the impact of a
// version on past cases (a background job). Every change is written to the knowledge-base audit
// log in the transaction that makes it.
import { findUnits } from '#server/db/repositories/equipment'
import {
  closedCasesWithConfirmedCauses, countClosedCasesWithConfirmedCauses, findVersion, latestAccuracyJob, insertAudit, insertKnowledgeBaseVersion, listVersions, loadVersionContent, loadVersionExamples,
  type KbVersionListRow,
} from '#server/db/repositories/knowledge'
import { toBundle, type KnowledgeBaseBundle } from '#server/domain/knowledge/bundle'
import { impactOf, type ReplayedCase } from '#server/domain/knowledge/impact'
import { orderStoredCaseCauses } from '#server/domain/knowledge/replay'
import { NotFoundError } from '#server/domain/errors'
import type { KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import type { OrderedCause } from '#server/domain/diagnosis/rank'
import type { ImpactJobDto, ImpactResult, ImportedBundleDto, KbVersionDto, PublishedAccuracyDto } from '#shared/types/knowledge'
import type { KbAccuracyDto } from '#shared/types/training'
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

const top = (causes: OrderedCause[]) => causes.slice(0, 3).map((c) => (c.stage ? { cause: c.cause, stage: c.stage } : { cause: c.cause }))

/** Cases read from the database at a time; the next batch is read while this one is ranked. */
export const IMPACT_BATCH = 1000

const PROGRESS_EVERY = 250
const YIELD_EVERY = 25
const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve))

/**
 * Ranks every closed case of the organisation with confirmed causes with the candidate and the
 * published version and compares them. Both rank with the knowledge base's default starting odds for
 * each unit's equipment class: the organisation's learned odds are left out, so that the two
 * versions start alike. Cases are read in batches (the next one while this one is ranked), each
 * version's rule set is prepared once, and the figures count only the first three causes of each
 * side. `progress` is told how far it got.
 */
export async function computeImpact(organisationId: number, versionId: number, progress: (fraction: number) => Promise<void> = async () => {}): Promise<ImpactResult> {
  const publishedId = await publishedVersionId(organisationId)
  const candidate = await knowledgeBaseVersion(organisationId, versionId)
  const published = publishedId === null ? null : await knowledgeBaseVersion(organisationId, publishedId)
  const [total, units] = await Promise.all([countClosedCasesWithConfirmedCauses(organisationId), findUnits(organisationId)])
  const unitById = new Map(units.map((u) => [u.id, u]))
  const kbs: KnowledgeBase[] = published && published !== candidate ? [candidate, published] : [candidate]
  const replayed: ReplayedCase[] = []
  const read = (afterId: number) => closedCasesWithConfirmedCauses(organisationId, { afterId, limit: IMPACT_BATCH })
  let batch = await read(0)
  while (batch.length) {
    const following = batch.length === IMPACT_BATCH ? read(batch[batch.length - 1]!.id) : Promise.resolve([])
    for (const c of batch) {
      const unit = unitById.get(c.unitId)
      let orders: OrderedCause[][] = []
      // A case that no longer ranks (its unit gone, a test result the version cannot read) counts as a miss on both sides.
      if (unit) orders = await orderStoredCaseCauses(kbs, unit, c).catch(() => [])
      const cand = top(orders[0] ?? [])
      const pub = published ? (kbs.length === 2 ? top(orders[1] ?? []) : cand) : []
      replayed.push({ caseId: c.id, confirmed: c.confirmedCauses, candidate: cand, published: pub })
      // Now and then the server answers its other requests, and the page hears how far it got.
      if (replayed.length % YIELD_EVERY === 0) await nextTurn()
      if (replayed.length % PROGRESS_EVERY === 0) await progress(total ? Math.min(1, replayed.length / total) : 1)
    }
    batch = await following
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

/**
 * `GET /api/knowledge-base/accuracy`: the published version's top-1 and top-3 as last measured (an
 * impact replay that ranked with it, or the accuracy report made with it); null when it has not been
 * measured since it was published.
 */
export async function publishedAccuracy(actor: Actor): Promise<PublishedAccuracyDto | null> {
  const versionId = await publishedVersionId(actor.organisationId)
  if (versionId === null) return null
  const job = await latestAccuracyJob(actor.organisationId, versionId)
  if (!job) return null
  const measuredAt = job.finishedAt.toISOString()
  if (job.kind === 'kb-accuracy') {
    // The report counts cases; the home shows shares.
    const { cases, top1, top3 } = (job.result as KbAccuracyDto).overall
    return { versionId, source: 'accuracy', cases, top1: cases ? top1 / cases : 0, top3: cases ? top3 / cases : 0, measuredAt }
  }
  const impact = job.result as ImpactResult
  const side = impact.publishedVersionId === versionId ? impact.published : impact.candidate
  return { versionId, source: 'impact', cases: impact.cases, top1: side.top1, top3: side.top3, measuredAt }
}
