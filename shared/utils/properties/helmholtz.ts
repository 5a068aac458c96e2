/**
 * Residual Helmholtz energy αʳ(δ, τ) of a reference equation of state and the derivatives we need:
 * pressure, dp/dρ and fugacity need δ-derivatives; the Clapeyron slope and mixture fugacities need τ·∂αʳ/∂τ.
 * All derivatives are analytic (term forms as in CoolProp 8.0.0's fluid files, which follow the EOS papers).
 */

/** nᵢ δ^dᵢ τ^tᵢ, times exp(−δ^lᵢ) when lᵢ > 0. */
export interface PowerTerms { type: 'power'; n: number[]; d: number[]; t: number[]; l: number[] }
/** nᵢ δ^dᵢ τ^tᵢ exp(−gᵢ δ^lᵢ). */
export interface ExponentialTerms { type: 'exponential'; n: number[]; d: number[]; t: number[]; g: number[]; l: number[] }
/** nᵢ δ^dᵢ τ^tᵢ exp(−ηᵢ(δ−εᵢ)² − βᵢ(τ−γᵢ)²). */
export interface GaussianTerms { type: 'gaussian'; n: number[]; d: number[]; t: number[]; eta: number[]; epsilon: number[]; beta: number[]; gamma: number[] }
/** Gao et al. 2020 (ammonia): nᵢ τ^tᵢ δ^dᵢ exp(ηᵢ(δ−εᵢ)² + 1/(βᵢ(τ−γᵢ)² + bᵢ)). */
export interface GaoBTerms { type: 'gaoB'; n: number[]; d: number[]; t: number[]; eta: number[]; epsilon: number[]; beta: number[]; gamma: number[]; b: number[] }
/** Span & Wagner 1996 non-analytic critical terms: nᵢ Δ^bᵢ δ ψ. */
export interface NonAnalyticTerms { type: 'nonAnalytic'; n: number[]; a: number[]; b: number[]; beta: number[]; A: number[]; B: number[]; C: number[]; D: number[] }
export type TermGroup = PowerTerms | ExponentialTerms | GaussianTerms | GaoBTerms | NonAnalyticTerms

/** Ancillary equation: pressure forms p = p_r exp((T_r/T)? Σ nθ^t); rhoLnoexp ρ = ρ_r(1 + Σ nθ^t); rhoV ρ = ρ_r exp((T_r/T)? Σ nθ^t). */
export interface Ancillary { form: 'p' | 'rhoLnoexp' | 'rhoV'; Tr: number; reducing: number; n: number[]; t: number[]; usingTauR: boolean; Tmin: number; Tmax: number }

/** Coefficients of one fluid's reference EOS as stored in data/*.ts (SI molar units). */
export interface EosData {
  designation: string
  /** Paper and distribution the coefficients come from. */
  source: string
  R: number // J/(mol K)
  M: number // kg/mol
  Tr: number // reducing temperature, K
  rhor: number // reducing density, mol/m³
  Ttriple: number // K
  Tmax: number // upper temperature limit of the EOS, K
  pmax: number // upper pressure limit of the EOS, Pa
  /** Critical point of this EOS (computed once from ∂p/∂ρ = ∂²p/∂ρ² = 0, or the pseudo-critical point of a pseudo-pure fluid). */
  crit: { T: number; p: number; rho: number }
  terms: TermGroup[]
  anc: { pS?: Ancillary; pL?: Ancillary; pV?: Ancillary; rhoL: Ancillary; rhoV: Ancillary }
}

/**
 * Flattened, evaluation-ready form. Every analytic term is written as
 * n δ^d τ^t exp(−c δ^l − η(δ−ε)²) · T(τ), with T(τ) = exp(−β(τ−γ)²) or, for Gao's terms, exp(1/(β(τ−γ)²+b)).
 */
export interface CompiledEos {
  data: EosData
  count: number
  n: Float64Array; d: Float64Array; t: Float64Array; c: Float64Array; l: Float64Array
  eta: Float64Array; eps: Float64Array; beta: Float64Array; gamma: Float64Array; bGao: Float64Array
  na: NonAnalyticTerms | null
  /** τ-dependent factor n τ^t T(τ) and τ∂ln/∂τ, cached for the last τ (density solves run at fixed T). */
  lastTau: number
  tauFactor: Float64Array
  tauLog: Float64Array
  /**
   * Speed-ups for the common case of integer exponents on δ: powers of δ by table, and one exp(−c δ^l)
   * per distinct (c, l) instead of one per term. `group[i]` is −1 for terms without such a factor.
   */
  maxPow: number
  powers: Float64Array
  group: Int32Array
  groupC: Float64Array
  groupL: Float64Array
  groupExp: Float64Array
}

