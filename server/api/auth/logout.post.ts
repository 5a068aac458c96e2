export default defineApiHandler(async (event) => {
  await clearUserSession(event)
  setResponseStatus(event, 204)
  return null
})
