// Roles and what each may do. The server's authorization helpers (server/utils/auth.ts) and the
// app's navigation both read this table, so a permission is decided in exactly one place. What a
// role is called on screen is in the vocabulary (shared/utils/vocabulary/roles.ts).

export const ROLES = ['technician', 'engineer', 'trainer', 'admin'] as const
export type Role = (typeof ROLES)[number]

export const PERMISSIONS = {
  'cases:work': ['technician', 'engineer', 'admin'],
  'cases:read': ['technician', 'engineer', 'trainer', 'admin'],
  'equipment:read': ['technician', 'engineer', 'trainer', 'admin'],
  'equipment:edit': ['technician', 'engineer', 'admin'],
  'calculator:use': ['technician', 'engineer', 'trainer', 'admin'],
  'knowledge:read': ['technician', 'engineer', 'trainer', 'admin'],
  'knowledge:author': ['engineer', 'admin'],
  'training:run': ['trainer', 'engineer', 'admin'],
  'users:manage': ['admin'],
  'outbox:read': ['admin'],
  'compliance:configure': ['admin'],
  // Sending a service report to an address that is neither a contact of the site nor a person of the organisation.
  'reports:any-recipient': ['engineer', 'admin'],
} as const satisfies Record<string, readonly Role[]>

export type Permission = keyof typeof PERMISSIONS

/** True when `role` holds `permission`. */
export function can(role: Role | undefined | null, permission: Permission): boolean {
  return !!role && (PERMISSIONS[permission] as readonly Role[]).includes(role)
}
