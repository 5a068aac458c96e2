// Background work as `GET /api/jobs/{id}` reports it.

/** Where a job is: waiting for a worker, being worked, finished, or stopped for good with an error. */
export const JOB_STATES = ['queued', 'running', 'done', 'failed'] as const
export type JobState = (typeof JOB_STATES)[number]

/** A job of the caller's organisation. `progress` runs from 0 to 1; `result` is set once `done`. */
export interface JobDto<Result = unknown> {
  id: string
  kind: string
  state: JobState
  progress: number
  result: Result | null
  error: string | null
  createdAt: string
  updatedAt: string
}
