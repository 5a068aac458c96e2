/**
 * Healthy running states of the suite's unit types, at their design cabinet temperature and the room
 * given. Scenarios start from these and change what their fault changes.
 *
 * Healthy references (common practice, no source): the cabinet coil evaporates about 10 K below the
 * cabinet (12 K for the wall-bonded coils of cascade freezers); an air-cooled condenser condenses
 * about 15 K above the air entering it; each side of a cascade heat exchanger is about 5 K from it;
 * superheat 5–8 K at a single-stage or high-stage compressor, tens of kelvin at a cascade low-stage
 * compressor fed through suction heat exchangers; subcooling 3–6 K; running current 80–90 % of rated.
 */
import type { StageState, UnitName, UnitState } from './builder'
import { UNITS } from './builder'

const airStage = (sst: number, airC: number): StageState => ({ sst, sct: airC + 15, superheat: 7, subcooling: 4, dischargeSuperheat: 45, currentPct: 85, running: true })
const cascadeLow = (sst: number, hx: number): StageState => ({ sst, sct: hx + 5, superheat: 45, subcooling: 3, dischargeSuperheat: 75, currentPct: 85, running: true })

/** Healthy state of a unit in a room at `ambient` °C, condenser air-in = room. */
export function healthy(name: UnitName, ambient = 22): UnitState {
  const unit = UNITS[name]
  const cabinet = unit.design.cabinetC
  const airRise = 8
  if (unit.kind === 'cascade') {
    const hx = unit.design.cascadeHxC as number
    return {
      cabinet,
      ambient,
      airIn: ambient,
      airOut: ambient + airRise,
      cascadeHx: hx,
      high: airStage(hx - 5, ambient),
      low: cascadeLow(cabinet - 12, hx),
    }
  }
  return { cabinet, ambient, airIn: ambient, airOut: ambient + airRise, single: airStage(cabinet - 10, ambient) }
}

/** A copy of `base` with stage states merged (a stage given as null is removed). */
export function withState(base: UnitState, change: Partial<Omit<UnitState, 'high' | 'low' | 'single'>> & { high?: Partial<StageState> | null; low?: Partial<StageState> | null; single?: Partial<StageState> | null }): UnitState {
  const out: UnitState = { ...base }
  for (const key of Object.keys(change) as (keyof typeof change)[]) {
    const v = change[key]
    if (key === 'high' || key === 'low' || key === 'single') {
      if (v === null) delete out[key]
      else out[key] = { ...(base[key] ?? {}), ...(v as Partial<StageState>) }
    } else {
      ;(out as Record<string, unknown>)[key] = v
    }
  }
  return out
}

/** A stopped stage: no running readings, compressor off at 0 A. */
export const stopped: Partial<StageState> = {
  running: false,
  currentPct: 0,
  sst: undefined,
  sct: undefined,
  superheat: undefined,
  subcooling: undefined,
  dischargeSuperheat: undefined,
}
