import { createUser, emailTaken } from '#server/db/repositories/users'
import { NewUserSchema } from '#shared/schemas/auth'
import type { AdminUserDto } from '#shared/types/api'

export default defineEventHandler(async (event) => {
  const admin = await requireUser(event, 'users:manage')
  const input = await readBodyAs(event, NewUserSchema)
  if (await emailTaken(input.email)) {
    throw createError({ status: 409, statusText: 'Conflict', message: 'An account with this e-mail already exists', data: { fieldErrors: { email: ['Already in use'] } } })
  }
  const { password, ...rest } = input
  const user = await createUser({ ...rest, organisationId: admin.organisationId, passwordHash: await hashPassword(password) })
  setResponseStatus(event, 201)
  return { id: user.id, email: user.email, name: user.name, role: user.role, active: user.active, createdAt: user.createdAt.toISOString() } satisfies AdminUserDto
})
