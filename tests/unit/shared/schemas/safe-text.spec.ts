import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { SafeInputSchema, UNSAFE_TEXT_MESSAGE, hasUnsafeCharacters, safeText } from '#shared/schemas/safe-text'

describe('unsafe characters', () => {
  it('are the NUL character and lone surrogates; paired surrogates and other text pass', () => {
    expect(hasUnsafeCharacters('a\u0000b')).toBe(true)
    expect(hasUnsafeCharacters('\uD800')).toBe(true)
    expect(hasUnsafeCharacters('x\uDC00')).toBe(true)
    expect(hasUnsafeCharacters('\uDC00\uD800')).toBe(true)
    expect(hasUnsafeCharacters('cold trap ❄ 🧊 −85 °C')).toBe(false)
    expect(hasUnsafeCharacters('tab\tnew line\n')).toBe(false)
  })

  it('are refused anywhere in an input, keys included, at the field path', () => {
    const result = SafeInputSchema.safeParse({ notes: ['ok', 'bad\u0000'], deep: { 'k\uD800': 1 }, n: 5 })
    expect(result.success).toBe(false)
    const issues = result.error!.issues.map((i) => [i.path.join('.'), i.message])
    expect(issues).toEqual([['notes.1', UNSAFE_TEXT_MESSAGE], ['deep', UNSAFE_TEXT_MESSAGE]])
    expect(SafeInputSchema.safeParse({ text: 'fine 🧊' }).success).toBe(true)
  })

  it('are refused by the free-text field of forms, which still chains length checks', () => {
    const field = z.object({ text: safeText(20).min(3) })
    expect(field.safeParse({ text: 'ab\u0000c' }).success).toBe(false)
    expect(field.safeParse({ text: ' ok then ' }).data).toEqual({ text: 'ok then' })
    expect(field.safeParse({ text: 'x' }).success).toBe(false)
  })
})
