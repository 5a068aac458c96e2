import { signOut } from '#server/services/users'

// Ends the server-side session (every copy of the cookie stops working) and clears the cookie.
export default defineApiHandler(async (event) => {
  await signOut((await getUserSession(event)).sid, new Date())
  await clearUserSession(event)
  setResponseStatus(event, 204)
  return null
})
