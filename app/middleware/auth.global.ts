import { can, type Permission } from '#shared/utils/permissions'

// Convenience only: sends signed-out visitors to the sign-in page, and a page whose meta names a
// permission the role lacks back home (the same table the server checks; the server decides).
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  // The first administrator's set-up page is open to the holder of its one-time link.
  if (to.path === '/setup') return
  if (to.path === '/login') {
    if (loggedIn.value) return navigateTo('/')
    return
  }
  if (!loggedIn.value) return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  const permission = to.meta.permission as Permission | undefined
  if (permission && !can(user.value?.role, permission)) return navigateTo('/')
})
