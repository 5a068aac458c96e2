/**
 * Blends.
 *
 * R404A, R507A, R410A: Lemmon's (2003) pseudo-pure EOS gives density; its published bubble (pL) and dew (pV)
 * equations give the bubble and dew curves, as the paper intends.
 *
 * R508B (R23/R116 46/54 mass %) and R503 (R23/R13 40.1/59.9 mass %) have no pseudo-pure EOS. We use the
 * multi-fluid mixture model of
 * Kunz & Wagner (GERG-2004/2008) without a departure function:
 *   αʳ(δ, τ, x) = Σ xᵢ αʳᵢ(δ, τ),  δ = ρ/ρr(x), τ = Tr(x)/T,
 * with the components' reference EOS (Penoncello et al. 2003 for R23, Lemmon & Span 2006 for R116, Platzer
 * et al. 1990 for R13) and Kunz–Wagner reducing functions whose pair parameters (βT, γT; βv = γv = 1) were
 * fitted to VLE data by Bell & Lemmon 2016 (see MIXTURES below). Bubble and dew points are full vapour–liquid equilibria
 * (equal fugacities, successive substitution). The interaction parameters carry the azeotrope (pressures
 * above both components'); expect ~1 % on pressure and a few tenths of a kelvin on temperature.
 */
import { liquidDensity, vaporDensity, type Residual } from './eos'
import { alphar, ancillary, compileEos, type CompiledEos, type EosData } from './helmholtz'
import { criticalPoint, type SatNode } from './saturation'

/**
 * Node function for a pseudo-pure blend: bubble/dew from the ancillaries, dew vapour and bubble liquid
 * densities from the EOS at those pressures.
 */
export function pseudoPureNodes(e: Residual, data: EosData): (T: number) => SatNode {
  const { pL, pV } = data.anc
  if (!pL || !pV) throw new Error(`${data.designation}: pseudo-pure fluid needs pL and pV equations`)
  let lastRho: number | undefined, lastRhoL: number | undefined
  return (T) => {
    const pDew = ancillary(pV, T)
    const pBubble = ancillary(pL, T)
    const rhoVapor = vaporDensity(e, T, pDew, lastRho)
    const rhoLiquid = liquidDensity(e, T, pBubble, lastRhoL)
    lastRho = rhoVapor
    if (Number.isFinite(rhoLiquid)) lastRhoL = rhoLiquid
    return { pBubble, pDew, rhoVapor, rhoLiquid }
  }
}

/** Kunz–Wagner reducing-function parameters for the ordered pair (component 0, component 1). */
export interface BinaryParams { betaT: number; gammaT: number; betaV: number; gammaV: number }

/** Binary mixture described by the multi-fluid model above. */
export class BinaryMixture {
  readonly comps: CompiledEos[]
  readonly data: EosData[]
  readonly R: number

  constructor(components: [EosData, EosData], readonly k: BinaryParams) {
    this.data = components
    this.comps = components.map(compileEos)
    this.R = components[0].R
  }

  /** Mole fractions from mass fractions. */
  moleFractions(mass: number[]): number[] {
    return normalise(mass.map((w, i) => w / this.data[i]!.M))
  }

  /** Kunz–Wagner reducing temperature and molar volume at composition x. */
  private trvr(x: number[]): [number, number] {
    const [a, b] = this.data as [EosData, EosData]
    const x0 = x[0]!, x1 = x[1]!
    const { betaT, gammaT, betaV, gammaV } = this.k
    const fT = (2 * x0 * x1 * betaT * gammaT * (x0 + x1)) / (betaT * betaT * x0 + x1)
    const fV = (2 * x0 * x1 * betaV * gammaV * (x0 + x1)) / (betaV * betaV * x0 + x1)
    const v0 = 1 / a.rhor, v1 = 1 / b.rhor
    const Tr = x0 * x0 * a.Tr + x1 * x1 * b.Tr + fT * Math.sqrt(a.Tr * b.Tr)
    const vr = x0 * x0 * v0 + x1 * x1 * v1 + (fV * (Math.cbrt(v0) + Math.cbrt(v1)) ** 3) / 8
    return [Tr, vr]
  }

