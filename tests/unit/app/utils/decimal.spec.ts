import { describe, expect, it } from 'vitest'
import { decimalText, parseDecimal } from '../../../../app/utils/decimal'

describe('parseDecimal', () => {
  it('reads points, commas, signs and the typographic minus', () => {
    expect(parseDecimal('9.5')).toBe(9.5)
    expect(parseDecimal(' 9,5 ')).toBe(9.5)
    expect(parseDecimal('\u221286')).toBe(-86)
    expect(parseDecimal('1 800')).toBe(1800)
    expect(parseDecimal('.5')).toBe(0.5)
  })
  it('keeps empty as unknown and garbage as NaN for the schema to name', () => {
    expect(parseDecimal('')).toBeNull()
    expect(parseDecimal('   ')).toBeNull()
    expect(parseDecimal('12a')).toBeNaN()
    expect(parseDecimal('1.2.3')).toBeNaN()
  })
  it('prints numbers back for editing', () => {
    expect(decimalText(null)).toBe('')
    expect(decimalText(-80)).toBe('-80')
  })
})
