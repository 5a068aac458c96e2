/**
 * Standing charge: a system switched off and equalised at ambient temperature is a fixed mass in a fixed
 * volume, i.e. a point on an isochore. Fill density = charge / internal volume (g/L = kg/m³).
 * - Ambient ≥ Tc: one supercritical phase; pressure from the EOS.
 * - Fill density ≤ saturated (dew) vapour density at ambient: all gas; pressure from the EOS.
 * - Otherwise liquid is present: the pressure is the saturation (dew) pressure and says nothing about
 *   the charge.
 */
import { pressure, vaporDensity } from './eos'
import { fmtC, fmtKpa, OutOfRangeError } from './errors'
import type { Designation } from './fluids'
import { fluidModel, type FluidModel } from './model'
import { dewState, gasMolarDensity, stateT } from './properties'
import { tOf } from './saturation'

export type StandingPhase = 'gas' | 'two-phase' | 'supercritical'
export interface StandingResult {
  pressureKpa: number
  chargeG: number
  densityKgM3: number
  phase: StandingPhase
  note: string
  saturationPressureKpa?: number
  warmAboveC?: number
}

const K0 = 273.15

function positive(v: number, what: string, allowZero = false): void {
  if (!Number.isFinite(v) || v < 0 || (!allowZero && v === 0)) {
    throw new OutOfRangeError(`${what} must be a finite number ${allowZero ? '≥' : '>'} 0; got ${String(v)}.`)
  }
}

/**
 * Where a two-phase fill becomes single-phase on warming: for fill densities below the critical density
 * the isochore leaves the dome through the dew curve, at the T where ρ''(T) = ρ. Above the critical
 * density it leaves through the bubble curve (liquid-full), which is unsafe to provoke: undefined then.
 */
function dewPointOfIsochore(m: FluidModel, rhoMol: number): number | undefined {
  const t = m.sat()
  if (rhoMol >= t.rhoc) return undefined
  return tOf(t, t.lnRhoV.inverse(Math.log(rhoMol))) - K0
}

/** State at ambient T (K) for a molar fill density; the core of both standing-charge directions. */
function standingAt(m: FluidModel, T: number, rhoMol: number, volumeL: number): StandingResult {
  const M = m.residual.M
  const densityKgM3 = rhoMol * M
  const chargeG = densityKgM3 * volumeL
  const t = m.sat()
  const fill = `fill density ${densityKgM3.toFixed(1)} kg/m³`
  if (T >= t.Tc) {
    return {
      pressureKpa: pressure(m.residual, T, rhoMol) / 1000, chargeG, densityKgM3, phase: 'supercritical',
      note: `Above the critical temperature (${fmtC(t.Tc - K0)}) ${m.d} is a single phase, so the standing pressure tracks the charge (${fill}).`,
    }
  }
  const { pDew, rhoV } = dewState(m, T)
  if (rhoMol <= rhoV) {
    return {
      pressureKpa: pressure(m.residual, T, rhoMol) / 1000, chargeG, densityKgM3, phase: 'gas',
      saturationPressureKpa: pDew / 1000,
      note: `All gas at ${fmtC(T - K0)}: the standing pressure tracks the charge (${fill}).`,
    }
  }
  const warm = dewPointOfIsochore(m, rhoMol)
  const base = `Liquid is present at ${fmtC(T - K0)}: the pressure is the ${m.blend ? 'dew ' : ''}saturation pressure (${fmtKpa(pDew / 1000)}). It only shows that liquid is there and says nothing about how much refrigerant is in the system.`
  const advice = warm !== undefined
    ? ` To judge the charge from pressure, warm the stage above ${fmtC(Math.ceil(warm * 10) / 10)} (where this fill becomes all gas) before reading, or recover and weigh the charge.`
    : ` The fill density is above the critical density (${(t.rhoc * M).toFixed(0)} kg/m³): warming would fill the volume with liquid and raise the pressure steeply. Do not warm it; recover and weigh the charge.`
  return {
    pressureKpa: pDew / 1000, chargeG, densityKgM3, phase: 'two-phase', note: base + advice,
    saturationPressureKpa: pDew / 1000, ...(warm !== undefined ? { warmAboveC: warm } : {}),
  }
}

