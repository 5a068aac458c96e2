import type { UserDto } from '#shared/types/api'

export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  return { id: user.id, email: user.email, name: user.name, role: user.role, organisationId: user.organisationId } satisfies UserDto & { organisationId: number }
})
