import { z } from 'zod'
import { UPLOAD_PURPOSES } from '#shared/utils/uploads'

/** The text fields sent beside the file in an upload form. */
export const UploadFieldsSchema = z.object({
  purpose: z.enum(UPLOAD_PURPOSES, { error: `Purpose must be one of: ${UPLOAD_PURPOSES.join(', ')}` }).optional(),
})

const flag = z
  .enum(['1', '0', 'true', 'false'], { error: 'Use 1 or 0' })
  .optional()
  .transform((v) => v === '1' || v === 'true')

/** `GET /api/uploads/{id}`: `thumb=1` for the small preview, `download=1` to save rather than show. */
export const UploadFileQuerySchema = z.object({ thumb: flag, download: flag })
