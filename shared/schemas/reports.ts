import { z } from 'zod'

/** `POST /api/cases/{id}/report/send`: one address, or none for the site's report contacts. */
export const SendReportSchema = z
  .object({
    to: z.preprocess(
      (v) => (typeof v === 'string' && !v.trim() ? undefined : v),
      z.email({ error: 'Enter a valid e-mail address, or leave it empty for the site contacts' }).trim().max(254).optional(),
    ),
  })
  .strict()
