import { describe, expect, it } from 'vitest'
import { latestAmbientC, previewReading } from '~/utils/readingPreview'

const SEA = 101.325

describe('standing-pressure preview', () => {
  it('a stage above its critical temperature at ambient says so, never a saturation temperature', () => {
    // R1150's critical temperature is 9.2 °C (Smukala 2000 EOS): at 21 °C it is above critical.
    const text = previewReading('standingPressure', 85, 'kPa', { refrigerant: 'R1150', atmosphericKpa: SEA, ambientC: 21 })
    expect(text).toBe('85 kPa abs: above critical at ambient: its standing pressure measures the charge')
    expect(text).not.toMatch(/sat\./)
    // Without a room reading, a fluid critical below any plant room's temperature is still above critical.
    expect(previewReading('standingPressure', 85, 'kPa', { refrigerant: 'R1150', atmosphericKpa: SEA })).toMatch(/above critical at ambient/)
  })

  it('below the critical temperature a standing pressure still shows its saturation temperature', () => {
    // R23 (critical 26.1 °C) at 20 °C: 4161 kPa is its saturation pressure (Penoncello 2003 EOS via CoolProp 8.0.0).
    expect(previewReading('standingPressure', 4161, 'kPa', { refrigerant: 'R23', atmosphericKpa: SEA, ambientC: 20 })).toMatch(/→ 20\.0 °C sat\./)
    // R23 at 30 °C is above critical.
    expect(previewReading('standingPressure', 4161, 'kPa', { refrigerant: 'R23', atmosphericKpa: SEA, ambientC: 30 })).toMatch(/above critical/)
    // A suction pressure is always a saturation figure.
    expect(previewReading('suctionPressure', 85, 'kPa', { refrigerant: 'R1150', atmosphericKpa: SEA, ambientC: 21 })).toMatch(/°C sat\./)
  })

  it('finds the latest room temperature among the readings, in °C', () => {
    const r = (quantity: string, value: number, unit: string) => ({ quantity, value, unit }) as never
    expect(latestAmbientC([r('ambientTemperature', 20, 'C'), r('suctionPressure', 1, 'kPa'), r('ambientTemperature', 77, 'F')])).toBeCloseTo(25, 9)
    expect(latestAmbientC([r('suctionPressure', 1, 'kPa')])).toBeUndefined()
  })
})
