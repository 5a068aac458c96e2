import { describe, expect, it } from 'vitest'
import { chargeFromStandingPressure, OutOfRangeError, shiftStandingPressure, standingPressureFromCharge, type Designation } from '#shared/utils/properties'

// Isochoric standing-pressure vectors (MPa abs at 15/20/25/30 °C), computed with CoolProp 8.0.0 from the
// reference EOS: ethane Bücker & Wagner 2006, ethylene Smukala et al. 2000, R23 Penoncello et al. 2003.
const ISOCHORES: { d: Designation; fill: number; mpa: number[] }[] = [
  { d: 'R170', fill: 30, mpa: [1.9421, 1.9923, 2.0423, 2.092] },
  { d: 'R170', fill: 15, mpa: [1.0799, 1.1028, 1.1257, 1.1485] },
  { d: 'R1150', fill: 30, mpa: [2.1726, 2.2247, 2.2765, 2.3281] },
  { d: 'R23', fill: 60, mpa: [1.7144, 1.7587, 1.8025, 1.846] },
]
const AMBIENT = [15, 20, 25, 30]

describe('standing pressure from charge (isochores)', () => {
  for (const v of ISOCHORES) {
    it(`${v.d} at ${v.fill} kg/m³ (e.g. ${v.fill * 10} g in 10 L) within 0.2 %`, () => {
      AMBIENT.forEach((c, i) => {
        const r = standingPressureFromCharge({ designation: v.d, ambientC: c, volumeL: 10, chargeG: v.fill * 10 })
        expect(Math.abs(r.pressureKpa / (v.mpa[i]! * 1000) - 1), `${v.d} ${c} °C`).toBeLessThan(0.002)
        // Ethylene (Tc 9.2 °C) is supercritical throughout; R23 (Tc 26.1 °C) at 30 °C too.
        expect(r.phase).toBe(v.d === 'R1150' || (v.d === 'R23' && c > 26.2) ? 'supercritical' : 'gas')
        expect(r.densityKgM3).toBeCloseTo(v.fill, 9)
      })
    })
  }

  it('half the charge gives about 55 %, not 50 %, of the standing pressure (ethane, 20 °C; Bücker & Wagner 2006 EOS via CoolProp 8.0.0)', () => {
    const full = standingPressureFromCharge({ designation: 'R170', ambientC: 20, volumeL: 10, chargeG: 300 }).pressureKpa
    const half = standingPressureFromCharge({ designation: 'R170', ambientC: 20, volumeL: 10, chargeG: 150 }).pressureKpa
    expect(half / full).toBeCloseTo(0.5535, 2)
  })

  it('same 30 kg/m³ at 20 °C, different refrigerants: very different pressures (CoolProp 8.0.0 values)', () => {
    const p = (d: Designation) => standingPressureFromCharge({ designation: d, ambientC: 20, volumeL: 1, chargeG: 30 }).pressureKpa / 1000
    expect(p('R23')).toBeCloseTo(0.959, 2)
    expect(p('R14')).toBeCloseTo(0.805, 2)
    expect(p('R116')).toBeCloseTo(0.5, 2)
    expect(p('R50')).toBeCloseTo(4.216, 2)
    expect(p('R508B')).toBeCloseTo(0.719, 2)
  })

  it('two-phase detection: R23, 500 g in 1 L at 20 °C reads the saturation pressure and says so (Penoncello 2003 EOS)', () => {
    const r = standingPressureFromCharge({ designation: 'R23', ambientC: 20, volumeL: 1, chargeG: 500 })
    expect(r.phase).toBe('two-phase')
    expect(r.pressureKpa).toBeCloseTo(4161.0, -1)
    expect(r.saturationPressureKpa).toBe(r.pressureKpa)
    expect(r.note).toMatch(/says nothing about/)
    // 500 kg/m³ is just below R23's critical density (526 kg/m³): it turns all-gas just below Tc (26.1 °C).
    expect(r.warmAboveC).toBeGreaterThan(20)
    expect(r.warmAboveC).toBeLessThan(26.2)
  })

  it('overfilled (above critical density) two-phase: no warming advice', () => {
    const r = standingPressureFromCharge({ designation: 'R23', ambientC: 20, volumeL: 1, chargeG: 800 })
    expect(r.phase).toBe('two-phase')
    expect(r.warmAboveC).toBeUndefined()
    expect(r.note).toMatch(/Do not warm/)
  })

  it('zero charge gives zero pressure; invalid inputs throw', () => {
    expect(standingPressureFromCharge({ designation: 'R170', ambientC: 20, volumeL: 10, chargeG: 0 }).pressureKpa).toBe(0)
    expect(() => standingPressureFromCharge({ designation: 'R170', ambientC: 20, volumeL: 0, chargeG: 10 })).toThrow(OutOfRangeError)
    expect(() => standingPressureFromCharge({ designation: 'R170', ambientC: 20, volumeL: 1, chargeG: -1 })).toThrow(OutOfRangeError)
    expect(() => standingPressureFromCharge({ designation: 'R170', ambientC: 900, volumeL: 1, chargeG: 1 })).toThrow(OutOfRangeError)
  })
})

