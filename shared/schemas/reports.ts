import { z } from 'zod'
import { rowId } from './common'

/** `POST /api/cases/{id}/report/send`: one address, or none for the site's report contacts. */
export const SendReportSchema = z
  .object({
    to: z.preprocess(
      (v) => (typeof v === 'string' && !v.trim() ? undefined : v),
      z.email({ error: 'Enter a valid e-mail address, or leave it empty for the site contacts' }).trim().max(254).optional(),
    ),
    /** The recipients picked on the preview; takes the place of `to` and of the site's report contacts. */
    recipients: z.array(z.email({ error: 'Enter a valid e-mail address' }).trim().max(254)).max(20, 'Send to at most 20 addresses at once').optional(),
  })
  .strict()

/** `PUT /api/cases/{id}/report/photos`: the uploads of the case to show in the report and its PDF, in order. */
export const ReportPhotosSchema = z.object({ uploadIds: z.array(rowId('Pick photos by their number')).max(12, 'Pick at most 12 photos for the report') }).strict()
