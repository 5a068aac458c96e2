/**
 * Saturation curves. Solving phase equilibrium with the EOS on every call is too slow for the UI
 * (~50 µs), so each fluid's curve is solved once, lazily, on a grid and interpolated:
 * nodes are uniform in u = √(1 − T/Tc), which crowds them towards the critical point where the curve
 * bends fastest, and ln p is a smooth, even function of u. Cubic Hermite interpolation with 4th-order
 * finite-difference slopes reproduces the node solutions to ~1e-6 relative; the inverse (T from p)
 * solves the same cubic, so T → p → T round trips are exact to ~1e-10 K.
 */
import { type Residual } from './eos'
import { ancillary, type Ancillary } from './helmholtz'

/** One interpolated column over the u-grid (values must be monotonic in u). */
export class HermiteColumn {
  readonly y: Float64Array
  readonly m: Float64Array // dy/du at the nodes

  constructor(y: Float64Array, readonly h: number, evenAtZero: boolean) {
    this.y = y
    this.m = slopes(y, h, evenAtZero)
  }

  /** Value at u (0 ≤ u ≤ N·h). */
  at(u: number): number {
    const n = this.y.length - 1
    let k = Math.floor(u / this.h)
    if (k >= n) k = n - 1
    if (k < 0) k = 0
    return this.seg(k, u / this.h - k)
  }

  private seg(k: number, t: number): number {
    const h = this.h
    const y0 = this.y[k]!, y1 = this.y[k + 1]!, m0 = this.m[k]! * h, m1 = this.m[k + 1]! * h
    const t2 = t * t, t3 = t2 * t
    return (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * m0 + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * m1
  }

  private segSlope(k: number, t: number): number {
    const h = this.h
    const y0 = this.y[k]!, y1 = this.y[k + 1]!, m0 = this.m[k]! * h, m1 = this.m[k + 1]! * h
    const t2 = t * t
    return (6 * t2 - 6 * t) * y0 + (3 * t2 - 4 * t + 1) * m0 + (-6 * t2 + 6 * t) * y1 + (3 * t2 - 2 * t) * m1
  }

  /** u where the column equals v, for a column that decreases with u; v must lie within [y[N], y[0]]. */
  inverse(v: number): number {
    let lo = 0, hi = this.y.length - 1
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1
      if (this.y[mid]! > v) lo = mid
      else hi = mid
    }
    // Safeguarded Newton on the segment cubic, bracket [0, 1].
    const y0 = this.y[lo]!, y1 = this.y[lo + 1]!
    let a = 0, b = 1
    let t = y0 === y1 ? 0 : (y0 - v) / (y0 - y1)
    for (let i = 0; i < 30; i++) {
      const f = this.seg(lo, t) - v
      if (f > 0) a = t
      else b = t
      const df = this.segSlope(lo, t)
      let tn = df !== 0 ? t - f / df : NaN
      if (!(tn > a && tn < b)) tn = (a + b) / 2
      if (Math.abs(tn - t) < 1e-15) { t = tn; break }
      t = tn
    }
    return (lo + t) * this.h
  }
}

/** 4th-order central differences; at u = 0 an even function is mirrored (slope 0 there). */
function slopes(y: Float64Array, h: number, even: boolean): Float64Array {
  const n = y.length - 1
  const m = new Float64Array(n + 1)
  const v = (k: number): number => (k < 0 ? (even ? y[-k]! : 2 * y[0]! - y[-k]!) : y[k]!)
  for (let k = 0; k <= n; k++) {
    if (k <= n - 2) m[k] = (-v(k + 2) + 8 * v(k + 1) - 8 * v(k - 1) + v(k - 2)) / (12 * h)
    else if (k === n - 1) m[k] = (v(k + 1) - v(k - 1)) / (2 * h)
    else m[k] = (3 * v(k) - 4 * v(k - 1) + v(k - 2)) / (2 * h)
  }
  // Fritsch–Carlson limiter: keeps each cubic monotonic (needed for a unique inverse). It leaves the
  // slopes of smooth monotonic data untouched and only acts next to the critical point.
  for (let k = 0; k < n; k++) {
    const sec = (y[k + 1]! - y[k]!) / h
    if (sec === 0) { m[k] = 0; m[k + 1] = 0; continue }
    if (m[k]! / sec < 0) m[k] = 0
    if (m[k + 1]! / sec < 0) m[k + 1] = 0
    const a = m[k]! / sec, b = m[k + 1]! / sec
    const r = a * a + b * b
    if (r > 9) { const f = 3 / Math.sqrt(r); m[k] = f * a * sec; m[k + 1] = f * b * sec }
  }
  return m
}

