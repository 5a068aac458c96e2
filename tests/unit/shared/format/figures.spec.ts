import { describe, expect, it } from 'vitest'
import { formatFigure, formatPercent, formatPressure, formatQuantity, formatReading } from '#shared/utils/format'

const SP = ' '

describe('figures with their unit', () => {
  it('use a true minus, no negative zero, and keep the unit beside the number', () => {
    expect(formatFigure(-80, 1)).toBe('\u221280.0')
    expect(formatFigure(-0.04, 1)).toBe('0.0')
    expect(formatQuantity(-80, 'C')).toBe(`\u221280.0${SP}°C`)
    expect(formatQuantity(7.5, 'L')).toBe(`7.5${SP}L`)
    expect(formatQuantity(null, 'g')).toBe('—')
    expect(formatReading({ value: 12, unit: 'psig' })).toBe(`12${SP}psig`)
    expect(formatReading({ value: true, unit: 'bool' })).toBe('yes')
    expect(formatPercent(0.714)).toBe(`71${SP}%`)
  })

  it('say gauge or absolute for every pressure', () => {
    // 15 psi × 6.894757 kPa/psi (NIST SP 811) + 101.325 kPa (ISO 2533 sea level) = 204.746 kPa abs
    expect(formatPressure(204.746)).toBe(`204.7${SP}kPa abs`)
    expect(formatPressure(204.746, { unit: 'psig' })).toBe(`15.0${SP}psig`)
    expect(formatPressure(204.746, { unit: 'barg', decimals: 2 })).toBe(`1.03${SP}bar g`)
  })
})

describe('formatFigure', () => {
  it('uses a true minus and never shows −0', () => {
    expect(formatFigure(-80, 1)).toBe('\u221280.0')
    expect(formatFigure(-0.04, 1)).toBe('0.0')
    expect(formatFigure(157.4134, 1)).toBe('157.4')
  })
})
