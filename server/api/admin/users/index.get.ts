import { listUsers } from '#server/services/users'
import type { AdminUserDto } from '#shared/types/api'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'users:manage')
  return (await listUsers(actor)) satisfies AdminUserDto[]
})