  /** Reducing functions and their mole-number derivatives n∂Tr/∂nᵢ, n∂vr/∂nᵢ (central differences; they are smooth rational functions). */
  reducing(x: number[]): { Tr: number; vr: number; nT: number[]; nv: number[] } {
    const [Tr, vr] = this.trvr(x)
    const eps = 1e-6
    const nT: number[] = [], nv: number[] = []
    x.forEach((_, i) => {
      const up = this.trvr(normalise(x.map((v, k) => v + (k === i ? eps : 0))))
      const dn = this.trvr(normalise(x.map((v, k) => v - (k === i ? eps : 0))))
      nT.push((up[0] - dn[0]) / (2 * eps))
      nv.push((up[1] - dn[1]) / (2 * eps))
    })
    return { Tr, vr, nT, nv }
  }

  /** Residual model at fixed composition x (for density and pressure). */
  residual(x: number[]): Residual {
    const { Tr, vr } = this.reducing(x)
    const tmp = new Float64Array(5)
    const M = x.reduce((s, xi, i) => s + xi * this.data[i]!.M, 0)
    return {
      R: this.R, M, Tr, rhor: 1 / vr,
      alphar: (tau, delta, out) => {
        out.fill(0)
        this.comps.forEach((c, i) => {
          alphar(c, tau, delta, tmp)
          for (let k = 0; k < 5; k++) out[k]! += x[i]! * tmp[k]!
        })
        return out
      },
      liquidGuess: (T) => {
        let v = 0
        this.data.forEach((d, i) => { v += x[i]! / ancillary(d.anc.rhoL, Math.min(T, d.anc.rhoL.Tmax)) })
        return 1.02 / v
      },
    }
  }

  /** ln φᵢ at (T, ρ) for composition x (Kunz & Wagner 2012, eq. 7.27 without departure terms). */
  lnPhi(x: number[], T: number, rho: number): number[] {
    const { Tr, vr, nT, nv } = this.reducing(x)
    const tau = Tr / T, delta = rho * vr
    const tmp = new Float64Array(5)
    const ai: number[] = []
    let a1 = 0, a3 = 0
    this.comps.forEach((c, i) => {
      alphar(c, tau, delta, tmp)
      ai.push(tmp[0]!)
      a1 += x[i]! * tmp[1]!
      a3 += x[i]! * tmp[3]!
    })
    const lnZ = Math.log(1 + a1)
    return x.map((_, i) => ai[i]! + a1 * (1 + nv[i]! / vr) + a3 * (nT[i]! / Tr) - lnZ)
  }

  /**
   * Bubble (given liquid x) or dew (given vapour y) pressure at T by successive substitution on K = φᴸ/φⱽ.
   * Returns null if it does not converge (near the critical point).
   */
  equilibrium(kind: 'bubble' | 'dew', z: number[], T: number, start?: { p: number; other: number[] }): { p: number; rhoVapor: number; rhoLiquid: number; other: number[] } | null {
    const psat = this.data.map((d) => ancillary(d.anc.pS!, Math.min(T, d.anc.pS!.Tmax)))
    let p = start?.p ?? z.reduce((s, zi, i) => s + zi * psat[i]!, 0) // Raoult's law start
    let other = start?.other ?? z.map((zi, i) => (kind === 'bubble' ? (zi * psat[i]!) / p : zi / psat[i]! * p))
    let rL: number | undefined, rV: number | undefined
    for (let it = 0; it < 300; it++) {
      const x = kind === 'bubble' ? z : normalise(other)
      const y = kind === 'bubble' ? normalise(other) : z
      // Each root starts from the previous iteration's root: 2–3 Newton steps instead of ~10.
      rL = liquidDensity(this.residual(x), T, p, rL)
      rV = vaporDensity(this.residual(y), T, p, rV && rV < rL ? rV : undefined)
      if (!Number.isFinite(rL) || !Number.isFinite(rV) || rL < 1.05 * rV) return null
      const fL = this.lnPhi(x, T, rL), fV = this.lnPhi(y, T, rV)
      const K = fL.map((f, i) => Math.exp(f - fV[i]!))
      if (kind === 'bubble') {
        const S = z.reduce((s, zi, i) => s + zi * K[i]!, 0)
        other = z.map((zi, i) => zi * K[i]!)
        p *= S
        if (Math.abs(S - 1) < 1e-10) return { p, rhoVapor: rV, rhoLiquid: rL, other: normalise(other) }
      } else {
        const S = z.reduce((s, zi, i) => s + zi / K[i]!, 0)
        other = z.map((zi, i) => zi / K[i]!)
        p /= S
        if (Math.abs(S - 1) < 1e-10) return { p, rhoVapor: rV, rhoLiquid: rL, other: normalise(other) }
      }
    }
    return null
  }
}

