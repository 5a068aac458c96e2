import { describe, expect, it } from 'vitest'
import { decimalText, decimalOrNull, parseDecimal } from '~/utils/decimal'

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

describe('parseDecimal', () => {
  it('reads the ways a technician types a number (common practice, no source)', () => {
    expect(parseDecimal('-80')).toEqual({ state: 'ok', value: -80 })
    expect(parseDecimal('\u221280')).toEqual({ state: 'ok', value: -80 }) // typographic minus
    expect(parseDecimal(' 1,5 ')).toEqual({ state: 'ok', value: 1.5 }) // decimal comma
    expect(parseDecimal('1 992.3')).toEqual({ state: 'ok', value: 1992.3 }) // space between thousands
    expect(parseDecimal('.5')).toEqual({ state: 'ok', value: 0.5 })
    expect(parseDecimal('2e3')).toEqual({ state: 'ok', value: 2000 })
  })

  it('treats empty input and a lone sign as not typed yet', () => {
    for (const text of ['', '  ', '-', '\u2212', '+']) expect(parseDecimal(text)).toEqual({ state: 'empty' })
  })

  it('refuses anything else with a message, never NaN', () => {
    for (const text of ['abc', '1.2.3', '1,2,3', '1,5.2', '--1', '1e999', 'NaN', 'Infinity', '0x10']) {
      const r = parseDecimal(text)
      expect(r.state, text).toBe('invalid')
      if (r.state === 'invalid') expect(r.message).toMatch(/Type a number/)
    }
  })
})
