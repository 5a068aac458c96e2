import { describe, expect, it } from 'vitest'
import { PRESSURE_LABELS, formatFigure, parseDecimal } from '~/utils/figures'

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

describe('formatFigure', () => {
  it('uses a true minus and never shows −0', () => {
    expect(formatFigure(-80, 1)).toBe('\u221280.0')
    expect(formatFigure(-0.04, 1)).toBe('0.0')
    expect(formatFigure(157.4134, 1)).toBe('157.4')
  })
})

describe('PRESSURE_LABELS', () => {
  it('says gauge, vacuum or absolute for every unit', () => {
    for (const [unit, label] of Object.entries(PRESSURE_LABELS)) {
      // Gauge units and inches of mercury vacuum both read against the local atmosphere.
      expect(label.gauge, unit).toBe(unit.endsWith('g') || unit === 'inHgV')
      expect(label.short, unit).toMatch(label.gauge ? /(g|vac)$/ : /(abs|a)$/)
    }
  })
})
