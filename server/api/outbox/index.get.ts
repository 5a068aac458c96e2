export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'outbox:read')
  return listOutbox(user)
})
