import { z } from 'zod'

/** `GET /api/jobs/{id}`: any id is looked up; one that names no job of the organisation is a 404. */
export const JobParamsSchema = z.object({ id: z.string().trim().min(1, 'Give a job id').max(100, 'That is not a job id') })