/** Build the flattened evaluator from EOS data. */
export function compileEos(data: EosData): CompiledEos {
  const rows: number[][] = [] // n d t c l eta eps beta gamma bGao
  let na: NonAnalyticTerms | null = null
  for (const g of data.terms) {
    for (let i = 0; i < g.n.length; i++) {
      switch (g.type) {
        case 'power': rows.push([g.n[i]!, g.d[i]!, g.t[i]!, g.l[i]! > 0 ? 1 : 0, g.l[i]!, 0, 0, 0, 0, 0]); break
        case 'exponential': rows.push([g.n[i]!, g.d[i]!, g.t[i]!, g.g[i]!, g.l[i]!, 0, 0, 0, 0, 0]); break
        case 'gaussian': rows.push([g.n[i]!, g.d[i]!, g.t[i]!, 0, 0, g.eta[i]!, g.epsilon[i]!, g.beta[i]!, g.gamma[i]!, 0]); break
        // Gao's form has exp(+η(δ−ε)²): store −η so one formula serves both.
        case 'gaoB': rows.push([g.n[i]!, g.d[i]!, g.t[i]!, 0, 0, -g.eta[i]!, g.epsilon[i]!, g.beta[i]!, g.gamma[i]!, g.b[i]!]); break
        case 'nonAnalytic': na = g; break
      }
    }
  }
  const col = (k: number) => Float64Array.from(rows, (r) => r[k]!)
  const small = (x: number) => Number.isInteger(x) && x >= 0 && x <= 24
  const integral = rows.every((r) => small(r[1]!) && (r[3] === 0 || small(r[4]!)))
  const keys: string[] = []
  const group = Int32Array.from(rows, (r) => {
    if (!integral || r[3] === 0) return -1
    const key = `${r[3]}:${r[4]}`
    if (!keys.includes(key)) keys.push(key)
    return keys.indexOf(key)
  })
  const maxPow = integral ? Math.max(0, ...rows.map((r) => Math.max(r[1]!, r[3] === 0 ? 0 : r[4]!))) : -1
  return {
    data, count: rows.length,
    n: col(0), d: col(1), t: col(2), c: col(3), l: col(4), eta: col(5), eps: col(6), beta: col(7), gamma: col(8), bGao: col(9),
    na, lastTau: NaN, tauFactor: new Float64Array(rows.length), tauLog: new Float64Array(rows.length),
    maxPow, powers: new Float64Array(maxPow + 1), group,
    groupC: Float64Array.from(keys, (k) => Number(k.split(':')[0])), groupL: Float64Array.from(keys, (k) => Number(k.split(':')[1])),
    groupExp: new Float64Array(keys.length),
  }
}

function updateTau(e: CompiledEos, tau: number): void {
  if (tau === e.lastTau) return
  for (let i = 0; i < e.count; i++) {
    const beta = e.beta[i]!
    let f = e.n[i]! * Math.pow(tau, e.t[i]!)
    let lg = e.t[i]!
    if (beta !== 0) {
      const dt = tau - e.gamma[i]!
      const b = e.bGao[i]!
      if (b !== 0) {
        const den = beta * dt * dt + b
        f *= Math.exp(1 / den)
        lg -= (tau * 2 * beta * dt) / (den * den)
      } else {
        f *= Math.exp(-beta * dt * dt)
        lg -= 2 * beta * tau * dt
      }
    }
    e.tauFactor[i] = f
    e.tauLog[i] = lg
  }
  e.lastTau = tau
}

/**
 * Evaluate αʳ and derivatives at (τ, δ) into out (length 5):
 * out[0] = αʳ, out[1] = δ αʳ_δ, out[2] = δ² αʳ_δδ, out[3] = τ αʳ_τ, out[4] = δτ αʳ_δτ.
 * The last one gives the slope of an isochore, (∂p/∂T)_ρ = ρR(1 + δαʳ_δ − δταʳ_δτ).
 */
