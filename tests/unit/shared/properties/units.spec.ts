import { describe, expect, it } from 'vitest'
import { ALL_PRESSURE_UNITS, atmosphericPressureAtAltitude, fromCelsius, fromKpaAbs, isGaugeUnit, OutOfRangeError, PRESSURE_UNIT_LABELS, toCelsius, toKpaAbs, UnitError, VACUUM_UNITS } from '#shared/utils/properties'

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
    // inHg vacuum only counts down from the atmosphere, so the above-atmosphere round trip leaves it out.
    for (const u of ALL_PRESSURE_UNITS.filter((x) => x !== 'inHgV')) expect(toKpaAbs(fromKpaAbs(523.4, u, 95), u, 95)).toBeCloseTo(523.4, 9)
    for (const u of ALL_PRESSURE_UNITS) expect(toKpaAbs(fromKpaAbs(0.0667, u, 84.56), u, 84.56), u).toBeCloseTo(0.0667, 9)
  })

  it('rejects unknown units, non-finite values and sub-vacuum readings', () => {
    expect(() => toKpaAbs(1, 'atm')).toThrow(UnitError)
    expect(() => toKpaAbs(1, 'PSIG')).toThrow(UnitError) // strict: case matters
    try { toKpaAbs(1, 'inHg') } catch (e) { expect((e as UnitError).allowed).toEqual(ALL_PRESSURE_UNITS) }
    expect(() => toKpaAbs(Number.NaN, 'kPa')).toThrow(UnitError)
    expect(() => toKpaAbs(Infinity, 'kPa')).toThrow(UnitError)
    expect(() => toKpaAbs(-200, 'kPag')).toThrow(OutOfRangeError)
    expect(() => toKpaAbs(1e308, 'psig')).toThrow(OutOfRangeError) // overflows to Infinity
  })
})

describe('vacuum units for evacuation (1 mmHg = 133.322387 Pa, conventional; 1 inHg = 25.4 mmHg; 1 micron = 0.001 mmHg)', () => {
  it('worked values', () => {
    // 500 microns, the usual deep-vacuum target, is 66.66 Pa (1 micron = 0.133322 Pa, physics).
    expect(toKpaAbs(500, 'micron') * 1000).toBeCloseTo(66.661, 3)
    // 1 atm = 760 000 microns (760 mmHg, by definition of the conventional millimetre of mercury).
    expect(fromKpaAbs(101.325, 'micron')).toBeCloseTo(760_000, -1)
    // The triple point of water, 611.657 Pa, is about 4 588 microns (physics).
    expect(fromKpaAbs(0.611657, 'micron')).toBeCloseTo(4588, 0)
    expect(toKpaAbs(1000, 'mbar')).toBe(100)
    expect(toKpaAbs(66.7, 'Pa')).toBeCloseTo(0.0667, 10)
    // 29.92 inHg is one standard atmosphere: 29.92 inHg vacuum at sea level leaves about 0.006 kPa absolute.
    expect(toKpaAbs(29.92, 'inHgV')).toBeCloseTo(0.006, 2)
    expect(toKpaAbs(0, 'inHgV')).toBe(101.325)
    // inHg vacuum reads against the local atmosphere: 20 inHg vacuum at 1 500 m (84.56 kPa) is 16.83 kPa absolute.
    expect(toKpaAbs(20, 'inHgV', 84.56)).toBeCloseTo(84.56 - 20 * 3.386389, 3)
  })

  it('labels say absolute or vacuum; negative vacuum readings and readings past a perfect vacuum are refused', () => {
    expect(VACUUM_UNITS).toEqual(['micron', 'mbar', 'Pa', 'inHgV'])
    expect(isGaugeUnit('inHgV')).toBe(true)
    expect(isGaugeUnit('micron')).toBe(false)
    expect(PRESSURE_UNIT_LABELS.micron.short).toBe('micron abs')
    expect(PRESSURE_UNIT_LABELS.inHgV.short).toBe('inHg vac')
    for (const u of ALL_PRESSURE_UNITS) expect(PRESSURE_UNIT_LABELS[u].short, u).toMatch(/abs$|g$|psia$|vac$/)
    expect(() => toKpaAbs(-1, 'inHgV')).toThrow(OutOfRangeError)
    expect(() => toKpaAbs(31, 'inHgV')).toThrow(OutOfRangeError)
    expect(() => toKpaAbs(-5, 'micron')).toThrow(OutOfRangeError)
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
