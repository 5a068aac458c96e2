import { listUsers } from '#server/db/repositories/users'
import type { AdminUserDto } from '#shared/types/api'

export default defineEventHandler(async (event) => {
  const admin = await requireUser(event, 'users:manage')
  const users = await listUsers(admin.organisationId)
  return users.map((u) => ({ ...u, createdAt: u.createdAt.toISOString() }) satisfies AdminUserDto & { organisationId: number })
})
