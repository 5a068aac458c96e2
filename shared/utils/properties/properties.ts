/** Public saturation and gas-state functions (°C, absolute kPa, kg/m³). */
import { pressure, supercriticalDensity, vaporDensity } from './eos'
import { fmtC, fmtKpa, OutOfRangeError } from './errors'
import type { Designation } from './fluids'
import { fluidModel, type FluidModel } from './model'
import { tOf, uOf, type SatTable } from './saturation'

const K0 = 273.15

/** Temperature in K checked against the saturation range [Tmin, Tc]. */
function satT(m: FluidModel, t: SatTable, temperatureC: number): number {
  const T = temperatureC + K0
  if (!Number.isFinite(T) || T < t.Tmin - 1e-9 || T > t.Tc + 1e-9) {
    throw new OutOfRangeError(`${m.d} saturation is defined from ${fmtC(t.Tmin - K0)} to ${fmtC(t.Tc - K0)}; got ${Number.isFinite(T) ? fmtC(temperatureC) : String(temperatureC)}.`, { minC: t.Tmin - K0, maxC: t.Tc - K0, minKpa: t.pMin / 1000, maxKpa: t.pc / 1000 })
  }
  return Math.min(Math.max(T, t.Tmin), t.Tc)
}

/**
 * ln p (Pa) checked against the saturation pressure range. Readings within 0.01 % outside the ends (far
 * below any gauge's accuracy, e.g. a rounded triple-point pressure) are clamped onto the range.
 */
function satLnP(m: FluidModel, t: SatTable, pressureKpa: number): number {
  const p = pressureKpa * 1000
  if (!Number.isFinite(p) || p < t.pMin * (1 - 1e-4) || p > t.pc * (1 + 1e-4)) {
    throw new OutOfRangeError(`${m.d} saturation is defined from ${fmtKpa(t.pMin / 1000)} to ${fmtKpa(t.pc / 1000)} (${fmtC(t.Tmin - K0)} to ${fmtC(t.Tc - K0)}); got ${Number.isFinite(p) ? fmtKpa(pressureKpa) : String(pressureKpa)}.`, { minC: t.Tmin - K0, maxC: t.Tc - K0, minKpa: t.pMin / 1000, maxKpa: t.pc / 1000 })
  }
  return Math.log(Math.min(Math.max(p, t.pMin), t.pc))
}

/** Saturation pressures (absolute kPa) at a temperature (°C). Pure fluids: bubble == dew. */
export function saturationPressure(d: Designation, temperatureC: number): { bubbleKpa: number; dewKpa: number } {
  const m = fluidModel(d)
  const t = m.sat()
  const u = uOf(t, satT(m, t, temperatureC))
  const bubbleKpa = Math.exp(t.lnPb.at(u)) / 1000
  return { bubbleKpa, dewKpa: m.blend ? Math.exp(t.lnPd.at(u)) / 1000 : bubbleKpa }
}

/** Saturation temperatures (°C) at an absolute pressure (kPa). Pure fluids: bubble == dew. */
export function saturationTemperature(d: Designation, pressureKpa: number): { bubbleC: number; dewC: number } {
  const m = fluidModel(d)
  const t = m.sat()
  const lnp = satLnP(m, t, pressureKpa)
  const bubbleC = tOf(t, t.lnPb.inverse(lnp)) - K0
  return { bubbleC, dewC: m.blend ? tOf(t, t.lnPd.inverse(lnp)) - K0 : bubbleC }
}

/** Temperature glide (dew − bubble, K) at an absolute pressure; 0 for pure fluids. */
export function glideK(d: Designation, pressureKpa: number): number {
  const s = saturationTemperature(d, pressureKpa)
  return s.dewC - s.bubbleC
}

