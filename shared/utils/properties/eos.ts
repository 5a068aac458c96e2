/**
 * Thermodynamic state from a Helmholtz EOS: pressure from (T, ρ) and density roots from (T, p).
 * Internal units: K, Pa, mol/m³.
 */
import { alphar, ancillary, compileEos, type EosData } from './helmholtz'

/** What the state functions need from a (pure, pseudo-pure or mixture) residual Helmholtz model. */
export interface Residual {
  R: number // J/(mol K)
  M: number // kg/mol
  Tr: number // K
  rhor: number // mol/m³
  /** out = [αʳ, δαʳ_δ, δ²αʳ_δδ, ταʳ_τ, δταʳ_δτ] at (τ, δ); out has length 5. */
  alphar(tau: number, delta: number, out: Float64Array): Float64Array
  /** A density on the liquid side of the spinodal at T, used to start liquid-root searches. */
  liquidGuess(T: number): number
}

/** Wrap one fluid's EOS data as a Residual model. */
export function pureResidual(data: EosData): Residual {
  const e = compileEos(data)
  return {
    R: data.R, M: data.M, Tr: data.Tr, rhor: data.rhor,
    alphar: (tau, delta, out) => alphar(e, tau, delta, out),
    liquidGuess: (T) => ancillary(data.anc.rhoL, Math.min(T, data.anc.rhoL.Tmax)) * 1.02,
  }
}

const scratch = new Float64Array(5)

/** Pressure (Pa) at T (K), molar density ρ (mol/m³): p = ρRT(1 + δαʳ_δ). */
export function pressure(e: Residual, T: number, rho: number): number {
  const a = e.alphar(e.Tr / T, rho / e.rhor, scratch)
  return rho * e.R * T * (1 + a[1]!)
}

/** Pressure (Pa) and the slope of the isochore (∂p/∂T)_ρ (Pa/K) at (T, ρ), from one evaluation; single-phase states. */
export function pressureAndIsochoricSlope(e: Residual, T: number, rho: number): [number, number] {
  const a = e.alphar(e.Tr / T, rho / e.rhor, scratch)
  return [rho * e.R * T * (1 + a[1]!), rho * e.R * (1 + a[1]! - a[4]!)]
}

/** Compressibility factor Z = p/(ρRT). */
export function compressibility(e: Residual, T: number, rho: number): number {
  return 1 + e.alphar(e.Tr / T, rho / e.rhor, scratch)[1]!
}

/** Pressure (Pa) and ∂p/∂ρ at constant T. */
export function pressureAndSlope(e: Residual, T: number, rho: number): [number, number] {
  const a = e.alphar(e.Tr / T, rho / e.rhor, scratch)
  const RT = e.R * T
  return [rho * RT * (1 + a[1]!), RT * (1 + 2 * a[1]! + a[2]!)]
}

/**
 * Vapour/gas root of p(T, ρ) = p, Newton from the ideal-gas density.
 * In the gas region p(ρ) is increasing and concave, so Newton from below approaches the root
 * monotonically and cannot jump over the spinodal into the liquid branch. Returns NaN if no gas root exists.
 */
export function vaporDensity(e: Residual, T: number, p: number, rho0?: number): number {
  let rho = rho0 ?? p / (e.R * T)
  for (let k = 0; k < 60; k++) {
    const [pc, dp] = pressureAndSlope(e, T, rho)
    if (!(dp > 0)) {
      rho *= 0.7 // past the vapour spinodal: back off towards the gas side
      continue
    }
    const step = (p - pc) / dp
    rho += step
    if (rho <= 0) rho = (rho - step) * 0.5
    if (Math.abs(step) < 1e-11 * rho) return rho
  }
  return NaN
}

/** Liquid root of p(T, ρ) = p, Newton from a dense starting guess (the rhoL ancillary, raised a little). */
export function liquidDensity(e: Residual, T: number, p: number, rho0?: number): number {
  let rho = rho0 ?? e.liquidGuess(T)
  for (let k = 0; k < 80; k++) {
    const [pc, dp] = pressureAndSlope(e, T, rho)
    if (!(dp > 0)) {
      rho *= 1.05 // inside the unstable loop: move to the liquid side
      continue
    }
    const step = (p - pc) / dp
    rho += Math.max(step, -0.2 * rho)
    if (Math.abs(step) < 1e-11 * rho) return rho
  }
  return NaN
}

/**
 * Density (mol/m³) above the critical temperature, where p(ρ) is monotonic: Newton kept inside a
 * bracket [lo, hi] with bisection fallback, because near Tc the isotherm has an inflection that can
 * make plain Newton overshoot.
 */
export function supercriticalDensity(e: Residual, T: number, p: number): number {
  let lo = 0, hi = Infinity
  let rho = p / (e.R * T)
  for (let k = 0; k < 200; k++) {
    const [pc, dp] = pressureAndSlope(e, T, rho)
    if (pc > p) hi = Math.min(hi, rho)
    else lo = Math.max(lo, rho)
    let next = dp > 0 ? rho + (p - pc) / dp : NaN
    if (!(next > lo && next < hi)) next = Number.isFinite(hi) ? (lo + hi) / 2 : rho * 2
    if (Math.abs(next - rho) < 1e-12 * rho) return next
    rho = next
  }
  return rho
}
