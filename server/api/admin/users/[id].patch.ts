import { updateUser } from '#server/db/repositories/users'
import { UserChangeSchema } from '#shared/schemas/auth'
import { IdParamsSchema } from '#shared/schemas/common'
import type { AdminUserDto } from '#shared/types/api'

export default defineEventHandler(async (event) => {
  const admin = await requireUser(event, 'users:manage')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const changes = await readBodyAs(event, UserChangeSchema)
  if (id === admin.id && (changes.active === false || (changes.role && changes.role !== 'admin'))) {
    throw createError({ status: 422, statusText: 'Unprocessable Entity', message: 'You cannot deactivate yourself or remove your own admin role' })
  }
  const user = await updateUser(admin.organisationId, id, changes)
  if (!user) throw notFound('User')
  return { id: user.id, email: user.email, name: user.name, role: user.role, active: user.active, createdAt: user.createdAt.toISOString() } satisfies AdminUserDto
})
