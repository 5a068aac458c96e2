/**
 * Builds rank requests for the scenario suite from the state a technician would describe: saturated
 * temperatures, superheat, subcooling, current as % of rated, the share of the charge left, the
 * cabinet and the room. Pressures come from our property module's saturation curves and standing-
 * charge solver, so every scenario is physically consistent; then they are shown in the units the
 * scenario asks for (psig, bar, MPa…, gauge readings against the site's own atmosphere), rounded the
 * way a gauge is read, and, if asked, disturbed by instrument noise from a seeded generator.
 */
import {
  fromKpaAbs,
  atmosphericPressureAtAltitude,
  saturationPressure,
  standingPressureFromCharge,
  type Designation,
  type PressureUnit,
} from '#shared/utils/properties'
import type { Cause, Quantity, RankRequest, Reading, Stage, StageConfig, Symptom, TestResult, UnitKind } from '#shared/types/diagnosis'
import type { EquipmentClass } from '#shared/types/equipment'

// ------------------------------------------------------------------ units of the suite (invented)

export interface UnitSpec {
  kind: UnitKind
  equipmentClass: EquipmentClass
  stages: (StageConfig & { refrigerant: Designation })[]
  design: { cabinetC: number; cascadeHxC?: number }
}

const cascadeUnit = (equipmentClass: EquipmentClass, cabinetC: number, cascadeHxC: number, high: [Designation, number, number], low: [Designation, number, number, number]): UnitSpec => ({
  kind: 'cascade',
  equipmentClass,
  stages: [
    { stage: 'high', refrigerant: high[0], chargeG: high[1], ratedCurrentA: high[2] },
    { stage: 'low', refrigerant: low[0], chargeG: low[1], volumeL: low[2], ratedCurrentA: low[3] },
  ],
  design: { cabinetC, cascadeHxC },
})
const singleUnit = (equipmentClass: EquipmentClass, cabinetC: number, refrigerant: Designation, chargeG: number, ratedCurrentA: number, volumeL?: number): UnitSpec => ({
  kind: 'single-stage',
  equipmentClass,
  stages: [{ stage: 'single', refrigerant, chargeG, ratedCurrentA, ...(volumeL ? { volumeL } : {}) }],
  design: { cabinetC },
})

/** Unit types of the suite: typical lab and commercial builds, no real model. */
export const UNITS = {
  ultR404aR170: cascadeUnit('ult-freezer', -80, -32, ['R404A', 520, 6.2], ['R170', 210, 9.5, 4.1]),
  ultR290R170: cascadeUnit('ult-freezer', -86, -35, ['R290', 148, 5.4], ['R170', 92, 6.8, 3.6]),
  ultR507aR508b: cascadeUnit('ult-freezer', -80, -30, ['R507A', 600, 6.8], ['R508B', 300, 11, 4.4]),
  ultR134aR23: cascadeUnit('ult-freezer', -80, -30, ['R134a', 700, 6.0], ['R23', 250, 10, 4.0]),
  ultR290R1150: cascadeUnit('ult-freezer', -80, -35, ['R290', 600, 4.0], ['R1150', 250, 9.5, 3.5]),
  trapR404aR1150: cascadeUnit('cold-trap', -100, -38, ['R404A', 400, 5.1], ['R1150', 120, 5.5, 3.2]),
  trapR507aR1150: cascadeUnit('cold-trap', -105, -42, ['R507A', 500, 5.6], ['R1150', 160, 7, 3.4]),
  chamberR404aR23: cascadeUnit('test-chamber', -70, -28, ['R404A', 1800, 14.5], ['R23', 900, 24, 7.8]),
  chamberR134aR744: cascadeUnit('test-chamber', -40, -8, ['R134a', 2500, 9.0], ['R744', 1200, 30, 6.5]),
  chestR290: singleUnit('freezer', -25, 'R290', 145, 2.3),
  freezerR290: singleUnit('freezer', -20, 'R290', 160, 5),
  fridgeR134a: singleUnit('freezer', 5, 'R134a', 180, 1.4),
  coldRoomR404a: singleUnit('cold-room', 2, 'R404A', 6500, 11.5),
  chillerR134a: singleUnit('process-chiller', 10, 'R134a', 4200, 9.8),
  freezerR404a: singleUnit('freezer', -30, 'R404A', 900, 4.2),
} satisfies Record<string, UnitSpec>
export type UnitName = keyof typeof UNITS

// ------------------------------------------------------------------ state

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

export interface Scenario {
  id: string
  title: string
  /** Where the fault signature comes from: a named publication, or "common practice, no source". */
  source: string
  expected: { cause: Cause; stage?: Stage }
  equipmentClass: EquipmentClass
  request: RankRequest
}

