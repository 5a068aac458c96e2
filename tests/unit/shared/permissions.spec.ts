import { describe, expect, it } from 'vitest'
import { PERMISSIONS, ROLES, can } from '#shared/utils/permissions'

describe('permissions', () => {
  it('gives user management and the outbox to admins only', () => {
    expect(ROLES.filter((r) => can(r, 'users:manage'))).toEqual(['admin'])
    expect(ROLES.filter((r) => can(r, 'outbox:read'))).toEqual(['admin'])
  })
  it('lets engineers author the knowledge base, not technicians or trainers', () => {
    expect(can('engineer', 'knowledge:author')).toBe(true)
    expect(can('technician', 'knowledge:author')).toBe(false)
    expect(can('trainer', 'knowledge:author')).toBe(false)
  })
  it('lets engineers and admins send a report to any address, not technicians', () => {
    expect(ROLES.filter((r) => can(r, 'reports:any-recipient'))).toEqual(['engineer', 'admin'])
  })
  it('refuses everything without a role, and every permission names known roles', () => {
    expect(can(undefined, 'cases:read')).toBe(false)
    for (const roles of Object.values(PERMISSIONS)) for (const r of roles) expect(ROLES).toContain(r)
  })
})
