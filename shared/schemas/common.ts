import { z } from 'zod'

/** The largest id an integer column holds: a larger one names no record. */
export const MAX_ROW_ID = 2_147_483_647

/** A record's id in a body: a positive integer within the column's range. */
export const rowId = (error = 'Give the record by its number') =>
  z.number({ error }).int(error).positive(error).max(MAX_ROW_ID, 'No record has that number')

/** A positive integer id in a route. */
export const IdParamsSchema = z.object({ id: z.coerce.number({ error: 'Id must be a positive integer' }).int('Id must be a positive integer').positive('Id must be a positive integer') })
