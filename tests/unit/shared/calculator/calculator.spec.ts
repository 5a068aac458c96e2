import { describe, expect, it } from 'vitest'
import { resolveRefrigerant, saturationLookup, standingCheck } from '#shared/utils/calculator'
import { OutOfRangeError, UnknownRefrigerantError } from '#shared/utils/properties'

describe('resolveRefrigerant', () => {
  it('accepts loose spellings and refuses unknown designations by name', () => {
    expect(resolveRefrigerant('r-508b').designation).toBe('R508B')
    expect(() => resolveRefrigerant('R9999')).toThrow(UnknownRefrigerantError)
    expect(() => resolveRefrigerant('R9999')).toThrow(/R9999/)
  })
})

describe('saturationLookup', () => {
  it('answers pure fluids with one value and blends with bubble and dew', () => {
    // Bücker & Wagner 2006 (ethane) and Lemmon 2003 (R404A) EOS as tabulated by CoolProp 8.0.0
    const pure = saturationLookup(resolveRefrigerant('R170'), { by: 'temperature', temperatureC: -80 })
    expect(pure).toMatchObject({ designation: 'R170', temperatureC: -80 })
    expect('pressureKpa' in pure && pure.pressureKpa).toBeCloseTo(157.41, 1)
    const blend = saturationLookup(resolveRefrigerant('R404A'), { by: 'temperature', temperatureC: -40 })
    expect(blend).toMatchObject({ bubblePressureKpa: expect.closeTo(135.29, 1), dewPressureKpa: expect.closeTo(130.98, 1) })
    const back = saturationLookup(resolveRefrigerant('R404A'), { by: 'pressure', pressureKpa: 135.29 })
    expect(back).toMatchObject({ bubbleTemperatureC: expect.closeTo(-40, 1), glideK: expect.any(Number) })
  })

  it('converts a reading given with a unit and echoes it', () => {
    // 15 psig = 15 × 6.894757 + 101.325 kPa abs (NIST SP 811 psi factor, ISO 2533 sea level)
    const r = saturationLookup(resolveRefrigerant('R170'), { by: 'pressure', value: 15, unit: 'psig' })
    expect(r).toMatchObject({ pressureKpa: expect.closeTo(204.746, 2), input: { value: 15, unit: 'psig' } })
  })
})

const display = { unit: 'kPag', atmosphericKpa: 101.325 } as const

describe('standingCheck', () => {
  it('goes both ways for ethane at 30 kg/m³ and 20 °C', () => {
    const info = resolveRefrigerant('R170')
    // 1992.3 kPa: Bücker & Wagner 2006 ethane EOS at 20 °C and 30 kg/m³, as computed with CoolProp 8.0.0
    const there = standingCheck(info, { mode: 'charge', designation: 'R170', ambientC: 20, volumeL: 10, chargeG: 300, display })
    expect(there).toMatchObject({ mode: 'charge', phase: 'gas', pressureKpa: expect.closeTo(1992.3, 0) })
    const back = standingCheck(info, { mode: 'pressure', designation: 'R170', ambientC: 20, volumeL: 10, pressure: { kpa: 1992.3 }, display })
    expect(back).toMatchObject({ mode: 'pressure', chargeG: expect.closeTo(300, 0), chargeIsMinimum: false })
  })

  it('gives a charge for a shifted reading only when the volume is known', () => {
    const info = resolveRefrigerant('R170')
    const req = { mode: 'shift', designation: 'R170', ambientC: 20, referencePressureKpa: 1992.3, referenceAmbientC: 20, display } as const
    expect(standingCheck(info, req)).not.toHaveProperty('chargeG')
    expect(standingCheck(info, { ...req, volumeL: 10 })).toMatchObject({ chargeG: expect.closeTo(300, 0) })
  })
})

describe('standingCheck refuses fills beyond the equation of state', () => {
  it('names the range instead of printing an absurd pressure', () => {
    const info = resolveRefrigerant('R1150')
    // 1000 kg/m³ of ethylene at 20 °C is far denser than its liquid: a typing slip (physics, no source needed)
    expect(() => standingCheck(info, { mode: 'charge', designation: 'R1150', ambientC: 20, volumeL: 1, chargeG: 1000, display })).toThrow(/beyond the range of its equation of state \(0 to/)
    expect(() => standingCheck(resolveRefrigerant('R170'), { mode: 'charge', designation: 'R170', ambientC: 20, volumeL: 1e-300, chargeG: 1e7, display })).toThrow(OutOfRangeError)
  })
})