/** Bubble and dew pressures (Pa), the molar densities of the dew-point vapour and of the bubble-point liquid at one temperature. */
export interface SatNode { pBubble: number; pDew: number; rhoVapor: number; rhoLiquid: number }

/** A fluid's saturation curve: pressures from the critical point (u = 0) down to Tmin. */
export interface SatTable {
  Tc: number; pc: number; rhoc: number; Tmin: number; h: number
  lnPb: HermiteColumn; lnPd: HermiteColumn; lnRhoV: HermiteColumn
  /** Saturated (bubble-point) liquid density: a fill denser than this at ambient is liquid-full. */
  lnRhoL: HermiteColumn
  /** Lowest valid pressure (Pa) for T-from-p (the dew pressure at Tmin; bubble temperature may then be just below Tmin). */
  pMin: number
}

export const GRID_NODES = 240

/**
 * Tabulate node(T) at GRID_NODES + 1 temperatures from Tc down to Tmin. A node function may return null
 * close to Tc where its solver gives up; those nodes are filled with y(u) = y_c + c u² (ln p is even in u)
 * joining the critical point to the nearest solved node.
 */
export function buildTable(crit: { T: number; p: number; rho: number }, Tmin: number, node: (T: number) => SatNode | null, N = GRID_NODES, extendK = 0, evenAtCrit = true): SatTable {
  // Blends tabulate a few kelvin below Tmin so that at the lowest valid (dew) pressure the bubble
  // temperature, which lies up to one glide lower, is still on the table.
  const h = Math.sqrt(1 - (Tmin - extendK) / crit.T) / N
  const lb = new Float64Array(N + 1), ld = new Float64Array(N + 1), lr = new Float64Array(N + 1), ll = new Float64Array(N + 1)
  lb[0] = ld[0] = Math.log(crit.p)
  lr[0] = ll[0] = Math.log(crit.rho)
  // Cold to hot, so node functions can continue from the previous (converged) solution.
  let kGood = N + 1
  for (let k = N; k >= 1; k--) {
    const u = k * h
    const s = node(crit.T * (1 - u * u))
    if (!s) break
    lb[k] = Math.log(s.pBubble); ld[k] = Math.log(s.pDew); lr[k] = Math.log(s.rhoVapor); ll[k] = Math.log(s.rhoLiquid)
    kGood = k
  }
  if (kGood > N) throw new Error('saturation solver failed at the lowest temperature')
  for (let k = 1; k < kGood; k++) {
    const f = (k / kGood) ** 2
    for (const col of [lb, ld, lr, ll]) col[k] = col[0]! + (col[kGood]! - col[0]!) * f
  }
  // Pressures must fall monotonically from Tc. R404A's published bubble-pressure equation rises ~0.003 %
  // above pc within 2 mK of Tc (a fitting artefact); clamp it flat there.
  for (const col of [lb, ld]) for (let k = 1; k <= N; k++) col[k] = Math.min(col[k]!, col[k - 1]!)
  // Along a pure fluid's EOS curve ln p is even in u (slope 0 at Tc). Blend ancillaries contain θ^t terms with
  // t < 1, which are not, so their columns are extrapolated linearly through u = 0 instead.
  const lnPb = new HermiteColumn(lb, h, evenAtCrit), lnPd = new HermiteColumn(ld, h, evenAtCrit)
  const uMin = Math.sqrt(1 - Tmin / crit.T)
  return {
    Tc: crit.T, pc: crit.p, rhoc: crit.rho, Tmin, h,
    lnPb, lnPd, lnRhoV: new HermiteColumn(lr, h, false), lnRhoL: new HermiteColumn(ll, h, false),
    // Lowest pressure at which both bubble and dew temperatures exist on the table: the dew pressure at Tmin.
    pMin: Math.min(Math.exp(lnPb.at(uMin)), Math.exp(lnPd.at(uMin))),
  }
}

/** u-coordinate of a temperature (K). */
export const uOf = (t: SatTable, T: number): number => Math.sqrt(Math.max(0, 1 - T / t.Tc))
/** Temperature (K) of a u-coordinate. */
export const tOf = (t: SatTable, u: number): number => t.Tc * (1 - u * u)

const sc = new Float64Array(5)

