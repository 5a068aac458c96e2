/**
 * Readings from an operating state: what a technician would read on a unit whose saturated suction
 * and condensing temperatures, superheat, subcooling, current and remaining charge are known. Pressures
 * come from the property module's saturation curves and standing-charge solver, so the readings are
 * physically consistent; they are shown in the chosen units (gauge ones against the site's own
 * atmosphere), rounded as a gauge is read, and optionally disturbed by instrument noise from a seeded
 * generator. The scenario suite and the demo history are built with it; exercises can be too.
 *
 * Healthy references (common practice, no source): the cabinet coil evaporates about 10 K below the
 * cabinet (12 K for the wall-bonded coils of cascade freezers); an air-cooled condenser condenses about
 * 15 K above the air entering it; each side of a cascade heat exchanger is about 5 K from it; superheat
 * 5–8 K at a single-stage or high-stage compressor, tens of kelvin at a cascade low-stage compressor fed
 * through suction heat exchangers; subcooling 3–6 K; running current 80–90 % of rated.
 */
import {
  atmosphericPressureAtAltitude,
  findRefrigerant,
  fromKpaAbs,
  isDesignation,
  saturationPressure,
  standingPressureFromCharge,
  type Designation,
  type PressureUnit,
} from '#shared/utils/properties'
import type { Quantity, Reading, Stage, UnitKind } from '#shared/types/diagnosis'
import { CASCADE_HX_APPROACH_K, EVAPORATOR_TD_K, AIR_CONDENSER_TD_K } from './stage-facts'

export interface StageState {
  /** Saturated suction and condensing temperatures, °C, of the refrigerant actually in the stage. */
  sst?: number
  sct?: number
  superheat?: number
  subcooling?: number
  dischargeSuperheat?: number
  currentPct?: number
  /** Evaporator probe, °C. */
  evaporator?: number
  /** Reported running state; readings given without it imply a running compressor. */
  running?: boolean
  /** Standing pressure: share of the nameplate charge left, or a pressure in kPa abs. */
  standingFraction?: number
  standingKpa?: number
  /** Refrigerant actually in the stage when it is not the nameplate one. */
  actual?: Designation
  /** A mixed charge: the other refrigerant and its mole share (Raoult's law for the pressure, an approximation). */
  mixedWith?: { designation: Designation; share: number }
  /** Readings not taken. */
  omit?: Quantity[]
}

export interface UnitState {
  cabinet?: number
  /** null: no setpoint reading; undefined: the design cabinet temperature is read as the setpoint. */
  setpoint?: number | null
  ambient?: number
  airIn?: number
  airOut?: number
  cascadeHx?: number
  runtime?: number
  high?: StageState
  low?: StageState
  single?: StageState
}

export interface Presentation {
  pressure?: PressureUnit
  temperature?: 'C' | 'F' | 'K'
  altitudeM?: number
  /** Seed for instrument noise (gauge ±1 %, probes ±0.5 K, clamp ±3 %); none when absent. */
  noiseSeed?: number
}

/** What the state needs to know of the unit: its kind, design and stages. */
export interface UnitShape {
  kind: UnitKind
  design: { cabinetC?: number | null; cascadeHxC?: number | null }
  stages: { stage: Stage; refrigerant: string; chargeG?: number | null; volumeL?: number | null; ratedCurrentA?: number | null }[]
}

// ------------------------------------------------------------------ healthy states

const AIR_RISE_K = 8
const airStage = (sst: number, airC: number): StageState => ({ sst, sct: airC + AIR_CONDENSER_TD_K, superheat: 7, subcooling: 4, dischargeSuperheat: 45, currentPct: 85, running: true })
const cascadeLow = (sst: number, hx: number): StageState => ({ sst, sct: hx + CASCADE_HX_APPROACH_K, superheat: 45, subcooling: 3, dischargeSuperheat: 75, currentPct: 85, running: true })

