import { can, type Permission } from '#shared/utils/permissions'

export interface NavItem {
  to: string
  label: string
  permission?: Permission
}

// Only pages that exist are listed; each is shown to the roles that may use it.
const NAV_ITEMS: NavItem[] = [
  { to: '/', label: 'Home' },
  { to: '/cases', label: 'Cases', permission: 'cases:read' },
  { to: '/units', label: 'Units', permission: 'equipment:read' },
  { to: '/customers', label: 'Customers', permission: 'equipment:read' },
  { to: '/compliance', label: 'Compliance', permission: 'equipment:read' },
  { to: '/cylinders', label: 'Cylinders', permission: 'equipment:read' },
  { to: '/calculator', label: 'Calculator', permission: 'calculator:use' },
  { to: '/knowledge', label: 'Knowledge base', permission: 'knowledge:author' },
  { to: '/training', label: 'Training', permission: 'cases:read' },
  { to: '/admin/users', label: 'Users', permission: 'users:manage' },
  { to: '/admin/outbox', label: 'Outbox', permission: 'outbox:read' },
]

/** Navigation entries the signed-in user's role may use. */
export function useNavigation() {
  const { user } = useUserSession()
  return computed(() => NAV_ITEMS.filter((item) => !item.permission || can(user.value?.role, item.permission)))
}
