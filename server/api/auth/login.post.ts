import { findUserForLogin } from '#server/db/repositories/users'
import { LoginSchema } from '#shared/schemas/auth'
import type { UserDto } from '#shared/types/api'

const BAD_CREDENTIALS = 'E-mail or password is not right'
// Verified against when the e-mail is unknown, so both failures take about the same time.
let decoyHash: string | undefined

export default defineEventHandler(async (event) => {
  const { email, password } = await readBodyAs(event, LoginSchema)
  const user = await findUserForLogin(email)
  decoyHash ??= await hashPassword('decoy-password-for-timing')
  const ok = await verifyPassword(user?.passwordHash ?? decoyHash, password)
  if (!user || !ok || !user.active) {
    throw createError({ status: 401, statusText: 'Unauthorized', message: BAD_CREDENTIALS })
  }
  const dto = { id: user.id, email: user.email, name: user.name, role: user.role } satisfies UserDto
  await setUserSession(event, { user: { ...dto, organisationId: user.organisationId }, loggedInAt: Date.now() })
  return { user: dto }
})
