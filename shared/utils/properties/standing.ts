/**
 * Standing charge: a system switched off and equalised at ambient temperature is a fixed mass in a fixed
 * volume, i.e. a point on an isochore. Fill density = charge / internal volume (g/L = kg/m³).
 * - Ambient ≥ Tc: one supercritical phase; pressure from the EOS.
 * - Fill density ≤ saturated (dew) vapour density at ambient: all gas; pressure from the EOS.
 * - Fill density ≥ saturated (bubble) liquid density: liquid-full; compressed-liquid pressure from the EOS,
 *   far above the saturation pressure and rising steeply with temperature.
 * - Otherwise liquid and vapour: the pressure is the saturation (dew) pressure and says nothing about
 *   the charge.
 */
import { liquidDensity, pressureAndIsochoricSlope, vaporDensity } from './eos'
import { fmtC, fmtKpa, OutOfRangeError } from './errors'
import type { Designation } from './fluids'
import { fluidModel, type FluidModel } from './model'
import { dewState, gasMolarDensity, stateT } from './properties'
import { tOf, uOf } from './saturation'

export type StandingPhase = 'gas' | 'two-phase' | 'liquid' | 'supercritical'

/** What a stage above its critical temperature shows instead of a saturation temperature. */
export const ABOVE_CRITICAL_AT_AMBIENT = 'above critical at ambient: its standing pressure measures the charge'

export interface StandingResult {
  pressureKpa: number
  chargeG: number
  densityKgM3: number
  phase: StandingPhase
  note: string
  /** Dangers at this fill (liquid-full, far above the critical pressure), loudest first. */
  warnings: string[]
  /** How much the standing pressure rises per kelvin of ambient at this fill, kPa/K. */
  kpaPerK: number
  saturationPressureKpa?: number
  /** Saturated (bubble-point) liquid density at ambient: a fill at or above it is liquid-full. */
  saturatedLiquidDensityKgM3?: number
  warmAboveC?: number
  /** For a two-phase fill denser than the critical density: the ambient at which its liquid fills the volume. */
  liquidFullAboveC?: number
}

const K0 = 273.15
/**
 * A standing reading this far above the saturation pressure cannot be put down to the gauge and the
 * thermometer (1 K of ambient moves a saturation pressure by 2–4 %): common practice, no source.
 */
export const ABOVE_SATURATION_MARGIN = 1.03

function positive(v: number, what: string, allowZero = false): void {
  if (!Number.isFinite(v) || v < 0 || (!allowZero && v === 0)) {
    throw new OutOfRangeError(`${what} must be a finite number ${allowZero ? '≥' : '>'} 0; got ${String(v)}.`)
  }
}

