import { listUsers } from '#server/db/repositories/users'

// Names of the organisation's active people, for filters and pickers (no e-mail or account state).
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:read')
  const people = await listUsers(user.organisationId)
  return people.filter((p) => p.active).map((p) => ({ id: p.id, name: p.name, role: p.role }))
})
