/**
 * Per-fluid model registry. Residual models and saturation tables are built lazily on first use
 * (a few ms per fluid; ~0.1 s for R508B and R503, whose tables need mixture phase equilibria) and cached.
 */
import { MIXTURES, mixtureModel, pseudoPureNodes, type MixtureRecipe } from './blends'
import { EOS_DATA } from './data/index'
import { pureResidual, type Residual } from './eos'
import { DESIGNATIONS, MIXTURE_CONSTANTS, infoOf, type Designation, type RefrigerantInfo } from './fluids'
import { buildTable, pureNodes, type SatTable } from './saturation'
import { UnknownRefrigerantError } from './errors'

export interface FluidModel {
  d: Designation
  info: RefrigerantInfo
  residual: Residual
  /** Temperature and pressure limits of the EOS for single-phase states, K and Pa. */
  Tmin: number; Tmax: number; pmax: number
  blend: boolean
  sat(): SatTable
}

const cache = new Map<Designation, FluidModel>()

/** The model for a designation; throws UnknownRefrigerantError for anything else (runtime guard for JS callers). */
export function fluidModel(d: Designation): FluidModel {
  const hit = cache.get(d)
  if (hit) return hit
  const info = infoOf(d)
  if (!info) throw new UnknownRefrigerantError(String(d), DESIGNATIONS)
  const recipe = MIXTURES[d]
  const m = recipe ? makeMixture(d, info, recipe) : makePure(d, info)
  cache.set(d, m)
  return m
}

function lazy<T>(f: () => T): () => T {
  let v: T | undefined
  return () => (v ??= f())
}

function makePure(d: Designation, info: RefrigerantInfo): FluidModel {
  const data = EOS_DATA[d]!
  const residual = pureResidual(data)
  const Tmin = info.validRange.minC + 273.15
  const sat = lazy(() => {
    if (data.anc.pL && data.anc.pV) return buildTable(data.crit, Tmin, pseudoPureNodes(residual, data), undefined, 3, false)
    return buildTable(data.crit, Tmin, pureNodes(residual, { pS: data.anc.pS!, rhoL: data.anc.rhoL, rhoV: data.anc.rhoV }))
  })
  return { d, info, residual, Tmin, Tmax: data.Tmax, pmax: data.pmax, blend: info.kind === 'blend', sat }
}

function makeMixture(d: Designation, info: RefrigerantInfo, recipe: MixtureRecipe): FluidModel {
  const [a, b] = recipe.components.map((c) => EOS_DATA[c]!) as [NonNullable<(typeof EOS_DATA)[string]>, NonNullable<(typeof EOS_DATA)[string]>]
  const m = mixtureModel([a, b], recipe.massFractions, recipe.params)
  const Tmin = MIXTURE_CONSTANTS[d]!.Tmin
  // 80 nodes: each needs two mixture VLE solves; Hermite interpolation keeps ~1e-6 relative accuracy.
  const sat = lazy(() => buildTable(m.crit, Tmin, m.nodes, 80, 3, false))
  return { d, info, residual: m.residual, Tmin, Tmax: Math.min(a.Tmax, b.Tmax), pmax: Math.min(a.pmax, b.pmax), blend: true, sat }
}
