import { describe, expect, it } from 'vitest'
import { decimalText, decimalOrNull } from '../../../../app/utils/decimal'

describe('decimalOrNull', () => {
  it('reads points, commas, signs and the typographic minus', () => {
    expect(decimalOrNull('9.5')).toBe(9.5)
    expect(decimalOrNull(' 9,5 ')).toBe(9.5)
    expect(decimalOrNull('\u221286')).toBe(-86)
    expect(decimalOrNull('1 800')).toBe(1800)
    expect(decimalOrNull('.5')).toBe(0.5)
  })
  it('keeps empty as unknown and garbage as NaN for the schema to name', () => {
    expect(decimalOrNull('')).toBeNull()
    expect(decimalOrNull('   ')).toBeNull()
    expect(decimalOrNull('12a')).toBeNaN()
    expect(decimalOrNull('1.2.3')).toBeNaN()
  })
  it('prints numbers back for editing', () => {
    expect(decimalText(null)).toBe('')
    expect(decimalText(-80)).toBe('-80')
  })
})
