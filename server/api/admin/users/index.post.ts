import { createUser } from '#server/services/users'
import { NewUserSchema } from '#shared/schemas/auth'
import type { AdminUserDto } from '#shared/types/api'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'users:manage')
  const input = await readBodyAs(event, NewUserSchema)
  const user = await createUser(actor, input)
  setResponseStatus(event, 201)
  return user satisfies AdminUserDto
})