/** Saturated-liquid (bubble) molar density at T (K) below Tc, from the saturation table. */
export function bubbleLiquidDensity(m: FluidModel, T: number): number {
  const t = m.sat()
  return Math.exp(t.lnRhoL.at(uOf(t, T)))
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

/** The T (°C) at which the saturated liquid density falls to ρ (> ρc): the liquid then fills the volume. */
function bubblePointOfIsochore(m: FluidModel, rhoMol: number): number | undefined {
  const t = m.sat()
  if (rhoMol <= t.rhoc) return undefined
  // ln ρ' rises with u (colder is denser); bisection on u keeps this independent of the column's inverse.
  let lo = 0, hi = Math.sqrt(1 - t.Tmin / t.Tc)
  const target = Math.log(rhoMol)
  if (t.lnRhoL.at(hi) < target) return undefined
  for (let k = 0; k < 50; k++) {
    const mid = (lo + hi) / 2
    if (t.lnRhoL.at(mid) < target) lo = mid
    else hi = mid
  }
  return tOf(t, (lo + hi) / 2) - K0
}

/**
 * Pressure (Pa) on the isochore ρ at T (K), in whichever phase the fill is there, with the isochore's slope
 * (Pa/K): analytic from the EOS in one phase, along the saturation curve while liquid and vapour coexist.
 */
function isochoreState(m: FluidModel, T: number, rhoMol: number): { p: number; dpdT: number } {
  const t = m.sat()
  if (T < t.Tc) {
    const { pDew, rhoV } = dewState(m, T)
    if (rhoMol > rhoV) {
      const pBubble = Math.exp(t.lnPb.at(uOf(t, T)))
      if (rhoMol < bubbleLiquidDensity(m, T)) return { p: pDew, dpdT: saturationSlope(m, T) }
      const [p, dpdT] = pressureAndIsochoricSlope(m.residual, T, rhoMol)
      return { p: Math.max(p, pBubble), dpdT }
    }
  }
  const [p, dpdT] = pressureAndIsochoricSlope(m.residual, T, rhoMol)
  return { p, dpdT }
}

/** Slope of the (dew) saturation curve at T below Tc, Pa/K, from the table by a small difference. */
function saturationSlope(m: FluidModel, T: number): number {
  const t = m.sat()
  const h = Math.min(0.01, Math.max(1e-6, (t.Tc - T) / 2))
  return (Math.exp(t.lnPd.at(uOf(t, T + h))) - Math.exp(t.lnPd.at(uOf(t, T)))) / h
}

function liquidFullWarning(m: FluidModel, T: number, densityKgM3: number, rhoLKgM3: number, pKpa: number, pSatKpa: number, kpaPerK: number): string {
  return `LIQUID-FULL: ${densityKgM3.toFixed(1)} kg/m³ is denser than saturated liquid ${m.d} at ${fmtC(T - K0)} (${rhoLKgM3.toFixed(1)} kg/m³). `
    + `The stage is full of liquid and stands at about ${fmtKpa(pKpa)} abs, not at its saturation pressure (${fmtKpa(pSatKpa)}), `
    + `and every kelvin warmer adds about ${fmtKpa(kpaPerK)}. A liquid-full stage can burst or lift its relief valve as it warms: `
    + `add no refrigerant, keep heat away, and recover refrigerant into a rated cylinder until the pressure falls to the saturation pressure, following local codes.`
}

/** State at ambient T (K) for a molar fill density; the core of both standing-charge directions. */
function standingAt(m: FluidModel, T: number, rhoMol: number, volumeL: number): StandingResult {
  const M = m.residual.M
  const densityKgM3 = rhoMol * M
  const chargeG = densityKgM3 * volumeL
  const t = m.sat()
  const fill = `fill density ${densityKgM3.toFixed(1)} kg/m³`
  if (T >= t.Tc) {
    const [p, dpdT] = pressureAndIsochoricSlope(m.residual, T, rhoMol)
    const pressureKpa = p / 1000, kpaPerK = dpdT / 1000
    const warnings = pressureKpa > t.pc / 1000
      ? [`${fmtKpa(pressureKpa)} abs is above ${m.d}'s critical pressure (${fmtKpa(t.pc / 1000)}): far more than a stage normally holds at standstill, rising about ${fmtKpa(kpaPerK)} per kelvin. Check the charge and the volume, and compare with the stage's design pressure.`]
      : []
    return {
      pressureKpa, chargeG, densityKgM3, phase: 'supercritical', warnings, kpaPerK,
      note: `${m.d} is ${ABOVE_CRITICAL_AT_AMBIENT} (critical temperature ${fmtC(t.Tc - K0)}; ${fill}).`,
    }
  }
  const { pDew, rhoV } = dewState(m, T)
  if (rhoMol <= rhoV) {
    const [p, dpdT] = pressureAndIsochoricSlope(m.residual, T, rhoMol)
    return {
      pressureKpa: p / 1000, chargeG, densityKgM3, phase: 'gas', warnings: [], kpaPerK: dpdT / 1000,
      saturationPressureKpa: pDew / 1000,
      note: `All gas at ${fmtC(T - K0)}: the standing pressure tracks the charge (${fill}).`,
    }
  }
  const rhoL = bubbleLiquidDensity(m, T)
  const pBubble = Math.exp(t.lnPb.at(uOf(t, T)))
  const saturatedLiquidDensityKgM3 = rhoL * M
  if (rhoMol >= rhoL) {
    const [p, dpdT] = pressureAndIsochoricSlope(m.residual, T, rhoMol)
    const pressureKpa = Math.max(p, pBubble) / 1000, kpaPerK = dpdT / 1000
    return {
      pressureKpa, chargeG, densityKgM3, phase: 'liquid', kpaPerK, saturationPressureKpa: pBubble / 1000, saturatedLiquidDensityKgM3,
      warnings: [liquidFullWarning(m, T, densityKgM3, saturatedLiquidDensityKgM3, pressureKpa, pBubble / 1000, kpaPerK)],
      note: `Liquid-full at ${fmtC(T - K0)}: the pressure is the compressed-liquid pressure of the equation of state, not a saturation pressure (${fill}).`,
    }
  }
  const warm = dewPointOfIsochore(m, rhoMol)
  const liquidFull = bubblePointOfIsochore(m, rhoMol)
  const base = `Liquid is present at ${fmtC(T - K0)}: the pressure is the ${m.blend ? 'dew ' : ''}saturation pressure (${fmtKpa(pDew / 1000)}). It only shows that liquid is there and says nothing about how much refrigerant is in the system.`
  const advice = warm !== undefined
    ? ` To judge the charge from pressure, warm the stage above ${fmtC(Math.ceil(warm * 10) / 10)} (where this fill becomes all gas) before reading, or recover and weigh the charge.`
    : ` The fill density is above the critical density (${(t.rhoc * M).toFixed(0)} kg/m³): warming would fill the volume with liquid and raise the pressure steeply. Do not warm it; recover and weigh the charge.`
  const warnings = liquidFull !== undefined
    ? [`Near liquid-full: at ${fmtC(liquidFull)} ambient the liquid would fill the whole volume and the pressure would then rise steeply. Keep the stage cool and recover refrigerant down to the planned charge.`]
    : []
  return {
    pressureKpa: pDew / 1000, chargeG, densityKgM3, phase: 'two-phase', note: base + advice, warnings, kpaPerK: saturationSlope(m, T) / 1000,
    saturationPressureKpa: pDew / 1000, saturatedLiquidDensityKgM3,
    ...(warm !== undefined ? { warmAboveC: warm } : {}),
    ...(liquidFull !== undefined ? { liquidFullAboveC: liquidFull } : {}),
  }
}

/**
 * A typing slip (1000 g in 1 L of ethylene) sends the equation of state far past the pressures it was
 * fitted to, where it still returns a number (GPa). Refuse such fills, naming the valid range.
 */
export function assertWithinEos(designation: Designation, r: Pick<StandingResult, 'pressureKpa' | 'densityKgM3'>, ambientC: number): void {
  const m = fluidModel(designation)
  const maxKpa = m.pmax / 1000
  if (!Number.isFinite(r.densityKgM3) || !Number.isFinite(r.pressureKpa) || r.pressureKpa > maxKpa) {
    const t = m.sat()
    throw new OutOfRangeError(`${designation}: this fill would stand above ${fmtKpa(maxKpa)} at ${fmtC(ambientC)}, beyond the range of its equation of state (0 to ${fmtKpa(maxKpa)}). Check the charge and the volume.`, { minC: t.Tmin - K0, maxC: t.Tc - K0, minKpa: 0, maxKpa })
  }
}

/**
 * The states a fluid's equation of state covers: from its lowest temperature (the triple point of a
 * pure fluid, the fitted range of a blend) to its highest, and pressures up to its limit. A state
 * outside these is not one the refrigerant can be in as far as its reference equation knows.
 */
export function eosLimits(designation: Designation): { minC: number; maxC: number; maxKpa: number } {
  const m = fluidModel(designation)
  return { minC: m.Tmin - K0, maxC: m.Tmax - K0, maxKpa: m.pmax / 1000 }
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
 * inverts the EOS by Newton (not p ∝ m). At or just above the saturation pressure liquid is present and the
 * charge cannot be told from pressure: chargeG is then the minimum (saturated vapour filling the volume).
 * Clearly above it, the only state of the pure refrigerant is compressed liquid filling the volume.
 */
export function chargeFromStandingPressure(i: { designation: Designation; ambientC: number; volumeL: number; pressureKpa: number }): StandingResult {
  const m = fluidModel(i.designation)
  const T = stateT(m, i.ambientC)
  positive(i.volumeL, 'Volume (L)')
  positive(i.pressureKpa, 'Pressure (kPa, absolute)')
  const p = i.pressureKpa * 1000
  if (p > m.pmax) throw new OutOfRangeError(`${m.d}: pressure above the equation of state's limit ${fmtKpa(m.pmax / 1000)}.`, { minC: m.Tmin - K0, maxC: m.Tmax - K0, minKpa: 0, maxKpa: m.pmax / 1000 })
  const t = m.sat()
  if (T < t.Tc) {
    const { pDew, rhoV } = dewState(m, T)
    const pBubble = Math.exp(t.lnPb.at(uOf(t, T)))
    if (p > pBubble * ABOVE_SATURATION_MARGIN) return liquidFromPressure(m, T, p, pBubble, i)
    if (p >= pDew) {
      const min = standingAt(m, T, rhoV, i.volumeL)
      return {
        ...min, pressureKpa: i.pressureKpa, phase: 'two-phase', saturationPressureKpa: pDew / 1000, warnings: [],
        note: `At the saturation pressure at ${fmtC(T - K0)}: liquid is present, so the charge cannot be told from pressure. It is at least ${min.chargeG.toFixed(0)} g (saturated vapour filling ${i.volumeL} L). Warm the stage until the pressure falls below the saturation line, or recover and weigh the charge.`,
      }
    }
    const rho = vaporDensity(m.residual, T, p)
    return { ...standingAt(m, T, rho, i.volumeL), pressureKpa: i.pressureKpa }
  }
  return { ...standingAt(m, T, gasMolarDensity(m, T, p), i.volumeL), pressureKpa: i.pressureKpa }
}

/** A reading clearly above the saturation pressure: liquid-full if the stage holds only this refrigerant. */
function liquidFromPressure(m: FluidModel, T: number, p: number, pBubble: number, i: { volumeL: number; pressureKpa: number }): StandingResult {
  const rho = liquidDensity(m.residual, T, p, bubbleLiquidDensity(m, T) * 1.001)
  if (!Number.isFinite(rho)) {
    throw new OutOfRangeError(`${m.d} at ${fmtC(T - K0)}: no liquid state of the equation of state stands at ${fmtKpa(p / 1000)}.`, { minC: m.Tmin - K0, maxC: m.Tmax - K0, minKpa: 0, maxKpa: m.pmax / 1000 })
  }
  const r = standingAt(m, T, rho, i.volumeL)
  const other = `A reading ${((p / pBubble - 1) * 100).toFixed(0)} % above the saturation pressure (${fmtKpa(pBubble / 1000)}) is more than gauge and thermometer error. `
    + `If the stage holds only ${m.d}, it is liquid-full and holds about ${r.chargeG.toFixed(0)} g. Air or another gas in the system, a different refrigerant or a wrong ambient reading also raise the pressure: check them, and treat the stage as liquid-full until they are ruled out.`
  return { ...r, pressureKpa: i.pressureKpa, warnings: [other, ...r.warnings] }
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

/** Highest ambient the design-pressure search looks at: far above any plant room or summer van (°C). */
export const AMBIENT_SEARCH_LIMIT_C = 100

/**
 * The ambient (°C) at which a fill of `densityKgM3` reaches `pressureKpa` (absolute) on warming, searched from
 * `fromC` up to 100 °C (or the top of the EOS range); undefined if it does not get there. Pressure along an
 * isochore rises with temperature in every phase, so a bracketing search finds it.
 */
export function ambientAtStandingPressure(designation: Designation, densityKgM3: number, pressureKpa: number, fromC: number): number | undefined {
  const m = fluidModel(designation)
  const rho = densityKgM3 / m.residual.M
  const target = pressureKpa * 1000
  let lo = stateT(m, fromC)
  let hi = Math.min(m.Tmax, AMBIENT_SEARCH_LIMIT_C + K0)
  let s = isochoreState(m, lo, rho)
  if (s.p >= target) return lo - K0
  if (hi <= lo || isochoreState(m, hi, rho).p < target) return undefined
  // Newton on the isochore's own slope, kept inside the bracket (bisection when a step leaves it): an
  // isochore is close to straight, so a few evaluations reach a millikelvin.
  let T = lo
  for (let k = 0; k < 60; k++) {
    let next = s.dpdT > 0 ? T + (target - s.p) / s.dpdT : NaN
    if (!(next > lo && next < hi)) next = (lo + hi) / 2
    s = isochoreState(m, next, rho)
    if (s.p < target) lo = next
    else hi = next
    if (Math.abs(next - T) < 1e-4 || hi - lo < 1e-4) return next - K0
    T = next
  }
  return T - K0
}