/** Healthy running state at the design cabinet temperature in a room at `ambient` °C (condenser air-in = room). */
export function healthyState(unit: UnitShape, ambient = 22): UnitState {
  const cabinet = unit.design.cabinetC ?? (unit.kind === 'cascade' ? -80 : -20)
  if (unit.kind === 'cascade') {
    const hx = unit.design.cascadeHxC ?? -30
    return {
      cabinet,
      ambient,
      airIn: ambient,
      airOut: ambient + AIR_RISE_K,
      cascadeHx: hx,
      high: airStage(hx - CASCADE_HX_APPROACH_K, ambient),
      low: cascadeLow(cabinet - EVAPORATOR_TD_K.cascade, hx),
    }
  }
  return { cabinet, ambient, airIn: ambient, airOut: ambient + AIR_RISE_K, single: airStage(cabinet - EVAPORATOR_TD_K.single, ambient) }
}

type StageChange = Partial<StageState> | null
export type StateChange = Partial<Omit<UnitState, 'high' | 'low' | 'single'>> & { high?: StageChange; low?: StageChange; single?: StageChange }

/** A copy of `base` with the change merged (a stage given as null is removed). */
export function withState(base: UnitState, change: StateChange): UnitState {
  const out: UnitState = { ...base }
  for (const key of Object.keys(change) as (keyof StateChange)[]) {
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
export const STOPPED_STAGE: Partial<StageState> = {
  running: false,
  currentPct: 0,
  sst: undefined,
  sct: undefined,
  superheat: undefined,
  subcooling: undefined,
  dischargeSuperheat: undefined,
}

// ------------------------------------------------------------------ noise

function mulberry32(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) | 0
    let t = Math.imul(a ^ (a >>> 15), 1 | a)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

function gaussian(rand: () => number): number {
  const u = Math.max(rand(), 1e-12)
  const v = rand()
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v)
}

// ------------------------------------------------------------------ readings

/** Gauge reading steps: a technician reads psig to half a psi, bar to 0.05, MPa to 0.005. */
const PRESSURE_STEP: Record<PressureUnit, number> = { kPa: 1, kPag: 1, bar: 0.05, barg: 0.05, psia: 0.5, psig: 0.5, MPa: 0.005 }

const roundTo = (x: number, step: number) => Math.round(Math.round(x / step) * step * 1e6) / 1e6

function mixturePressure(base: Designation, mix: StageState['mixedWith'], tC: number, side: 'dew' | 'bubble'): number {
  const own = side === 'dew' ? saturationPressure(base, tC).dewKpa : saturationPressure(base, tC).bubbleKpa
  if (!mix) return own
  const other = saturationPressure(mix.designation, tC)
  return (1 - mix.share) * own + mix.share * (side === 'dew' ? other.dewKpa : other.bubbleKpa)
}

/** Bubble temperature at a pressure, by bisection on the saturation curve. */
function bubbleAt(d: Designation, pKpa: number): number {
  let lo = -180
  let hi = 90
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2
    let p: number
    try {
      p = saturationPressure(d, mid).bubbleKpa
    } catch {
      p = mid < 0 ? 0 : Infinity
    }
    if (p < pKpa) lo = mid
    else hi = mid
  }
  return (lo + hi) / 2
}

function standingKpa(config: UnitShape['stages'][number], d: Designation, st: StageState, ambient?: number): number | undefined {
  if (st.standingKpa !== undefined) return st.standingKpa
  if (st.standingFraction === undefined || ambient === undefined) return undefined
  if (config.chargeG && config.volumeL) {
    const at = (designation: Designation) =>
      standingPressureFromCharge({ designation, ambientC: ambient, volumeL: config.volumeL as number, chargeG: (config.chargeG as number) * (st.standingFraction as number) }).pressureKpa
    return st.mixedWith ? (1 - st.mixedWith.share) * at(d) + st.mixedWith.share * at(st.mixedWith.designation) : at(d)
  }
  // A two-phase charge stands at its saturation pressure at room temperature while liquid is left.
  return mixturePressure(d, st.mixedWith, ambient, 'bubble')
}

/** Below the critical temperature a condensing temperature can be read as a pressure; above it there is none. */
function condensable(d: Designation, tC: number): boolean {
  const tc = findRefrigerant(d)?.criticalTemperatureC
  return tc === undefined || tC < tc - 0.5
}

/** A saturation temperature the property tables cover; outside them no pressure can be shown. */
function withinTables(d: Designation, tC: number): boolean {
  try {
    saturationPressure(d, tC)
    return true
  } catch {
    return false
  }
}

