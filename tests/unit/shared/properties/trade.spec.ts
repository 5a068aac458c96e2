import { describe, expect, it } from 'vitest'
import { compressionRatio, OutOfRangeError, saturatedCondensingC, saturatedSuctionC, saturationPressure, subcoolingK, superheatK, type Designation } from '#shared/utils/properties'

// Compression ratios, suction at dew / discharge at bubble, computed with CoolProp 8.0.0 from the EOS of each fluid.
const RATIOS: [Designation, number, number, number][] = [
  ['R404A', -40, 40, 13.97],
  ['R404A', -70, 40, 70.2], // why a single stage cannot reach ULT temperatures
  ['R22', -40, 40, 14.57],
  ['R134a', -25, 40, 9.55],
  ['R410A', 5, 45, 2.93],
  ['R170', -85, -35, 7.45],
  ['R23', -85, -35, 9.96],
  ['R1150', -100, -35, 13.36],
  ['R14', -120, -60, 14.03],
]

describe('compression ratio', () => {
  for (const [d, evap, cond, ratio] of RATIOS) {
    it(`${d} ${evap}/${cond} °C → ${ratio}`, () => {
      const r = compressionRatio(saturationPressure(d, evap).dewKpa, saturationPressure(d, cond).bubbleKpa)
      expect(Math.abs(r / ratio - 1)).toBeLessThan(0.003)
    })
  }
  it('needs positive absolute pressures', () => {
    expect(() => compressionRatio(0, 100)).toThrow(OutOfRangeError)
    expect(() => compressionRatio(100, Number.NaN)).toThrow(OutOfRangeError)
  })
})

describe('superheat and subcooling', () => {
  it('R404A: suction 130.98 kPa (dew −40 °C) at −34 °C → 6 K superheat (Lemmon 2003 pseudo-pure via CoolProp 8.0.0)', () => {
    expect(superheatK('R404A', 130.98, -34)).toBeCloseTo(6, 1)
    expect(saturatedSuctionC('R404A', 130.98)).toBeCloseTo(-40, 1)
  })
  it('R404A: liquid at 1829.5 kPa (bubble 40 °C) and 34 °C → 6 K subcooling; condensing quoted at dew (~40.3 °C)', () => {
    expect(subcoolingK('R404A', 1829.5, 34)).toBeCloseTo(6, 1)
    expect(saturatedCondensingC('R404A', 1829.5)).toBeGreaterThan(40.2)
  })
  it('R23 low stage: 2–4 K superheat is typical for low-temperature TXV evaporators (common practice, no source)', () => {
    const p = saturationPressure('R23', -85).dewKpa
    expect(superheatK('R23', p, -82)).toBeCloseTo(3, 6)
  })
})
