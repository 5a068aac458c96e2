// The first administrator's password check (common practice, no source: length, variety, and
// refusing the well-known and the personal).
import { describe, expect, it } from 'vitest'
import { passwordWeakness } from '#shared/utils/password-strength'
import { FirstAdminSchema } from '#shared/schemas/setup'

describe('first administrator password strength', () => {
  it('accepts long mixed passwords and long passphrases', () => {
    expect(passwordWeakness('Cascade-Stage-7 north')).toBeNull()
    expect(passwordWeakness('brine pump hums at dawn')).toBeNull()
  })

  it('refuses short, one-kind, repetitive, well-known and personal passwords, saying why', () => {
    expect(passwordWeakness('Sh0rt-pw')).toMatch(/at least 12/)
    expect(passwordWeakness('onlylowercaseletters')).toBeNull() // 20 characters: a passphrase
    expect(passwordWeakness('onlylowercase')).toMatch(/three of/)
    expect(passwordWeakness('Aa1!Aa1!Aa1!')).toMatch(/more different/)
    expect(passwordWeakness('Password123!')).toMatch(/easy to guess/)
    expect(passwordWeakness('Rimecase-Demo')).toMatch(/easy to guess/)
    expect(passwordWeakness('Chief-2026-Xy!', { email: 'chief@service.example' })).toMatch(/e-mail/)
    expect(passwordWeakness('Vinterberg-77!', { name: 'Tomas Vinterberg' })).toMatch(/name/)
  })

  it('is part of the set-up form, on the password field', () => {
    const base = { token: 'a'.repeat(43), organisation: 'Harrowgate Cold', name: 'Tomas V', email: 'first@cold.example' }
    expect(FirstAdminSchema.safeParse({ ...base, password: 'Cascade-Stage-7 north' }).success).toBe(true)
    const weak = FirstAdminSchema.safeParse({ ...base, password: 'short' })
    expect(weak.success).toBe(false)
    expect(weak.error!.issues[0]!.path).toEqual(['password'])
    expect(FirstAdminSchema.safeParse({ ...base, token: 'abc', password: 'Cascade-Stage-7 north' }).success).toBe(false)
  })
})
