import { z } from 'zod'
import { ROLES } from '#shared/utils/permissions'

/** Sign-in form and `POST /api/auth/login` body. */
export const LoginSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  password: z.string().min(1, 'Enter your password').max(200),
})
export type LoginInput = z.infer<typeof LoginSchema>

/** Admin form: a new user. */
export const NewUserSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  name: z.string().trim().min(2, 'Enter the full name').max(120),
  role: z.enum(ROLES, { error: `Role must be one of: ${ROLES.join(', ')}` }),
  password: z.string().min(10, 'Use at least 10 characters').max(200),
})
export type NewUserInput = z.infer<typeof NewUserSchema>

/** Admin form: change a user's role, name or active flag. */
export const UserChangeSchema = z
  .object({
    name: z.string().trim().min(2).max(120).optional(),
    role: z.enum(ROLES, { error: `Role must be one of: ${ROLES.join(', ')}` }).optional(),
    active: z.boolean().optional(),
    password: z.string().min(10, 'Use at least 10 characters').max(200).optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' })
export type UserChangeInput = z.infer<typeof UserChangeSchema>

/** `POST /api/auth/password`: the signed-in person changes their own password. */
export const PasswordChangeSchema = z
  .object({
    currentPassword: z.string().min(1, 'Enter your current password').max(200),
    newPassword: z.string().min(10, 'Use at least 10 characters').max(200),
  })
  .strict()
export type PasswordChangeInput = z.infer<typeof PasswordChangeSchema>