export interface ScenarioSpec {
  id: string
  title: string
  source: string
  unit: UnitName
  expected: { cause: Cause; stage?: Stage }
  symptoms?: Symptom[]
  state: UnitState
  tests?: TestResult[]
  show?: Presentation
  /** Changes to the unit record (e.g. no charge or volume known, metering device). */
  unitPatch?: (unit: UnitSpec) => UnitSpec
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

// ------------------------------------------------------------------ building

const PRESSURE_STEP: Record<PressureUnit, number> = { kPa: 1, kPag: 1, bar: 0.05, barg: 0.05, psia: 0.5, psig: 0.5, MPa: 0.005 }

const roundTo = (x: number, step: number) => Math.round(Math.round(x / step) * step * 1e6) / 1e6

function mixturePressure(base: Designation, mix: StageState['mixedWith'], tC: number, side: 'dew' | 'bubble'): number {
  const own = side === 'dew' ? saturationPressure(base, tC).dewKpa : saturationPressure(base, tC).bubbleKpa
  if (!mix) return own
  const other = saturationPressure(mix.designation, tC)
  return (1 - mix.share) * own + mix.share * (side === 'dew' ? other.dewKpa : other.bubbleKpa)
}

export function buildScenario(spec: ScenarioSpec): Scenario {
  const unit = spec.unitPatch ? spec.unitPatch(UNITS[spec.unit]) : UNITS[spec.unit]
  const show = spec.show ?? {}
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
  const s = spec.state
  if (s.ambient !== undefined) temp('ambientTemperature', s.ambient)
  if (s.cabinet !== undefined) temp('cabinetTemperature', s.cabinet)
  if (s.setpoint !== null) temp('setpointTemperature', s.setpoint ?? unit.design.cabinetC, undefined, 0)
  if (s.cascadeHx !== undefined) temp('cascadeHxTemperature', s.cascadeHx)
  if (s.airIn !== undefined) temp('condenserAirInTemperature', s.airIn)
  if (s.airOut !== undefined) temp('condenserAirOutTemperature', s.airOut)
  if (s.runtime !== undefined) readings.push({ quantity: 'runtime', value: s.runtime, unit: 'min' })
  for (const config of unit.stages) {
    const st = s[config.stage]
    if (!st) continue
    const omit = new Set(st.omit ?? [])
    const d = st.actual ?? config.refrigerant
    const take = (q: Quantity) => !omit.has(q)
    if (st.running !== undefined && take('compressorRunning')) readings.push({ quantity: 'compressorRunning', stage: config.stage, value: st.running, unit: 'bool' })
    if (st.sst !== undefined) {
      if (take('suctionPressure')) pressure('suctionPressure', config.stage, mixturePressure(d, st.mixedWith, st.sst, 'dew'))
      if (st.superheat !== undefined && take('suctionTemperature')) temp('suctionTemperature', st.sst + st.superheat, config.stage, 0.7)
    }
    if (st.sct !== undefined) {
      if (take('dischargePressure')) pressure('dischargePressure', config.stage, mixturePressure(d, st.mixedWith, st.sct, 'dew'))
      if (st.subcooling !== undefined && take('liquidLineTemperature')) {
        const pd = mixturePressure(d, st.mixedWith, st.sct, 'dew')
        const bubbleC = bubbleAt(d, pd)
        temp('liquidLineTemperature', bubbleC - st.subcooling, config.stage, 0.7)
      }
      if (st.dischargeSuperheat !== undefined && take('dischargeTemperature')) temp('dischargeTemperature', st.sct + st.dischargeSuperheat, config.stage, 1)
    }
    if (st.evaporator !== undefined && take('evaporatorTemperature')) temp('evaporatorTemperature', st.evaporator, config.stage, 0.7)
    if (st.currentPct !== undefined && take('compressorCurrent') && config.ratedCurrentA) {
      const amps = noisy((config.ratedCurrentA * st.currentPct) / 100, (0.03 * config.ratedCurrentA * st.currentPct) / 100)
      readings.push({ quantity: 'compressorCurrent', stage: config.stage, value: roundTo(Math.max(0, amps), 0.1), unit: 'A' })
    }
    const standing = standingKpa(config, st, s.ambient)
    if (standing !== undefined && take('standingPressure')) pressure('standingPressure', config.stage, standing)
  }
  const request: RankRequest = {
    unit: { kind: unit.kind, stages: unit.stages.map((x) => ({ ...x })), design: { ...unit.design } },
    symptoms: spec.symptoms ?? [],
    readings,
  }
  if (unit.kind !== 'cascade') delete request.unit.design?.cascadeHxC
  if (show.altitudeM !== undefined) request.site = { altitudeM: show.altitudeM }
  if (spec.tests) request.testResults = spec.tests
  return { id: spec.id, title: spec.title, source: spec.source, expected: spec.expected, equipmentClass: unit.equipmentClass, request }
}

/** Bubble temperature at a pressure, by bisection on the saturation curve. */
function bubbleAt(d: Designation, pKpa: number): number {
  let lo = -150
  let hi = 80
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

function standingKpa(config: StageConfig & { refrigerant: Designation }, st: StageState, ambient?: number): number | undefined {
  if (st.standingKpa !== undefined) return st.standingKpa
  if (st.standingFraction === undefined || ambient === undefined) return undefined
  const d = st.actual ?? config.refrigerant
  if (config.chargeG !== undefined && config.volumeL !== undefined) {
    const p = standingPressureFromCharge({ designation: d, ambientC: ambient, volumeL: config.volumeL, chargeG: config.chargeG * st.standingFraction }).pressureKpa
    if (!st.mixedWith) return p
    const other = standingPressureFromCharge({ designation: st.mixedWith.designation, ambientC: ambient, volumeL: config.volumeL, chargeG: config.chargeG * st.standingFraction })
    return (1 - st.mixedWith.share) * p + st.mixedWith.share * other.pressureKpa
  }
  // A two-phase charge stands at its saturation pressure at room temperature while liquid is left.
  return mixturePressure(d, st.mixedWith, ambient, 'bubble')
}
