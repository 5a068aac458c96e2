/**
 * Background jobs on pg-boss (10.x), in the app's own PostgreSQL, so every app process on every
 * machine takes work from one queue and a job survives a restart. The API for later work:
 *
 *   export const impactJob = defineJob('kb-impact', { retryLimit: 0, run: async (data, job) => {
 *     for (...) await job.progress(done / total)            // 0..1, shown by GET /api/jobs/{id}
 *     return { cases, candidate, published }                // stored as the job's result
 *   } })
 *   // list it in server/jobs/index.ts, then from a service:
 *   const jobId = await enqueueJob(impactJob, { versionId }, { organisationId, createdBy }, { transaction })
 *
 * Pages follow a job with the useJob composable and show it with <JobProgress>.
 */
import { randomUUID } from 'node:crypto'
import PgBoss from 'pg-boss'
import type { Transaction } from 'sequelize'
import { findJob, insertJob, markJobCancelled, markJobDone, markJobFailed, markJobRunning, setJobProgress } from '#server/db/repositories/jobs'
import { NotFoundError } from '#server/domain/errors'
import { isProgressWorthSaving, isUuid } from '#server/domain/jobs/job-progress'
import type { JobDto } from '#shared/types/jobs'
import type { Actor } from './types'

/** What a job's code gets besides its data. */
export interface JobContext {
  jobId: string
  organisationId: number
  createdBy: number | null
  /** 1 on the first try. */
  attempt: number
  /** True when a failure now is final (no retries left). */
  finalAttempt: boolean
  /** Reports how far the job has got, from 0 to 1; cheap to call often. */
  progress(fraction: number): Promise<void>
}

/** A kind of background work: its name, retry policy and the code that does it. */
export interface JobDefinition<Data extends object = object, Result = unknown> {
  kind: string
  /** Retries after the first try. */
  retryLimit: number
  retryDelaySeconds: number
  /** Doubles the delay on every retry (with jitter). */
  retryBackoff: boolean
  /** A try still running after this long is taken as dead and tried again. */
  expireInSeconds: number
  run(data: Data, job: JobContext): Promise<Result>
}

/** Declares a kind of background work; list it in server/jobs/index.ts so that workers take it. */
export function defineJob<Data extends object, Result>(
  kind: string,
  options: Partial<Omit<JobDefinition<Data, Result>, 'kind' | 'run'>> & Pick<JobDefinition<Data, Result>, 'run'>,
): JobDefinition<Data, Result> {
  return { kind, retryLimit: 2, retryDelaySeconds: 30, retryBackoff: true, expireInSeconds: 15 * 60, ...options }
}

/** pg-boss's statements run through the caller's transaction, so its job rows commit or roll back with the caller's own. */
function sqlIn(transaction: Transaction): PgBoss.Db {
  // pg-boss leaves options it was not given undefined; as bind values they must be SQL NULLs.
  return { executeSql: async (text, values) => ({ rows: (await useDb().query(text, { bind: values.map((v) => v ?? null), transaction }))[0] as unknown[] }) }
}

let boss: Promise<PgBoss> | undefined
const queuesMade = new Map<string, Promise<void>>()
const localWorkers = new Map<string, string>()

/** The process's pg-boss, started on first use (its tables are made by a migration). */
function jobQueue(): Promise<PgBoss> {
  boss ??= (async () => {
    const instance = new PgBoss({ connectionString: databaseUrl(), max: 3, application_name: 'rimecase-jobs', migrate: false, schedule: false })
    instance.on('error', (error) => console.error('[jobs]', error.message))
    return instance.start()
  })().catch((error) => {
    boss = undefined
    throw error
  })
  return boss
}

async function queueFor(definition: JobDefinition): Promise<PgBoss> {
  const instance = await jobQueue()
  let made = queuesMade.get(definition.kind)
  if (!made) {
    made = instance.createQueue(definition.kind, {
      name: definition.kind, retryLimit: definition.retryLimit, retryDelay: definition.retryDelaySeconds,
      retryBackoff: definition.retryBackoff, expireInSeconds: definition.expireInSeconds,
    })
    queuesMade.set(definition.kind, made)
    made.catch(() => queuesMade.delete(definition.kind))
  }
  await made
  return instance
}