/** Critical point of a (fixed-composition) residual model: (∂p/∂ρ)_T = (∂²p/∂ρ²)_T = 0, Newton with numerical Jacobian. */
export function criticalPoint(e: Residual, T0: number, rho0: number): { T: number; p: number; rho: number } {
  const f1 = (tau: number, d: number): number => { const a = e.alphar(tau, d, sc); return 1 + 2 * a[1]! + a[2]! }
  const f2 = (tau: number, d: number): number => (f1(tau, d + 1e-5) - f1(tau, d - 1e-5)) / 2e-5
  let tau = e.Tr / T0, delta = rho0 / e.rhor
  for (let k = 0; k < 100; k++) {
    const F1 = f1(tau, delta), F2 = f2(tau, delta)
    const h = 1e-6
    const a11 = (f1(tau + h, delta) - F1) / h, a12 = (f1(tau, delta + h) - F1) / h
    const a21 = (f2(tau + h, delta) - F2) / h, a22 = (f2(tau, delta + h) - F2) / h
    const det = a11 * a22 - a12 * a21
    const dTau = (-F1 * a22 + F2 * a12) / det
    const dDelta = (-a11 * F2 + a21 * F1) / det
    tau += Math.max(-0.01, Math.min(0.01, dTau))
    delta += Math.max(-0.05, Math.min(0.05, dDelta))
    if (Math.abs(dTau) < 1e-12 && Math.abs(dDelta) < 1e-10) break
  }
  const T = e.Tr / tau, rho = delta * e.rhor
  const a = e.alphar(tau, delta, sc)
  return { T, rho, p: rho * e.R * T * (1 + a[1]!) }
}
const sc2 = new Float64Array(5)

/**
 * Phase equilibrium of a pure fluid at T by Akasaka's (2008) Newton method: equal
 * J = δ(1 + δαʳ_δ) (pressure) and K = δαʳ_δ + αʳ + ln δ (Gibbs energy) in both phases.
 * Returns null when it does not converge (very close to the critical point).
 */
export function maxwell(e: Residual, T: number, rhoL0: number, rhoV0: number): { rhoL: number; rhoV: number; p: number } | null {
  const tau = e.Tr / T
  let dL = rhoL0 / e.rhor, dV = rhoV0 / e.rhor
  for (let k = 0; k < 100; k++) {
    const aL = e.alphar(tau, dL, sc), aV = e.alphar(tau, dV, sc2)
    const JL = dL * (1 + aL[1]!), JV = dV * (1 + aV[1]!)
    const KL = aL[1]! + aL[0]! + Math.log(dL), KV = aV[1]! + aV[0]! + Math.log(dV)
    const JdL = 1 + 2 * aL[1]! + aL[2]!, JdV = 1 + 2 * aV[1]! + aV[2]!
    const KdL = JdL / dL, KdV = JdV / dV
    const r1 = JV - JL, r2 = KV - KL
    const a = JdV, b = -JdL, c = KdV, d = -KdL
    const det = a * d - b * c
    let stepV = (-r1 * d + b * r2) / det
    let stepL = (-a * r2 + c * r1) / det
    // Keep both densities positive and on their own side.
    if (dV + stepV <= 0) stepV = -0.5 * dV
    if (dL + stepL <= dV + stepV) stepL = 0.5 * (dL - dV)
    dV += stepV
    dL += stepL
    if (!Number.isFinite(dV) || !Number.isFinite(dL)) return null
    if (Math.abs(stepV) < 1e-12 * dV && Math.abs(stepL) < 1e-12 * dL) {
      if (dL / dV < 1.0001) return null // collapsed onto the trivial solution
      const av = e.alphar(tau, dV, sc2)
      return { rhoL: dL * e.rhor, rhoV: dV * e.rhor, p: dV * e.rhor * e.R * T * (1 + av[1]!) }
    }
  }
  return null
}

/**
 * Node function for a pure fluid: Maxwell solution from ancillary guesses; where it fails
 * (within a few mK of Tc) the ancillary pressure, scaled to join the last EOS node, is used.
 */
export function pureNodes(e: Residual, anc: { pS: Ancillary; rhoL: Ancillary; rhoV: Ancillary }): (T: number) => SatNode {
  let scale = 1
  let last: { rhoL: number; rhoV: number; T: number } | null = null
  return (T) => {
    const Ta = Math.min(T, anc.rhoL.Tmax)
    let s = maxwell(e, T, ancillary(anc.rhoL, Ta), ancillary(anc.rhoV, Ta))
    if (!s && last) s = maxwell(e, T, last.rhoL, last.rhoV)
    if (s) {
      scale = s.p / ancillary(anc.pS, T)
      last = { rhoL: s.rhoL, rhoV: s.rhoV, T }
      return { pBubble: s.p, pDew: s.p, rhoVapor: s.rhoV, rhoLiquid: s.rhoL }
    }
    const p = ancillary(anc.pS, T) * scale
    return { pBubble: p, pDew: p, rhoVapor: ancillary(anc.rhoV, T), rhoLiquid: ancillary(anc.rhoL, T) }
  }
}