/** The readings a technician would take on a unit in `state`, in the units of `show`. */
export function readingsForState(unit: UnitShape, state: UnitState, show: Presentation = {}): Reading[] {
  const pUnit = show.pressure ?? 'kPa'
  const tUnit = show.temperature ?? 'C'
  const atm = show.altitudeM !== undefined ? atmosphericPressureAtAltitude(show.altitudeM) : 101.325
  const rand = show.noiseSeed !== undefined ? mulberry32(show.noiseSeed) : undefined
  const noisy = (x: number, sd: number) => (rand ? x + gaussian(rand) * sd : x)
  const readings: Reading[] = []
  const temp = (quantity: Quantity, c: number, stage?: Stage, sd = 0.5) => {
    const v = noisy(c, sd)
    const shown = tUnit === 'C' ? roundTo(v, 0.1) : tUnit === 'K' ? roundTo(v + 273.15, 0.1) : roundTo((v * 9) / 5 + 32, 1)
    readings.push(stage ? { quantity, stage, value: shown, unit: tUnit } : { quantity, value: shown, unit: tUnit })
  }
  const pressure = (quantity: Quantity, stage: Stage, kpa: number) => {
    const v = noisy(kpa, 0.01 * kpa)
    readings.push({ quantity, stage, value: roundTo(fromKpaAbs(v, pUnit, atm), PRESSURE_STEP[pUnit]), unit: pUnit })
  }
  if (state.ambient !== undefined) temp('ambientTemperature', state.ambient)
  if (state.cabinet !== undefined) temp('cabinetTemperature', state.cabinet)
  const setpoint = state.setpoint === undefined ? unit.design.cabinetC : state.setpoint
  if (setpoint !== null && setpoint !== undefined) temp('setpointTemperature', setpoint, undefined, 0)
  if (state.cascadeHx !== undefined && unit.kind === 'cascade') temp('cascadeHxTemperature', state.cascadeHx)
  if (state.airIn !== undefined) temp('condenserAirInTemperature', state.airIn)
  if (state.airOut !== undefined) temp('condenserAirOutTemperature', state.airOut)
  if (state.runtime !== undefined) readings.push({ quantity: 'runtime', value: state.runtime, unit: 'min' })
  for (const config of unit.stages) {
    const st = state[config.stage]
    if (!st) continue
    const d = st.actual ?? config.refrigerant
    if (!isDesignation(d)) continue
    const omit = new Set(st.omit ?? [])
    const take = (q: Quantity) => !omit.has(q)
    if (st.running !== undefined && take('compressorRunning')) readings.push({ quantity: 'compressorRunning', stage: config.stage, value: st.running, unit: 'bool' })
    if (st.sst !== undefined && withinTables(d, st.sst)) {
      if (take('suctionPressure')) pressure('suctionPressure', config.stage, mixturePressure(d, st.mixedWith, st.sst, 'dew'))
      if (st.superheat !== undefined && take('suctionTemperature')) temp('suctionTemperature', st.sst + st.superheat, config.stage, 0.7)
    }
    if (st.sct !== undefined && condensable(d, st.sct) && withinTables(d, st.sct)) {
      const pd = mixturePressure(d, st.mixedWith, st.sct, 'dew')
      if (take('dischargePressure')) pressure('dischargePressure', config.stage, pd)
      if (st.subcooling !== undefined && take('liquidLineTemperature')) temp('liquidLineTemperature', bubbleAt(d, pd) - st.subcooling, config.stage, 0.7)
      if (st.dischargeSuperheat !== undefined && take('dischargeTemperature')) temp('dischargeTemperature', st.sct + st.dischargeSuperheat, config.stage, 1)
    }
    if (st.evaporator !== undefined && take('evaporatorTemperature')) temp('evaporatorTemperature', st.evaporator, config.stage, 0.7)
    if (st.currentPct !== undefined && take('compressorCurrent') && config.ratedCurrentA) {
      const amps = noisy((config.ratedCurrentA * st.currentPct) / 100, (0.03 * config.ratedCurrentA * st.currentPct) / 100)
      readings.push({ quantity: 'compressorCurrent', stage: config.stage, value: roundTo(Math.max(0, amps), 0.1), unit: 'A' })
    }
    const standing = standingKpa(config, d, st, state.ambient)
    if (standing !== undefined && take('standingPressure')) pressure('standingPressure', config.stage, standing)
  }
  return readings
}
