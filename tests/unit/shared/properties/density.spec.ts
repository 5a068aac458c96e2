import { describe, expect, it } from 'vitest'
import { gasDensity, OutOfRangeError, pressureFromDensity, type Designation } from '#shared/utils/properties'
import { GAS_DENSITY } from './reference-points'

describe('gas density (reference EOS values computed with CoolProp 8.0.0; R508B: its R23/R116 mixture model)', () => {
  for (const [d, pts] of Object.entries(GAS_DENSITY) as [Designation, { c: number; kpa: number; rho: number }[]][]) {
    it(`${d} at 20/25 °C, 0.5–1.5 MPa within 0.2 %`, () => {
      for (const pt of pts) {
        expect(Math.abs(gasDensity(d, pt.c, pt.kpa) / pt.rho - 1), `${d} ${pt.c} °C ${pt.kpa} kPa`).toBeLessThan(0.002)
      }
    })
  }

  it('pressureFromDensity inverts gasDensity', () => {
    for (const d of ['R170', 'R23', 'R1150', 'R744', 'R508B'] as const) {
      const rho = gasDensity(d, 20, 1000)
      expect(pressureFromDensity(d, 20, rho)).toBeCloseTo(1000, 6)
    }
  })

  it('ideal-gas limit: at 1 kPa, ρ = pM/(RT) within 0.5 % (physics)', () => {
    const R = 8.314462618
    const molar: Partial<Record<Designation, number>> = { R170: 30.069, R23: 70.014, R1150: 28.054, R717: 17.031, R134a: 102.032 }
    for (const [d, M] of Object.entries(molar) as [Designation, number][]) {
      const ideal = (1000 * M) / 1000 / (R * 293.15)
      expect(Math.abs(gasDensity(d, 20, 1) / ideal - 1), d).toBeLessThan(0.005)
    }
  })

  it('throws OutOfRangeError for a liquid state (R23 at 20 °C above its 4161 kPa saturation pressure)', () => {
    expect(() => gasDensity('R23', 20, 4500)).toThrow(OutOfRangeError)
    expect(() => gasDensity('R23', 20, 4500)).toThrow(/kPa/)
    expect(() => gasDensity('R23', 20, -1)).toThrow(OutOfRangeError)
    expect(() => gasDensity('R23', -300, 100)).toThrow(OutOfRangeError)
  })

  it('supercritical states have a density (ethylene 30 kg/m³ at 20 °C gives 2.2247 MPa, Smukala 2000 EOS via CoolProp 8.0.0)', () => {
    expect(gasDensity('R1150', 20, 2224.7)).toBeCloseTo(30, 1)
  })
})
