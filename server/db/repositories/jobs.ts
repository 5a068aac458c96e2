// Rimecase's records of background jobs (table background_jobs); pg-boss holds the queue itself.
import { QueryTypes, type Transaction } from 'sequelize'
import type { JobDto, JobState } from '#shared/types/jobs'
import { BackgroundJob } from '../models'

/** A job record as the worker needs it. */
export interface JobRecord {
  id: string
  organisationId: number
  kind: string
  state: JobState
  attempts: number
  createdBy: number | null
}

const dto = (j: BackgroundJob): JobDto => ({
  id: j.id, kind: j.kind, state: j.state, progress: j.progress, result: j.result ?? null, error: j.error,
  createdAt: j.createdAt.toISOString(), updatedAt: j.updatedAt.toISOString(),
})

/** Records a new job, queued, in the caller's transaction. */
export async function insertJob(input: { id: string; organisationId: number; kind: string; createdBy: number | null }, transaction?: Transaction) {
  await BackgroundJob.create({ ...input, result: null, error: null, startedAt: null, finishedAt: null }, { transaction })
}

/** A job of the organisation as the API shows it, or null (another organisation's job is simply absent). */
export async function findJob(organisationId: number, id: string): Promise<JobDto | null> {
  const job = await BackgroundJob.findOne({ where: { id, organisationId } })
  return job ? dto(job) : null
}

/** Marks a job as being worked (one more attempt) and returns it; null when no record exists. */
export async function markJobRunning(id: string, at: Date): Promise<JobRecord | null> {
  const [row] = await BackgroundJob.sequelize!.query<JobRecord & { organisation_id: number; created_by: number | null }>(
    `UPDATE background_jobs SET state = 'running', attempts = attempts + 1, started_at = coalesce(started_at, $2), updated_at = $2
      WHERE id = $1 RETURNING id, organisation_id, kind, state, attempts, created_by`,
    { bind: [id, at], type: QueryTypes.SELECT },
  )
  return row ? { id: row.id, organisationId: row.organisation_id, kind: row.kind, state: row.state, attempts: row.attempts, createdBy: row.created_by } : null
}

/** Stores how far a running job has got, from 0 to 1. */
export async function setJobProgress(id: string, progress: number, at: Date) {
  await BackgroundJob.update({ progress, updatedAt: at }, { where: { id, state: 'running' }, silent: true })
}

/** Marks a job done with its result. */
export async function markJobDone(id: string, result: unknown, at: Date) {
  await BackgroundJob.update({ state: 'done', progress: 1, result: result ?? null, error: null, finishedAt: at, updatedAt: at }, { where: { id }, silent: true })
}

/** Records a failed attempt: queued again while retries remain, failed for good otherwise. */
export async function markJobFailed(id: string, error: string, final: boolean, at: Date) {
  await BackgroundJob.update(
    { state: final ? 'failed' : 'queued', error, updatedAt: at, ...(final ? { finishedAt: at } : {}) },
    { where: { id }, silent: true },
  )
}

/** Marks a job that will not run (withdrawn before it started) as failed, with the reason. */
export async function markJobCancelled(id: string, reason: string, at: Date, transaction?: Transaction) {
  await BackgroundJob.update({ state: 'failed', error: reason, finishedAt: at, updatedAt: at }, { where: { id, state: 'queued' }, silent: true, transaction })
}