describe('charge from standing pressure', () => {
  it('inverts the EOS (ethane 1.9923 MPa at 20 °C in 10 L → 300 g), not p ∝ m', () => {
    const r = chargeFromStandingPressure({ designation: 'R170', ambientC: 20, volumeL: 10, pressureKpa: 1992.3 })
    expect(r.phase).toBe('gas')
    expect(r.chargeG).toBeCloseTo(300, 0)
    const half = chargeFromStandingPressure({ designation: 'R170', ambientC: 20, volumeL: 10, pressureKpa: 1992.3 / 2 })
    expect(half.chargeG).toBeLessThan(140) // p ∝ m would say 150 g
  })

  it('round trips charge → pressure → charge for gas and supercritical states', () => {
    for (const [d, c, g] of [['R23', 25, 60], ['R1150', 20, 30], ['R508B', 20, 40], ['R744', 35, 100]] as const) {
      const p = standingPressureFromCharge({ designation: d, ambientC: c, volumeL: 1, chargeG: g }).pressureKpa
      expect(chargeFromStandingPressure({ designation: d, ambientC: c, volumeL: 1, pressureKpa: p }).chargeG).toBeCloseTo(g, 6)
    }
  })

  it('at the saturation pressure: two-phase, minimum charge = saturated vapour × volume', () => {
    const r = chargeFromStandingPressure({ designation: 'R23', ambientC: 20, volumeL: 2, pressureKpa: 4161.1 })
    expect(r.phase).toBe('two-phase')
    expect(r.chargeG).toBeGreaterThan(2 * 200) // saturated vapour at 20 °C is ~250 kg/m³
    expect(r.note).toMatch(/at least/)
    expect(Number.isFinite(r.chargeG)).toBe(true)
  })

  it('rejects non-positive pressure', () => {
    expect(() => chargeFromStandingPressure({ designation: 'R23', ambientC: 20, volumeL: 1, pressureKpa: 0 })).toThrow(OutOfRangeError)
  })
})

describe('isochoric shift', () => {
  it('ethane 1.9923 MPa at 20 °C → 2.0423 MPa at 25 °C (ideal gas would say 2.0263); CoolProp 8.0.0, Bücker & Wagner 2006', () => {
    const r = shiftStandingPressure({ designation: 'R170', referencePressureKpa: 1992.3, referenceAmbientC: 20, ambientC: 25 })
    expect(r.pressureKpa).toBeCloseTo(2042.3, -1)
    expect(Math.abs(r.pressureKpa / 2042.3 - 1)).toBeLessThan(0.002)
    expect(r.referenceDensityKgM3).toBeCloseTo(30, 1)
    expect(r.chargeG).toBe(0) // volume unknown
  })
})