export function alphar(e: CompiledEos, tau: number, delta: number, out: Float64Array): Float64Array {
  updateTau(e, tau)
  const table = e.maxPow >= 0
  if (table) {
    const pw = e.powers
    pw[0] = 1
    for (let k = 1; k <= e.maxPow; k++) pw[k] = pw[k - 1]! * delta
    for (let g = 0; g < e.groupExp.length; g++) e.groupExp[g] = Math.exp(-e.groupC[g]! * pw[e.groupL[g]!]!)
  }
  let a = 0, a1 = 0, a2 = 0, at = 0, adt = 0
  for (let i = 0; i < e.count; i++) {
    const d = e.d[i]!, c = e.c[i]!, eta = e.eta[i]!
    let arg = 0, du = d, du2 = -d // δ·(ln term)_δ and δ²·(ln term)_δδ
    let factor = e.tauFactor[i]! * (d === 0 ? 1 : table ? e.powers[d]! : Math.pow(delta, d))
    if (c !== 0) {
      const l = e.l[i]!
      const g = e.group[i]!
      const dl = g >= 0 ? e.powers[l]! : Math.pow(delta, l)
      if (g >= 0) factor *= e.groupExp[g]!
      else arg -= c * dl
      du -= c * l * dl
      du2 -= c * l * (l - 1) * dl
    }
    if (eta !== 0) {
      const dd = delta - e.eps[i]!
      arg -= eta * dd * dd
      du -= 2 * eta * delta * dd
      du2 -= 2 * eta * delta * delta
    }
    let term = factor
    if (arg !== 0) term *= Math.exp(arg)
    a += term
    a1 += term * du
    a2 += term * (du * du + du2)
    at += term * e.tauLog[i]!
    adt += term * du * e.tauLog[i]!
  }
  if (e.na) {
    const r = nonAnalytic(e.na, tau, delta)
    a += r[0]; a1 += r[1]; a2 += r[2]; at += r[3]
    // τ∂/∂τ of the non-analytic terms' δαʳ_δ by a central difference: only carbon dioxide has them.
    const h = 1e-6 * tau
    adt += (tau * (nonAnalytic(e.na, tau + h, delta)[1] - nonAnalytic(e.na, tau - h, delta)[1])) / (2 * h)
  }
  out[0] = a; out[1] = a1; out[2] = a2; out[3] = at; out[4] = adt
  return out
}

/** Span & Wagner 1996 (Table 32) derivatives of the non-analytic terms; returns [α, δα_δ, δ²α_δδ, τα_τ]. */
function nonAnalytic(g: NonAnalyticTerms, tau: number, deltaIn: number): [number, number, number, number] {
  // The derivatives contain 1/(δ−1): step off the singular point by a negligible amount.
  const delta = deltaIn === 1 ? 1 + 1e-10 : deltaIn
  const dm = delta - 1
  const dm2 = dm * dm
  let a = 0, a1 = 0, a2 = 0, at = 0
  for (let i = 0; i < g.n.length; i++) {
    const n = g.n[i]!, A = g.A[i]!, B = g.B[i]!, C = g.C[i]!, D = g.D[i]!, ai = g.a[i]!, bi = g.b[i]!, be = g.beta[i]!
    const theta = 1 - tau + A * Math.pow(dm2, 1 / (2 * be))
    const Delta = theta * theta + B * Math.pow(dm2, ai)
    const psi = Math.exp(-C * dm2 - D * (tau - 1) * (tau - 1))
    const psiD = -2 * C * dm * psi
    const psiDD = (2 * C * dm2 - 1) * 2 * C * psi
    const dD = dm * (A * theta * (2 / be) * Math.pow(dm2, 1 / (2 * be) - 1) + 2 * B * ai * Math.pow(dm2, ai - 1))
    const dDD = dD / dm + dm2 * (4 * B * ai * (ai - 1) * Math.pow(dm2, ai - 2)
      + 2 * A * A * (1 / be) ** 2 * Math.pow(Math.pow(dm2, 1 / (2 * be) - 1), 2)
      + A * theta * (4 / be) * (1 / (2 * be) - 1) * Math.pow(dm2, 1 / (2 * be) - 2))
    const Db = Math.pow(Delta, bi)
    const DbD = bi * Math.pow(Delta, bi - 1) * dD
    const DbDD = bi * (Math.pow(Delta, bi - 1) * dDD + (bi - 1) * Math.pow(Delta, bi - 2) * dD * dD)
    a += n * Db * delta * psi
    a1 += delta * n * (Db * (psi + delta * psiD) + DbD * delta * psi)
    a2 += delta * delta * n * (Db * (2 * psiD + delta * psiDD) + 2 * DbD * (psi + delta * psiD) + DbDD * delta * psi)
    const DbT = -2 * theta * bi * Math.pow(Delta, bi - 1)
    const psiT = -2 * D * (tau - 1) * psi
    at += tau * n * delta * (DbT * psi + Db * psiT)
  }
  return [a, a1, a2, at]
}

/** Evaluate an ancillary equation at T (K): pressure in Pa or density in mol/m³. */
export function ancillary(a: Ancillary, T: number): number {
  const theta = Math.max(0, 1 - T / a.Tr)
  let s = 0
  for (let i = 0; i < a.n.length; i++) s += a.n[i]! * Math.pow(theta, a.t[i]!)
  if (a.form === 'rhoLnoexp') return a.reducing * (1 + s)
  return a.reducing * Math.exp(a.usingTauR ? (a.Tr / T) * s : s)
}
