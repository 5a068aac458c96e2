import { can, type Permission } from '#shared/utils/permissions'

/** Whether the signed-in user's role holds `permission`; only hides controls, the server decides. */
export function useCan(permission: Permission) {
  const { user } = useUserSession()
  return computed(() => can(user.value?.role, permission))
}
