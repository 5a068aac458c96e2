// The published knowledge base's accuracy over the organisation's confirmed cases. Every case is
// ranked again, which takes a moment per hundred cases, so the work runs as a background job and
// the page follows its progress.
import { readCacheStamps } from '#server/db/repositories/cache-stamps'
import { findUnits } from '#server/db/repositories/equipment'
import { confirmedCases } from '#server/db/repositories/training'
import { accuracyOf, type RankedCase } from '#server/domain/training/accuracy'
import type { CaseReading, CaseTestResult } from '#shared/types/cases'
import type { Cause, Stage, Symptom } from '#shared/types/diagnosis'
import type { KbAccuracyDto } from '#shared/types/training'
import { publishedKnowledgeBase } from './diagnosis'
import { defineJob, enqueueJob } from './jobs'
import { rankKnownFacts } from './training'
import type { Actor } from './types'

/** The most recent confirmed cases measured; older ones say little about today's base. */
export const ACCURACY_CASE_LIMIT = 2_000

/** Ranks every confirmed case's diagnosis facts with the published base and counts how often the confirmed cause came first or in the first three. */
export async function measureAccuracy(organisationId: number, progress: (fraction: number) => Promise<void> = async () => {}): Promise<KbAccuracyDto> {
  const stamps = await readCacheStamps(organisationId)
  const [kb, units, rows] = await Promise.all([publishedKnowledgeBase(organisationId, stamps), findUnits(organisationId), confirmedCases(organisationId, ACCURACY_CASE_LIMIT)])
  const unitById = new Map(units.map((u) => [u.id, u]))
  const ranked: RankedCase[] = []
  for (const [i, row] of rows.entries()) {
    const unit = unitById.get(row.unit_id)
    if (!unit) continue
    const known = { symptoms: row.symptoms as Symptom[], readings: row.readings as CaseReading[], testResults: row.test_results as CaseTestResult[] }
    const ranking = await rankKnownFacts(kb, unit, known)
    ranked.push({
      caseId: row.id, unitName: unit.name, equipmentClass: unit.equipmentClass, closedAt: row.closed_at.toISOString(),
      confirmed: row.confirmed_causes.map((c) => ({ cause: c.cause as Cause, ...(c.stage ? { stage: c.stage as Stage } : {}) })),
      ranked: ranking.causes.map((c) => ({ cause: c.cause, ...(c.stage ? { stage: c.stage } : {}), probability: c.probability })),
    })
    if (i % 25 === 24) await progress((i + 1) / rows.length)
  }
  return accuracyOf(ranked, kb.version)
}

export const kbAccuracyJob = defineJob<{ organisationId: number }, KbAccuracyDto>('kb-accuracy', {
  retryLimit: 1,
  run: (_data, job) => measureAccuracy(job.organisationId, (f) => job.progress(f)),
})

/** `POST /api/training/accuracy`: starts measuring; the result comes with the job (`GET /api/jobs/{id}`). */
export async function startAccuracy(actor: Actor): Promise<{ jobId: string }> {
  const jobId = await enqueueJob(kbAccuracyJob, { organisationId: actor.organisationId }, { organisationId: actor.organisationId, createdBy: actor.id })
  return { jobId }
}