/** Standing pressure (absolute kPa) of a known charge (g) in a known internal volume (L) at ambient (°C). */
export function standingPressureFromCharge(i: { designation: Designation; ambientC: number; volumeL: number; chargeG: number }): StandingResult {
  const m = fluidModel(i.designation)
  const T = stateT(m, i.ambientC)
  positive(i.volumeL, 'Volume (L)')
  positive(i.chargeG, 'Charge (g)', true)
  return standingAt(m, T, i.chargeG / i.volumeL / m.residual.M, i.volumeL)
}

/**
 * Charge (g) implied by a standing pressure (absolute kPa) in a known volume at ambient. The gas branch
 * inverts the EOS by Newton (not p ∝ m). At or above the saturation pressure liquid is present and the
 * charge cannot be told from pressure: chargeG is then the minimum (saturated vapour filling the volume).
 */
export function chargeFromStandingPressure(i: { designation: Designation; ambientC: number; volumeL: number; pressureKpa: number }): StandingResult {
  const m = fluidModel(i.designation)
  const T = stateT(m, i.ambientC)
  positive(i.volumeL, 'Volume (L)')
  positive(i.pressureKpa, 'Pressure (kPa, absolute)')
  const p = i.pressureKpa * 1000
  if (p > m.pmax) throw new OutOfRangeError(`${m.d}: pressure above the equation of state's limit ${fmtKpa(m.pmax / 1000)}.`)
  const t = m.sat()
  if (T < t.Tc) {
    const { pDew, rhoV } = dewState(m, T)
    if (p >= pDew) {
      const min = standingAt(m, T, rhoV, i.volumeL)
      const high = p > pDew * 1.03
        ? ` The reading is clearly above the saturation pressure (${fmtKpa(pDew / 1000)}): suspect air or another gas in the system, a different refrigerant or a gauge error.`
        : ''
      return {
        ...min, pressureKpa: i.pressureKpa, phase: 'two-phase', saturationPressureKpa: pDew / 1000,
        note: `At or above the saturation pressure at ${fmtC(T - K0)}: liquid is present, so the charge cannot be told from pressure. It is at least ${min.chargeG.toFixed(0)} g (saturated vapour filling ${i.volumeL} L).${high} Warm the stage until the pressure falls below the saturation line, or recover and weigh the charge.`,
      }
    }
    const rho = vaporDensity(m.residual, T, p)
    return { ...standingAt(m, T, rho, i.volumeL), pressureKpa: i.pressureKpa }
  }
  return { ...standingAt(m, T, gasMolarDensity(m, T, p), i.volumeL), pressureKpa: i.pressureKpa }
}

/**
 * Isochoric shift: the density at a reference reading (pressure, ambient) carried to a new ambient.
 * The volume is unknown here, so chargeG is 0 (not NaN, to stay JSON-safe); densityKgM3 is the charge per
 * litre of internal volume. If the reference reading was at saturation the density is only a lower bound.
 */
export function shiftStandingPressure(i: { designation: Designation; referencePressureKpa: number; referenceAmbientC: number; ambientC: number }): StandingResult & { referenceDensityKgM3: number } {
  const ref = chargeFromStandingPressure({ designation: i.designation, ambientC: i.referenceAmbientC, volumeL: 1, pressureKpa: i.referencePressureKpa })
  const m = fluidModel(i.designation)
  const T = stateT(m, i.ambientC)
  const now = standingAt(m, T, ref.densityKgM3 / m.residual.M, 1)
  const caveat = ref.phase === 'two-phase'
    ? `The reference reading was at saturation, so the density (${ref.densityKgM3.toFixed(1)} kg/m³) is only a lower bound${T > i.referenceAmbientC + K0 ? ' and the pressure at the new ambient may be higher' : ''}. `
    : ''
  return { ...now, chargeG: 0, referenceDensityKgM3: ref.densityKgM3, note: caveat + now.note }
}
