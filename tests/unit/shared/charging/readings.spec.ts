import { describe, expect, it } from 'vitest'
import { designPressureWarnings, pressureReading, pressureText } from '#shared/utils/charging'

const display = { unit: 'barg', atmosphericKpa: 101.325 } as const

describe('pressureReading', () => {
  it('shows absolute kPa in the gauge unit at the given atmosphere (1 bar = 100 kPa)', () => {
    expect(pressureReading(1101.325, display)).toMatchObject({ value: 10, unit: 'barg', gauge: true, text: '10.000 bar g' })
    expect(pressureReading(1000, { unit: 'kPa', atmosphericKpa: 90 })).toMatchObject({ value: 1000, gauge: false, text: '1000.0 kPa abs' })
    // 500 microns = 66.66 Pa (1 micron = 0.133322 Pa).
    expect(pressureReading(0.066661, { unit: 'micron', atmosphericKpa: 101.325 }).text).toBe('500 micron abs')
    expect(pressureText(1101.325, display)).toBe('1101.3 kPa abs (10.000 bar g)')
  })
})

describe('designPressureWarnings (thresholds: above = danger, within 10 % = caution, reached by 50 °C ambient = caution)', () => {
  it('above the design pressure is a danger that says to recover', () => {
    const [w] = designPressureWarnings(2600, 2500, 22, 22, display)
    expect(w).toMatch(/^DANGER/)
    expect(w).toMatch(/recover/)
  })
  it('within 10 % is a caution about the relief valve', () => {
    expect(designPressureWarnings(2300, 2500, 30, 22, display)[0]).toMatch(/^Close to the design pressure/)
  })
  it('reached on a warm day (at or below 50 °C) is a caution naming the ambient', () => {
    expect(designPressureWarnings(2000, 2500, 41.3, 22, display)[0]).toMatch(/ambient reaches 41\.3 °C/)
    expect(designPressureWarnings(2000, 2500, 75, 22, display)).toEqual([])
    expect(designPressureWarnings(2000, 2500, undefined, 22, display)).toEqual([])
  })
})
