/**
 * Per-fluid model registry. Residual models and saturation tables are built lazily on first use
 * (a few ms per fluid; ~0.1 s for R508B, whose table needs mixture phase equilibria) and cached.
 */
import { r508bModel, pseudoPureNodes } from './blends'
import { EOS_DATA } from './data/index'
import { pureResidual, type Residual } from './eos'
import { DESIGNATIONS, R508B_TMIN, infoOf, type Designation, type RefrigerantInfo } from './fluids'
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
  const m = d === 'R508B' ? makeR508B(info) : makePure(d, info)
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

function makeR508B(info: RefrigerantInfo): FluidModel {
  const r23 = EOS_DATA.R23!, r116 = EOS_DATA.R116!
  const m = r508bModel(r23, r116)
  // 80 nodes: each needs two mixture VLE solves; Hermite interpolation keeps ~1e-6 relative accuracy.
  const sat = lazy(() => buildTable(m.crit, m.Tmin, m.nodes, 80, 3, false))
  const residual = m.residual
  return { d: 'R508B', info, residual, Tmin: R508B_TMIN, Tmax: Math.min(r23.Tmax, r116.Tmax), pmax: Math.min(r23.pmax, r116.pmax), blend: true, sat }
}