/** Check a single-phase temperature (K) against the EOS range. */
export function stateT(m: FluidModel, temperatureC: number): number {
  const T = temperatureC + K0
  if (!Number.isFinite(T) || T < m.Tmin - 1e-9 || T > m.Tmax) {
    throw new OutOfRangeError(`${m.d} properties are defined from ${fmtC(m.Tmin - K0)} to ${fmtC(m.Tmax - K0)}; got ${Number.isFinite(T) ? fmtC(temperatureC) : String(temperatureC)}.`, { minC: m.Tmin - K0, maxC: m.Tmax - K0, maxKpa: m.pmax / 1000 })
  }
  return T
}

/** Dew-point pressure (Pa) and saturated-vapour molar density at T (K) below Tc. */
export function dewState(m: FluidModel, T: number): { pDew: number; rhoV: number } {
  const t = m.sat()
  const u = uOf(t, T)
  return { pDew: Math.exp(t.lnPd.at(u)), rhoV: Math.exp(t.lnRhoV.at(u)) }
}

/** Gas (vapour or supercritical) density, mol/m³, at T (K) and p (Pa); throws if (T, p) is not a gas state. */
export function gasMolarDensity(m: FluidModel, T: number, p: number): number {
  const t = m.sat()
  if (T < t.Tc) {
    const { pDew, rhoV } = dewState(m, T)
    if (p > pDew * (1 + 1e-9)) {
      throw new OutOfRangeError(`${m.d} at ${fmtC(T - K0)} is a gas only up to ${fmtKpa(pDew / 1000)} (its dew pressure); at ${fmtKpa(p / 1000)} it is liquid or two-phase.`, { minC: T - K0, maxC: T - K0, minKpa: 0, maxKpa: pDew / 1000 })
    }
    const rho = vaporDensity(m.residual, T, p)
    // At the dew point itself the EOS root and the tabulated saturated vapour agree; guard against the
    // pseudo-pure EOS placing its own dew point a hair below the ancillary's.
    return Number.isFinite(rho) ? rho : rhoV
  }
  return supercriticalDensity(m.residual, T, p)
}

/** Gas density (kg/m³) at temperature (°C) and absolute pressure (kPa); throws OutOfRangeError for liquid states. */
export function gasDensity(d: Designation, temperatureC: number, pressureKpa: number): number {
  const m = fluidModel(d)
  const T = stateT(m, temperatureC)
  const p = pressureKpa * 1000
  if (!Number.isFinite(p) || p <= 0 || p > m.pmax) {
    throw new OutOfRangeError(`${d} gas density needs a pressure above 0 kPa and up to ${fmtKpa(m.pmax / 1000)}; got ${String(pressureKpa)} kPa.`, { minC: m.Tmin - K0, maxC: m.Tmax - K0, minKpa: 0, maxKpa: m.pmax / 1000 })
  }
  return gasMolarDensity(m, T, p) * m.residual.M
}

/**
 * Pressure (absolute kPa) from temperature (°C) and density (kg/m³): the single-phase EOS value.
 * Inside the two-phase dome this is not a physical pressure; use standingPressureFromCharge for a charged system.
 */
export function pressureFromDensity(d: Designation, temperatureC: number, densityKgM3: number): number {
  const m = fluidModel(d)
  const T = stateT(m, temperatureC)
  if (!Number.isFinite(densityKgM3) || densityKgM3 < 0) {
    throw new OutOfRangeError(`Density must be a finite number ≥ 0 kg/m³; got ${String(densityKgM3)}.`, { minC: m.Tmin - K0, maxC: m.Tmax - K0 })
  }
  return pressure(m.residual, T, densityKgM3 / m.residual.M) / 1000
}

/**
 * Saturated-liquid density (kg/m³) at a temperature (°C) below the critical point: the bubble-point liquid
 * for blends. The liquid-volume basis of a charge substitution compares fluids with it.
 */
export function saturatedLiquidDensity(d: Designation, temperatureC: number): number {
  const m = fluidModel(d)
  const t = m.sat()
  const u = uOf(t, satT(m, t, temperatureC))
  return Math.exp(t.lnRhoL.at(u)) * m.residual.M
}
