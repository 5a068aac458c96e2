import { describe, expect, it } from 'vitest'
import { DESIGNATIONS, findRefrigerant, glideK, OutOfRangeError, saturationPressure, saturationTemperature, UnknownRefrigerantError, type Designation } from '#shared/utils/properties'
import { SATURATION } from './reference-points'

// Tolerances: 0.2 % on pressure and 0.05 K on temperature for pure and pseudo-pure fluids; 1 % / 0.3 K for
// the R508B and R503 mixture models, whose reference values are given to 3–4 digits only.
const isMix = (d: Designation) => d === 'R508B' || d === 'R503'
const relTol = (d: Designation) => (isMix(d) ? 0.01 : d === 'R717' ? 0.003 : 0.002)

describe('saturation pressure from temperature (reference EOS values, sources per fluid in reference-points.ts)', () => {
  for (const d of DESIGNATIONS) {
    it(`${d}: ${SATURATION[d].source}`, () => {
      expect(SATURATION[d].sat.length).toBeGreaterThanOrEqual(3)
      for (const pt of SATURATION[d].sat) {
        const s = saturationPressure(d, pt.c)
        expect(Math.abs(s.bubbleKpa / pt.kpa - 1), `${d} bubble at ${pt.c} °C`).toBeLessThan(relTol(d))
        expect(Math.abs(s.dewKpa / (pt.dewKpa ?? pt.kpa) - 1), `${d} dew at ${pt.c} °C`).toBeLessThan(relTol(d))
      }
    })
  }
})

describe('saturation temperature from pressure (same sources)', () => {
  for (const d of DESIGNATIONS) {
    it(`${d}`, () => {
      const tolK = isMix(d) ? 0.3 : 0.05
      const minC = findRefrigerant(d)!.validRange.minC
      // The triple-point row (R744) is skipped: its rounded pressure lies a hair below the triple-point pressure.
      for (const pt of SATURATION[d].sat.filter((p) => p.c > minC + 0.01)) {
        // Reference pressures are rounded to 5 digits: a 0.005 % rounding is well below 0.01 K.
        expect(saturationTemperature(d, pt.kpa).bubbleC, `${d} bubble T at ${pt.kpa} kPa`).toBeCloseTo(pt.c, 0)
        expect(Math.abs(saturationTemperature(d, pt.kpa).bubbleC - pt.c)).toBeLessThan(tolK)
        expect(Math.abs(saturationTemperature(d, pt.dewKpa ?? pt.kpa).dewC - pt.c)).toBeLessThan(tolK)
      }
    })
  }
})

describe('round trip T → p → T', () => {
  for (const d of DESIGNATIONS) {
    it(`${d} within 1e-6 K across the range`, () => {
      const { minC, maxC } = findRefrigerant(d)!.validRange
      for (let i = 0; i <= 40; i++) {
        const c = minC + ((maxC - minC) * i) / 40
        const p = saturationPressure(d, c)
        // For blends the bubble pressure at Tmin is above the lowest dew pressure, so both directions exist.
        expect(Math.abs(saturationTemperature(d, p.bubbleKpa).bubbleC - c)).toBeLessThan(1e-6)
        expect(Math.abs(saturationTemperature(d, p.dewKpa).dewC - c)).toBeLessThan(1e-6)
      }
    })
  }
})

describe('normal boiling points and glide', () => {
  it('normal boiling point in the catalogue matches the model at 101.325 kPa', () => {
    for (const d of DESIGNATIONS) {
      if (d === 'R744') continue // CO2 sublimes at 1 atm: its NBP field is the sublimation point
      const info = findRefrigerant(d)!
      const s = saturationTemperature(d, 101.325)
      expect(Math.abs(s.bubbleC - info.normalBoilingPointC), d).toBeLessThan(0.02)
      expect(Math.abs(s.dewC - (info.normalBoilingPointDewC ?? info.normalBoilingPointC)), d).toBeLessThan(0.02)
    }
  })

  it('R508B NBP −87.66/−87.28 °C, glide ≈ 0.4 K (CoolProp 8.0.0 mixture model)', () => {
    const s = saturationTemperature('R508B', 101.325)
    expect(s.bubbleC).toBeCloseTo(-87.66, 1)
    expect(s.dewC).toBeCloseTo(-87.28, 1)
    expect(glideK('R508B', 101.325)).toBeGreaterThan(0.3)
    expect(glideK('R508B', 101.325)).toBeLessThan(0.5)
  })

  it('pure fluids have zero glide; R404A about 0.75 K at 1 atm (Lemmon 2003 via CoolProp 8.0.0)', () => {
    expect(glideK('R23', 500)).toBe(0)
    expect(glideK('R404A', 101.325)).toBeCloseTo(-45.47 - -46.22, 1)
  })

  it('R23 runs below atmospheric under about −82 °C: 85.0 kPa at −85 °C (Penoncello 2003 EOS via CoolProp 8.0.0)', () => {
    expect(saturationPressure('R23', -85).bubbleKpa).toBeCloseTo(85.0, 0)
  })
})

describe('errors', () => {
  it('temperature outside the saturation range names the range in °C', () => {
    expect(() => saturationPressure('R170', 40)).toThrow(OutOfRangeError)
    expect(() => saturationPressure('R170', 40)).toThrow('R170 saturation is defined from -182.8 °C to 32.2 °C')
    expect(() => saturationPressure('R23', -200)).toThrow(OutOfRangeError)
    expect(() => saturationPressure('R23', Number.NaN)).toThrow(OutOfRangeError)
  })

  it('pressure outside the range names kPa and °C and carries the range', () => {
    try {
      saturationTemperature('R744', 8000)
      expect.unreachable()
    } catch (e) {
      expect(e).toBeInstanceOf(OutOfRangeError)
      expect((e as Error).message).toMatch(/kPa.*°C/)
      expect((e as OutOfRangeError).range?.maxKpa).toBeCloseTo(7377.3, 0)
    }
    expect(() => saturationTemperature('R744', 400)).toThrow(OutOfRangeError) // below the triple point
  })

  it('unknown designation throws UnknownRefrigerantError', () => {
    expect(() => saturationPressure('R999' as Designation, 0)).toThrow(UnknownRefrigerantError)
  })
})
