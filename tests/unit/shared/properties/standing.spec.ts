import { describe, expect, it } from 'vitest'
import {
  ABOVE_CRITICAL_AT_AMBIENT, ambientAtStandingPressure, chargeFromStandingPressure, OutOfRangeError, saturatedLiquidDensity, shiftStandingPressure, standingPressureFromCharge,
  type Designation,
} from '#shared/utils/properties'

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

  it('slope of the isochore: ethane at 30 kg/m³ and 20 °C rises 10.02 kPa/K, not the 6.80 kPa/K of p/T (Bücker & Wagner 2006 EOS via CoolProp 8.0.0)', () => {
    const r = standingPressureFromCharge({ designation: 'R170', ambientC: 20, volumeL: 10, chargeG: 300 })
    expect(r.kpaPerK).toBeCloseTo(10.02, 1)
    // CO2 carries non-analytic terms: its slope must match a difference of the pressures it reports.
    const co2 = (c: number) => standingPressureFromCharge({ designation: 'R744', ambientC: c, volumeL: 1, chargeG: 100 }).pressureKpa
    const slope = standingPressureFromCharge({ designation: 'R744', ambientC: 35, volumeL: 1, chargeG: 100 }).kpaPerK
    expect(slope).toBeCloseTo((co2(35.01) - co2(34.99)) / 0.02, 2)
  })

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

describe('liquid-full stages (compressed liquid from the equation of state)', () => {
  it('3.6 kg of R170 in 10 L at 22 °C: liquid-full at 5671 kPa, not two-phase at 3931 kPa (Bücker & Wagner 2006 EOS via CoolProp 8.0.0)', () => {
    const r = standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 10, chargeG: 3600 })
    expect(r.phase).toBe('liquid')
    // CoolProp 8.0.0: p(22 °C, 360 kg/m³) = 5671.2 kPa; saturated liquid 330.26 kg/m³, saturation pressure 3931.0 kPa.
    expect(r.pressureKpa).toBeCloseTo(5671.2, 0)
    expect(r.saturatedLiquidDensityKgM3).toBeCloseTo(330.26, 1)
    expect(r.saturationPressureKpa).toBeCloseTo(3931.0, 0)
    expect(r.warnings[0]).toMatch(/^LIQUID-FULL/)
    expect(r.warnings[0]).toMatch(/burst|relief valve/)
    expect(r.warnings[0]).toMatch(/recover/)
    // A liquid-full isochore is steep: hundreds of kPa per kelvin (CoolProp 8.0.0 slope near 310 kPa/K here).
    expect(r.kpaPerK).toBeGreaterThan(250)
  })

  it('other fluids at the liquid-full/saturation boundary (CoolProp 8.0.0 with each reference EOS)', () => {
    // [designation, g in 10 L at 22 °C, compressed-liquid kPa, saturation kPa]
    const cases = [['R23', 9000, 6047.1, 4368.6], ['R744', 9000, 15863.5, 6003.1]] as const
    for (const [d, g, p, sat] of cases) {
      const r = standingPressureFromCharge({ designation: d, ambientC: 22, volumeL: 10, chargeG: g })
      expect(r.phase, d).toBe('liquid')
      expect(Math.abs(r.pressureKpa / p - 1), d).toBeLessThan(0.002)
      expect(Math.abs(r.saturationPressureKpa! / sat - 1), d).toBeLessThan(0.002)
    }
  })

  it('just below the saturated liquid density it is two-phase at the saturation pressure; just above, liquid (continuity)', () => {
    const rhoL = standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 1, chargeG: 300 }).saturatedLiquidDensityKgM3!
    const below = standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 1, chargeG: rhoL * 0.999 })
    const above = standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 1, chargeG: rhoL * 1.0005 })
    expect(below.phase).toBe('two-phase')
    expect(above.phase).toBe('liquid')
    expect(above.pressureKpa).toBeGreaterThan(below.pressureKpa)
    expect(above.pressureKpa / below.pressureKpa).toBeLessThan(1.1)
  })

  it('round trip charge → pressure → charge for a liquid-full stage', () => {
    for (const [d, g] of [['R170', 3600], ['R23', 9000], ['R13', 12000], ['R404A', 11000]] as const) {
      const p = standingPressureFromCharge({ designation: d, ambientC: 22, volumeL: 10, chargeG: g })
      expect(p.phase, d).toBe('liquid')
      const back = chargeFromStandingPressure({ designation: d, ambientC: 22, volumeL: 10, pressureKpa: p.pressureKpa })
      expect(back.phase, d).toBe('liquid')
      expect(back.chargeG, d).toBeCloseTo(g, 3)
      expect(back.warnings.join(' '), d).toMatch(/Air or another gas/)
    }
  })

  it('a reading just above the saturation pressure (within gauge error) stays two-phase with a minimum charge', () => {
    const r = chargeFromStandingPressure({ designation: 'R170', ambientC: 22, volumeL: 10, pressureKpa: 3931 * 1.02 })
    expect(r.phase).toBe('two-phase')
    expect(r.note).toMatch(/at least/)
  })

  it('a two-phase fill above the critical density warns at which ambient it would become liquid-full', () => {
    const r = standingPressureFromCharge({ designation: 'R23', ambientC: 20, volumeL: 1, chargeG: 800 })
    expect(r.phase).toBe('two-phase')
    // R23's saturated liquid falls to 800 kg/m³ just above 20 °C (Penoncello 2003 EOS via CoolProp 8.0.0: 776.5 kg/m³ at 22 °C).
    expect(r.liquidFullAboveC).toBeGreaterThan(20)
    expect(r.liquidFullAboveC).toBeLessThan(22)
    expect(r.warnings[0]).toMatch(/Near liquid-full/)
  })
})