function normalise(v: number[]): number[] {
  const s = v.reduce((a, b) => a + b, 0)
  return v.map((x) => x / s)
}

/**
 * Kunz–Wagner reducing parameters fitted to experimental VLE data by Bell & Lemmon 2016
 * (J. Chem. Eng. Data, "Automatic fitting of binary interaction parameters for multi-fluid
 * Helmholtz-energy-explicit mixture models"), as distributed in CoolProp 8.0.0's mixture_binary_pairs.json
 * (MIT licence). No departure function (F = 0) for these pairs. The order of the pair matters (βT ≠ 1):
 * component 0 is the file's Name1.
 */
const R116_R23: BinaryParams = { betaT: 0.99695, gammaT: 0.91114, betaV: 1, gammaV: 1 }
const R13_R23: BinaryParams = { betaT: 1.00234, gammaT: 0.93027, betaV: 1, gammaV: 1 }

/** A fixed-composition binary blend computed as a true mixture: its components, mass fractions and pair parameters. */
export interface MixtureRecipe {
  components: [string, string]
  massFractions: [number, number]
  params: BinaryParams
}

/**
 * R508B: R23/R116 46/54 mass %; R503: R23/R13 40.1/59.9 mass % (ASHRAE 34 compositions, from memory).
 * Both are azeotropes whose published pair parameters carry the pressure maximum.
 */
export const MIXTURES: Readonly<Record<string, MixtureRecipe>> = {
  R508B: { components: ['R116', 'R23'], massFractions: [0.54, 0.46], params: R116_R23 },
  R503: { components: ['R13', 'R23'], massFractions: [0.599, 0.401], params: R13_R23 },
}

/** Mixture model: residual for density, pseudo-critical point and node function for the saturation table. */
export function mixtureModel(components: [EosData, EosData], massFractions: [number, number], params: BinaryParams): {
  residual: Residual; crit: { T: number; p: number; rho: number }; Tmin: number; nodes: (T: number) => SatNode | null
} {
  const mix = new BinaryMixture(components, params)
  const x = mix.moleFractions(massFractions)
  const residual = mix.residual(x)
  // The critical point of the fixed-composition model; for a near-azeotrope (glide under 1 K) this is within
  // a few tenths of a kelvin of the true mixture critical point.
  const crit = criticalPoint(residual, residual.Tr, residual.rhor)
  // Nodes are requested cold to hot: start each equilibrium from the previous one, scaled by the
  // pressure ratio of the neighbouring temperature (Clausius–Clapeyron-like continuation).
  let lastB: { p: number; other: number[] } | undefined, lastD: typeof lastB
  let lastT = 0
  const nodes = (T: number): SatNode | null => {
    const guess = (s: typeof lastB): typeof lastB => s && { p: s.p * Math.exp(20 * (1 - lastT / T)), other: s.other }
    const b = mix.equilibrium('bubble', x, T, guess(lastB))
    const d = mix.equilibrium('dew', x, T, guess(lastD))
    if (!b || !d || d.p > b.p * 1.001 || b.p > crit.p) return null
    lastB = b; lastD = d; lastT = T
    // At the bubble point the liquid has the blend's own composition: its density is the liquid root there.
    return { pBubble: b.p, pDew: d.p, rhoVapor: d.rhoVapor, rhoLiquid: b.rhoLiquid }
  }
  // Lower limit: the higher of the components' triple points; below it a component-rich solid could form.
  return { residual, crit, Tmin: Math.max(components[0].Ttriple, components[1].Ttriple), nodes }
}
