import { describe, expect, it } from 'vitest'
import { atmosphericPressureAtAltitude, fromCelsius, fromKpaAbs, OutOfRangeError, PRESSURE_UNITS, toCelsius, toKpaAbs, UnitError } from '#shared/utils/properties'

describe('pressure units (definitions: 1 bar = 100 kPa, 1 psi = 6.894757 kPa, 1 atm = 101.325 kPa)', () => {
  it('worked values', () => {
    expect(toKpaAbs(0, 'psig')).toBe(101.325)
    expect(toKpaAbs(14.696, 'psia')).toBeCloseTo(101.325, 2)
    expect(toKpaAbs(1, 'bar')).toBe(100)
    expect(toKpaAbs(0, 'barg')).toBe(101.325)
    expect(toKpaAbs(1.5, 'MPa')).toBe(1500)
    expect(toKpaAbs(100, 'kPag', 84.56)).toBeCloseTo(184.56, 10)
    // 150 psig (ACHR News nitrogen standing-test example reading) = 150 × 6.894757 + 101.325 kPa (own arithmetic)
    expect(toKpaAbs(150, 'psig')).toBeCloseTo(1135.54, 1)
  })

  it('fromKpaAbs inverts toKpaAbs for every unit', () => {
    for (const u of PRESSURE_UNITS) expect(toKpaAbs(fromKpaAbs(523.4, u, 95), u, 95)).toBeCloseTo(523.4, 9)
  })

  it('rejects unknown units, non-finite values and sub-vacuum readings', () => {
    expect(() => toKpaAbs(1, 'atm')).toThrow(UnitError)
    expect(() => toKpaAbs(1, 'PSIG')).toThrow(UnitError) // strict: case matters
    try { toKpaAbs(1, 'inHg') } catch (e) { expect((e as UnitError).allowed).toEqual(PRESSURE_UNITS) }
    expect(() => toKpaAbs(Number.NaN, 'kPa')).toThrow(UnitError)
    expect(() => toKpaAbs(Infinity, 'kPa')).toThrow(UnitError)
    expect(() => toKpaAbs(-200, 'kPag')).toThrow(OutOfRangeError)
  })
})

describe('temperature units', () => {
  it('worked values', () => {
    expect(toCelsius(50, 'F')).toBeCloseTo(10, 12)
    expect(toCelsius(-40, 'F')).toBeCloseTo(-40, 12)
    expect(toCelsius(273.15, 'K')).toBeCloseTo(0, 12)
    expect(fromCelsius(10, 'F')).toBeCloseTo(50, 12)
    expect(fromCelsius(-273.15, 'K')).toBeCloseTo(0, 12)
  })

  it('rejects unknown units and temperatures below absolute zero', () => {
    expect(() => toCelsius(10, 'c')).toThrow(UnitError)
    expect(() => toCelsius(10, 'R')).toThrow(UnitError)
    expect(() => toCelsius(-300, 'C')).toThrow(OutOfRangeError)
    expect(() => toCelsius(-1, 'K')).toThrow(OutOfRangeError)
  })
})

describe('ISO 2533 standard atmosphere', () => {
  it('sea level 101.325 kPa; 1500 m → 84.56 kPa', () => {
    expect(atmosphericPressureAtAltitude(0)).toBe(101.325)
    expect(atmosphericPressureAtAltitude(1500)).toBeCloseTo(84.56, 2)
  })
  it('rejects altitudes outside the troposphere formula', () => {
    expect(() => atmosphericPressureAtAltitude(20000)).toThrow(OutOfRangeError)
    expect(() => atmosphericPressureAtAltitude(Number.NaN)).toThrow(UnitError)
  })
})
