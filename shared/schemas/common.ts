import { z } from 'zod'

/** A positive integer id in a route. */
export const IdParamsSchema = z.object({ id: z.coerce.number({ error: 'Id must be a positive integer' }).int('Id must be a positive integer').positive('Id must be a positive integer') })