describe('supercritical stages', () => {
  it('say "above critical at ambient: its standing pressure measures the charge" and give no saturation figure', () => {
    const r = standingPressureFromCharge({ designation: 'R1150', ambientC: 22, volumeL: 12, chargeG: 153.8 })
    expect(r.phase).toBe('supercritical')
    expect(r.note).toContain(ABOVE_CRITICAL_AT_AMBIENT)
    expect(ABOVE_CRITICAL_AT_AMBIENT).toBe('above critical at ambient: its standing pressure measures the charge')
    expect(r.saturationPressureKpa).toBeUndefined()
  })

  it('6 kg of R1150 in 12 L at 22 °C: 68.3 MPa, and loudly above the critical pressure (Smukala 2000 EOS via CoolProp 8.0.0)', () => {
    const r = standingPressureFromCharge({ designation: 'R1150', ambientC: 22, volumeL: 12, chargeG: 6000 })
    expect(r.pressureKpa / 1000).toBeCloseTo(68.26, 1)
    expect(r.warnings.join(' ')).toMatch(/above R1150's critical pressure/)
  })

  it('the ambient at which a fill reaches a pressure: 153.8 g of R1150 in 12 L reaches 1082.3 kPa at 30 °C (CoolProp 8.0.0)', () => {
    const c = ambientAtStandingPressure('R1150', 153.8 / 12, 1082.3, 22)
    expect(c).toBeCloseTo(30, 1)
    expect(ambientAtStandingPressure('R1150', 153.8 / 12, 500, 22)).toBe(22) // already above at 22 °C
    expect(ambientAtStandingPressure('R1150', 153.8 / 12, 1e6, 22)).toBeUndefined() // not reached by 100 °C
    // It stands at 1364.1 kPa abs at 100 °C: 1300 kPa is reached at 84 °C, 1400 kPa only beyond the search limit.
    expect(ambientAtStandingPressure('R1150', 153.8 / 12, 1300, 22)).toBeCloseTo(84.0, 0)
    expect(ambientAtStandingPressure('R1150', 153.8 / 12, 1400, 22)).toBeUndefined()
  })
})

describe('saturated liquid density of blends (bubble-point liquid; CoolProp 8.0.0: Lemmon 2003 pseudo-pure EOS, R23/R116 mixture model)', () => {
  it('R404A 1149.98, R410A 1169.95, R508B 982.997 kg/m³ at 0 °C; just above it the fill is liquid-full', () => {
    for (const [d, rho] of [['R404A', 1149.98], ['R410A', 1169.95], ['R508B', 982.997]] as const) {
      expect(Math.abs(saturatedLiquidDensity(d, 0) / rho - 1), d).toBeLessThan(0.001)
      expect(standingPressureFromCharge({ designation: d, ambientC: 0, volumeL: 1, chargeG: rho * 1.01 }).phase, d).toBe('liquid')
      expect(standingPressureFromCharge({ designation: d, ambientC: 0, volumeL: 1, chargeG: rho * 0.99 }).phase, d).toBe('two-phase')
    }
  })
})