/**
 * Queues a job for an organisation and returns its id (for GET /api/jobs/{id}). Inside
 * `transaction`, the job and its record exist only if that transaction commits.
 */
export async function enqueueJob<Data extends object>(
  definition: JobDefinition<Data>,
  data: Data,
  owner: { organisationId: number; createdBy: number | null },
  options: { transaction?: Transaction } = {},
): Promise<string> {
  const instance = await queueFor(definition as JobDefinition)
  const id = randomUUID()
  const { transaction } = options
  await insertJob({ id, organisationId: owner.organisationId, kind: definition.kind, createdBy: owner.createdBy }, transaction)
  await instance.send(definition.kind, data, { id, ...(transaction ? { db: sqlIn(transaction) } : {}) })
  // Wake this process's worker at once instead of at its next poll.
  const wake = () => {
    const worker = localWorkers.get(definition.kind)
    if (worker) instance.notifyWorker(worker)
  }
  if (transaction) transaction.afterCommit(wake)
  else wake()
  return id
}

/** Withdraws a job that has not started (a queued try or a waiting retry); a running job finishes its try. */
export async function cancelJob(definition: JobDefinition<object>, jobId: string, reason: string, options: { transaction?: Transaction } = {}): Promise<void> {
  const instance = await queueFor(definition as JobDefinition)
  await instance.cancel(definition.kind, jobId, options.transaction ? { db: sqlIn(options.transaction) } : undefined)
  await markJobCancelled(jobId, reason, new Date(), options.transaction)
}

/** A job of the actor's organisation with its state, progress and result, or 404. */
export async function getJob(actor: Actor, input: { jobId: string }): Promise<JobDto> {
  const job = isUuid(input.jobId) ? await findJob(actor.organisationId, input.jobId) : null
  if (!job) throw new NotFoundError('Job not found')
  return job
}

function contextFor(record: { id: string; organisationId: number; createdBy: number | null; attempts: number }, finalAttempt: boolean): JobContext {
  let saved = 0
  let savedAt = 0
  return {
    jobId: record.id, organisationId: record.organisationId, createdBy: record.createdBy, attempt: record.attempts, finalAttempt,
    async progress(fraction) {
      const now = Date.now()
      if (!isProgressWorthSaving(saved, fraction, now - savedAt)) return
      saved = fraction
      savedAt = now
      await setJobProgress(record.id, Math.min(Math.max(fraction, 0), 1), new Date(now))
    },
  }
}

async function work(definition: JobDefinition, job: PgBoss.JobWithMetadata<object>) {
  const record = await markJobRunning(job.id, new Date())
  // A job without a record was queued by hand or its organisation is gone: nothing to report to.
  if (!record) return null
  const finalAttempt = job.retryCount >= job.retryLimit
  try {
    const result = await definition.run(job.data, contextFor(record, finalAttempt))
    await markJobDone(job.id, result, new Date())
    return result
  } catch (error) {
    await markJobFailed(job.id, error instanceof Error ? error.message : String(error), finalAttempt, new Date())
    throw error
  }
}

/** Starts pg-boss and one worker per definition in this process; returns a function that stops them. */
export async function startJobWorkers(definitions: readonly JobDefinition[]): Promise<() => Promise<void>> {
  const instance = await jobQueue()
  for (const definition of definitions) {
    await queueFor(definition)
    const workerId = await instance.work<object>(
      definition.kind,
      { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 1 },
      async ([job]) => (job ? work(definition, job) : null),
    )
    localWorkers.set(definition.kind, workerId)
  }
  return async () => {
    localWorkers.clear()
    await instance.stop({ graceful: true, timeout: 5_000 })
    boss = undefined
    queuesMade.clear()
  }
}
