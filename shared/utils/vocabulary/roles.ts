import type { Role } from '#shared/utils/permissions'
import type { WordForm, WordLabel } from './words'

/** People's roles; what each may do is decided in shared/utils/permissions.ts. */
export const ROLE_WORDS: Readonly<Record<Role, WordLabel>> = {
  technician: { short: 'Technician', long: 'Technician' },
  engineer: { short: 'Engineer', long: 'Senior engineer' },
  trainer: { short: 'Trainer', long: 'Trainer' },
  admin: { short: 'Admin', long: 'Administrator' },
}

/** "Senior engineer". */
export function roleLabel(role: Role, form: WordForm = 'long'): string {
  return ROLE_WORDS[role]?.[form] ?? String(role)
}
