import { updateUser } from '#server/services/users'
import { UserChangeSchema } from '#shared/schemas/auth'
import { IdParamsSchema } from '#shared/schemas/common'
import type { AdminUserDto } from '#shared/types/api'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'users:manage')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const changes = await readBodyAs(event, UserChangeSchema)
  return (await updateUser(actor, { userId: id, changes })) satisfies AdminUserDto
})
