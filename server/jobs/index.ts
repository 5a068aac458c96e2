// Every kind of background work. Each app process runs one worker per kind (server/plugins/job-workers.ts);
// a kind defined with defineJob and not listed here is queued but never worked.
import { kbAccuracyJob } from '#server/services/accuracy'
import { impactJob } from '#server/services/knowledge'
import { loggerAnalysisJob } from '#server/services/logger'
import { reportEmailJob } from '#server/services/reports'
import type { JobDefinition } from '#server/services/jobs'

/** The job kinds workers take. */
export const JOBS: readonly JobDefinition<never>[] = [reportEmailJob, impactJob, kbAccuracyJob, loggerAnalysisJob]
