import { z } from 'zod'
import { passwordWeakness } from '#shared/utils/password-strength'
import { safeText } from './safe-text'

/** A set-up link's token: 43 URL-safe characters (32 random bytes). */
export const SetupTokenSchema = z.string().trim().regex(/^[A-Za-z0-9_-]{43}$/, 'This set-up link is not complete; copy the whole link')

/** `GET /api/setup?token=`: is this set-up link still usable? */
export const SetupLinkQuerySchema = z.object({ token: SetupTokenSchema })

/** `POST /api/setup`: the first administrator and their organisation, through a one-time link. */
export const FirstAdminSchema = z
  .object({
    token: SetupTokenSchema,
    organisation: safeText(120).pipe(z.string().min(2, 'Enter the organisation name')),
    name: safeText(120).pipe(z.string().min(2, 'Enter the full name')),
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
    password: z.string().max(200),
  })
  .strict()
  .superRefine((v, ctx) => {
    const weakness = passwordWeakness(v.password, { email: v.email, name: v.name })
    if (weakness) ctx.addIssue({ code: 'custom', message: weakness, path: ['password'] })
  })
export type FirstAdminInput = z.infer<typeof FirstAdminSchema>
