/**
 * Turns a rank request into the flat fact map the rules read (names in fact-vocabulary.ts).
 * Readings are normalised to trade units (kPa absolute, °C, A, min); derived facts come from the
 * property module. Nothing here throws on odd data: contradictions and out-of-range property calls
 * leave the fact out and add a warning, because a half-filled diagnosis is still useful on site.
 */
import * as props from '#shared/utils/properties'
import {
  QUANTITY_DIMENSION,
  SYMPTOMS,
  type PressureReadingUnit,
  type Quantity,
  type RankRequest,
  type Reading,
  type Stage,
  type StageConfig,
  type StageDerived,
  type TemperatureReadingUnit,
} from '#shared/types/diagnosis'

export type FactValue = number | boolean | string
export type Facts = Record<string, FactValue>

export interface DerivedFacts {
  facts: Facts
  warnings: string[]
  derived: Partial<Record<Stage, StageDerived>>
  /** `quantity` or `stage:quantity` for each reading given; lets the engine name missing ones. */
  readingsPresent: Set<string>
}

/** Evaporator-to-cabinet difference of a healthy static or fan coil (common practice, no source). */
export const EVAPORATOR_TD_K = 10
/** Air-cooled condensing temperature above air-in of a healthy, clean condenser (common practice, no source). */
export const AIR_CONDENSER_TD_K = 15
/** Approach on each side of a healthy cascade heat exchanger (common practice, no source). */
export const CASCADE_HX_APPROACH_K = 5
/** Runtime after which a unit that is still far from target counts as stalled (common practice, no source). */
const STALL_RUNTIME_MIN = { cascade: 360, 'single-stage': 180 } as const
const STALL_ABOVE_TARGET_K = 10
/** Refrigerants a stage might have been filled with by mistake; the list is tried against measured pairs. */
export const CANDIDATE_REFRIGERANTS = [
  'R1150', 'R170', 'R14', 'R23', 'R508B', 'R116', 'R290', 'R1270', 'R600a', 'R744',
  'R404A', 'R507A', 'R134a', 'R407C', 'R410A', 'R448A', 'R449A', 'R452A', 'R22',
] as const

type Numbers = Map<string, number | boolean>

class Collector {
  readonly facts: Facts = {}
  readonly warnings: string[] = []
  readonly derived: Partial<Record<Stage, StageDerived>> = {}

  set(name: string, value: FactValue | undefined): void {
    if (value === undefined) return
    if (typeof value === 'number' && !Number.isFinite(value)) return
    this.facts[name] = value
  }

  num(name: string): number | undefined {
    const v = this.facts[name]
    return typeof v === 'number' ? v : undefined
  }

  warn(text: string): void {
    if (!this.warnings.includes(text)) this.warnings.push(text)
  }

  /** Runs a property call; an error (unknown refrigerant, out of range, unit) becomes a warning. */
  attempt<T>(what: string, fn: () => T): T | undefined {
    try {
      const v = fn()
      return typeof v === 'number' && !Number.isFinite(v) ? undefined : v
    } catch (e) {
      this.warn(`${what}: not derived (${(e as Error).message})`)
      return undefined
    }
  }
}

// ------------------------------------------------------------------ readings

function readingKey(r: Pick<Reading, 'quantity' | 'stage'>): string {
  return r.stage ? `${r.stage}:${r.quantity}` : r.quantity
}

function normaliseValue(r: Reading, c: Collector, atmosphericKpa: number): number | boolean | undefined {
  const value = r.value
  if (typeof value === 'boolean') return value
  const dim = QUANTITY_DIMENSION[r.quantity]
  if (dim === 'pressure') {
    const kpa = c.attempt(readingKey(r), () => props.toKpaAbs(value, r.unit as PressureReadingUnit, atmosphericKpa))
    if (kpa !== undefined && kpa <= 0) {
      c.warn(`${readingKey(r)} of ${value} ${r.unit} is at or below absolute zero pressure; reading ignored`)
      return undefined
    }
    return kpa
  }
  if (dim === 'temperature') {
    const celsius = c.attempt(readingKey(r), () => props.toCelsius(value, r.unit as TemperatureReadingUnit))
    if (celsius !== undefined && celsius < -273.15) {
      c.warn(`${readingKey(r)} is below absolute zero; reading ignored`)
      return undefined
    }
    return celsius
  }
  if (value < 0) {
    c.warn(`${readingKey(r)} is negative; reading ignored`)
    return undefined
  }
  return value
}

/** Local atmospheric pressure for gauge readings: given, from the site's altitude (ISO 2533), or 101.325 kPa. */
export function atmosphericPressureOf(request: RankRequest): number {
  if (request.site?.atmosphericKpa !== undefined) return request.site.atmosphericKpa
  if (request.site?.altitudeM !== undefined) return props.atmosphericPressureAtAltitude(request.site.altitudeM)
  return 101.325
}

function normaliseReadings(request: RankRequest, c: Collector): Numbers {
  const out: Numbers = new Map()
  const stages = new Set(request.unit.stages.map((s) => s.stage))
  const atmosphericKpa = atmosphericPressureOf(request)
  for (const r of request.readings ?? []) {
    if (r.stage && !stages.has(r.stage)) {
      c.warn(`${readingKey(r)}: this unit has no ${r.stage} stage; reading ignored`)
      continue
    }
    const value = normaliseValue(r, c, atmosphericKpa)
    if (value === undefined) continue
    if (out.has(readingKey(r))) c.warn(`${readingKey(r)} given more than once; the last value is used`)
    out.set(readingKey(r), value)
  }
  return out
}

function reading(readings: Numbers, quantity: Quantity, stage?: Stage): number | undefined {
  const v = readings.get(stage ? `${stage}:${quantity}` : quantity)
  return typeof v === 'number' ? v : undefined
}

// ------------------------------------------------------------------ unit-wide facts

const RAW_UNIT_FACTS: [Quantity, string][] = [
  ['ambientTemperature', 'ambientC'],
  ['cabinetTemperature', 'cabinetC'],
  ['setpointTemperature', 'setpointC'],
  ['cascadeHxTemperature', 'cascadeHxC'],
  ['condenserAirInTemperature', 'condenserAirInC'],
  ['condenserAirOutTemperature', 'condenserAirOutC'],
  ['runtime', 'runtimeMin'],
]

function unitFacts(request: RankRequest, readings: Numbers, c: Collector): void {
  const { unit } = request
  c.set('unit.kind', unit.kind)
  c.set('unit.isCascade', unit.kind === 'cascade')
  c.set('design.cabinetC', unit.design?.cabinetC)
  c.set('design.cascadeHxC', unit.kind === 'cascade' ? unit.design?.cascadeHxC : undefined)
  for (const [q, name] of RAW_UNIT_FACTS) c.set(name, reading(readings, q))
  if (unit.kind !== 'cascade' && c.num('cascadeHxC') !== undefined) {
    c.warn('cascadeHxTemperature given for a single-stage unit; ignored')
    delete c.facts.cascadeHxC
  }
  const symptoms = new Set(request.symptoms ?? [])
  for (const s of SYMPTOMS) c.set(`symptom.${s}`, symptoms.has(s))
  cabinetFacts(unit.kind, c)
  airAndHxFacts(c)
}

function cabinetFacts(kind: RankRequest['unit']['kind'], c: Collector): void {
  const target = c.num('setpointC') ?? c.num('design.cabinetC')
  c.set('targetCabinetC', target)
  const cabinet = c.num('cabinetC')
  if (cabinet === undefined || target === undefined) return
  const above = cabinet - target
  c.set('cabinetAboveTargetK', above)
  const runtime = c.num('runtimeMin')
  if (runtime !== undefined) c.set('pulldownStalled', runtime >= STALL_RUNTIME_MIN[kind] && above > STALL_ABOVE_TARGET_K)
}

function airAndHxFacts(c: Collector): void {
  const airIn = c.num('condenserAirInC')
  const airOut = c.num('condenserAirOutC')
  if (airIn !== undefined && airOut !== undefined) {
    c.set('condenserAirDeltaK', airOut - airIn)
    if (airOut < airIn - 1) c.warn('Condenser air-out is colder than air-in: probes swapped or the condenser is not running')
  }
  const hx = c.num('cascadeHxC')
  const design = c.num('design.cascadeHxC')
  if (hx !== undefined && design !== undefined) c.set('cascadeHxAboveDesignK', hx - design)
}

// ------------------------------------------------------------------ per-stage facts

const RAW_STAGE_FACTS: [Quantity, string][] = [
  ['suctionPressure', 'suctionPressureKpa'],
  ['dischargePressure', 'dischargePressureKpa'],
  ['standingPressure', 'standingPressureKpa'],
  ['suctionTemperature', 'suctionTempC'],
  ['dischargeTemperature', 'dischargeTempC'],
  ['liquidLineTemperature', 'liquidLineTempC'],
  ['evaporatorTemperature', 'evaporatorTempC'],
  ['compressorCurrent', 'compressorCurrentA'],
]

interface StageContext {
  stage: Stage
  config: StageConfig
  kind: RankRequest['unit']['kind']
  d: props.Designation
  f: (name: string) => string
}

function stageFacts(request: RankRequest, readings: Numbers, config: StageConfig, c: Collector): void {
  const stage = config.stage
  const f = (name: string) => `${stage}.${name}`
  c.set(f('refrigerant'), config.refrigerant)
  c.set(f('chargeG'), config.chargeG)
  c.set(f('volumeL'), config.volumeL)
  c.set(f('ratedCurrentA'), config.ratedCurrentA)
  for (const [q, name] of RAW_STAGE_FACTS) c.set(f(name), reading(readings, q, stage))
  const running = readings.get(`${stage}:compressorRunning`)
  if (typeof running === 'boolean') c.set(f('compressorRunning'), running)
  electricalFacts({ stage, f }, config, c)
  if (!props.isDesignation(config.refrigerant)) {
    c.warn(`${stage} stage: refrigerant "${config.refrigerant}" is not in the property tables; pressure-based facts are not derived`)
    return
  }
  const ctx: StageContext = { stage, config, kind: request.unit.kind, d: config.refrigerant, f }
  saturationFacts(ctx, c)
  expectationFacts(ctx, c)
  standingFacts(ctx, c)
  refrigerantFitFacts(ctx, c)
  runningChecks(ctx, c)
}

function electricalFacts({ stage, f }: Pick<StageContext, 'stage' | 'f'>, config: StageConfig, c: Collector): void {
  const amps = c.num(f('compressorCurrentA'))
  const running = c.facts[f('compressorRunning')]
  if (amps !== undefined && config.ratedCurrentA) c.set(f('currentPercentOfRated'), (amps / config.ratedCurrentA) * 100)
  if (running === true && amps !== undefined && amps < 0.3) {
    c.warn(`${stage} stage: compressor reported running but drawing about 0 A; check the clamp is round one conductor only`)
  }
  if (running === false && amps !== undefined && amps > 1) {
    c.warn(`${stage} stage: compressor reported stopped yet drawing ${amps.toFixed(1)} A`)
  }
}

function saturationFacts({ stage, d, f }: StageContext, c: Collector): void {
  const ps = c.num(f('suctionPressureKpa'))
  const pd = c.num(f('dischargePressureKpa'))
  const ts = c.num(f('suctionTempC'))
  const td = c.num(f('dischargeTempC'))
  const tl = c.num(f('liquidLineTempC'))
  if (ps !== undefined) c.set(f('saturatedSuctionC'), c.attempt(`${stage} saturated suction`, () => props.saturatedSuctionC(d, ps)))
  if (pd !== undefined) c.set(f('saturatedCondensingC'), c.attempt(`${stage} saturated condensing`, () => props.saturatedCondensingC(d, pd)))
  if (ps !== undefined && ts !== undefined) c.set(f('superheatK'), c.attempt(`${stage} superheat`, () => props.superheatK(d, ps, ts)))
  if (pd !== undefined && tl !== undefined) c.set(f('subcoolingK'), c.attempt(`${stage} subcooling`, () => props.subcoolingK(d, pd, tl)))
  if (ps !== undefined && pd !== undefined) {
    if (ps >= pd) c.warn(`${stage} stage: suction pressure is not below discharge pressure; gauges swapped, readings from different moments, or compressor off`)
    else c.set(f('compressionRatio'), c.attempt(`${stage} compression ratio`, () => props.compressionRatio(ps, pd)))
  }
  const sct = c.num(f('saturatedCondensingC'))
  if (td !== undefined && sct !== undefined) c.set(f('dischargeSuperheatK'), td - sct)
}

function isCabinetStage(stage: Stage, kind: StageContext['kind']): boolean {
  return kind === 'cascade' ? stage === 'low' : true
}

function isAirStage(stage: Stage, kind: StageContext['kind']): boolean {
  return kind === 'cascade' ? stage === 'high' : true
}

/** What a healthy stage would show, so that "suction low" and "head high" have a reference. */
function expectationFacts(ctx: StageContext, c: Collector): void {
  const { stage, kind, f } = ctx
  const hxRef = c.num('design.cascadeHxC') ?? c.num('cascadeHxC')
  const target = c.num('targetCabinetC')
  const evap = isCabinetStage(stage, kind) ? sub(target, EVAPORATOR_TD_K) : sub(hxRef, CASCADE_HX_APPROACH_K)
  const air = c.num('condenserAirInC') ?? c.num('ambientC')
  const cond = isAirStage(stage, kind) ? add(air, AIR_CONDENSER_TD_K) : add(hxRef, CASCADE_HX_APPROACH_K)
  c.set(f('expectedEvaporatingC'), evap)
  c.set(f('expectedCondensingC'), cond)
  const sst = c.num(f('saturatedSuctionC'))
  const sct = c.num(f('saturatedCondensingC'))
  if (sst !== undefined && evap !== undefined) c.set(f('suctionSatVsExpectedK'), sst - evap)
  if (sct !== undefined && cond !== undefined) c.set(f('condensingVsExpectedK'), sct - cond)
  if (sct !== undefined && air !== undefined && isAirStage(stage, kind)) c.set(f('condensingAboveAirK'), sct - air)
  expectedRatioFact(ctx, evap, cond, c)
}

/** A worn compressor shows as a ratio well below what the healthy stage would need for the same duty. */
function expectedRatioFact({ stage, d, f }: StageContext, evap: number | undefined, cond: number | undefined, c: Collector): void {
  const ratio = c.num(f('compressionRatio'))
  if (ratio === undefined || evap === undefined || cond === undefined) return
  const expected = c.attempt(`${stage} expected compression ratio`, () => props.saturationPressure(d, cond).dewKpa / props.saturationPressure(d, evap).dewKpa)
  if (expected !== undefined && expected > 0) c.set(f('compressionRatioVsExpected'), ratio / expected)
}

function add(a: number | undefined, b: number): number | undefined {
  return a === undefined ? undefined : a + b
}
function sub(a: number | undefined, b: number): number | undefined {
  return a === undefined ? undefined : a - b
}

interface Expected {
  pressureKpa: number
  phase: props.StandingPhase
}

/** Reference standing pressure measured on this unit wins over a computation from nameplate data. */
function expectedStanding({ stage, config, d }: StageContext, ambientC: number, c: Collector): Expected | undefined {
  const { referenceStandingPressureKpa: refP, referenceAmbientC: refT, chargeG, volumeL } = config
  const fromRef =
    refP !== undefined && refT !== undefined
      ? c.attempt(`${stage} expected standing pressure (reference shift)`, () =>
          props.shiftStandingPressure({ designation: d, referencePressureKpa: refP, referenceAmbientC: refT, ambientC }),
        )
      : undefined
  const fromCharge =
    chargeG !== undefined && volumeL !== undefined
      ? c.attempt(`${stage} expected standing pressure (charge)`, () =>
          props.standingPressureFromCharge({ designation: d, ambientC, volumeL, chargeG }),
        )
      : undefined
  if (fromRef && fromCharge && Math.abs(fromRef.pressureKpa / fromCharge.pressureKpa - 1) > 0.15) {
    c.warn(
      `${stage} stage: reference standing pressure and nameplate charge/volume disagree by more than 15 % (${Math.round(fromRef.pressureKpa)} vs ${Math.round(fromCharge.pressureKpa)} kPa); the reference is used`,
    )
  }
  const chosen = fromRef ?? fromCharge
  return chosen ? { pressureKpa: chosen.pressureKpa, phase: chosen.phase } : undefined
}

function standingFacts(ctx: StageContext, c: Collector): void {
  const { stage, config, d, f } = ctx
  const measured = c.num(f('standingPressureKpa'))
  const ambient = c.num('ambientC')
  if (ambient === undefined) {
    if (measured !== undefined) c.warn(`${stage} stage: standing pressure given without ambientTemperature; it cannot be compared with the expected value`)
    return
  }
  const expected = expectedStanding(ctx, ambient, c)
  if (!expected) return
  c.set(f('expectedStandingPressureKpa'), expected.pressureKpa)
  c.set(f('standingPhase'), expected.phase)
  if (measured === undefined) return
  c.set(f('standingRatio'), measured / expected.pressureKpa)
  c.set(f('standingPercentOfExpected'), (measured / expected.pressureKpa) * 100)
  const { chargeG, volumeL } = config
  // With liquid present the pressure says nothing about the amount (two-phase) or the nameplate data are
  // impossible (liquid-full), so no charge estimate there.
  if (chargeG !== undefined && volumeL !== undefined && expected.phase !== 'two-phase' && expected.phase !== 'liquid') {
    const est = c.attempt(`${stage} charge from standing pressure`, () =>
      props.chargeFromStandingPressure({ designation: d, ambientC: ambient, volumeL, pressureKpa: measured }),
    )
    // A reading at or above the saturation pressure does not measure a gas charge (liquid, air or another gas).
    if (est && (est.phase === 'gas' || est.phase === 'supercritical')) c.set(f('standingChargePercent'), (est.chargeG / chargeG) * 100)
  }
}

// ------------------------------------------------------------------ refrigerant identity

/**
 * Signed offset in K of a measured (p, T) from a refrigerant's saturation band [bubble, dew] at p:
 * negative = colder than saturation, i.e. the pressure is too high for that refrigerant at that temperature.
 */
function saturationOffsetK(d: props.Designation, pKpa: number, tC: number): number | undefined {
  try {
    const { bubbleC, dewC } = props.saturationTemperature(d, pKpa)
    const lo = Math.min(bubbleC, dewC)
    const hi = Math.max(bubbleC, dewC)
    return tC < lo ? tC - lo : tC > hi ? tC - hi : 0
  } catch {
    return undefined
  }
}

interface SaturatedPair {
  pKpa: number
  tC: number
  tolK: number
  /** Only a temperature below saturation is impossible for the nameplate (a starved coil runs above it). */
  belowOnly: boolean
}

/**
 * A measured pair that should lie on the saturation curve: the standing pressure at ambient when the
 * charge is two-phase there, else a running evaporator temperature against suction pressure.
 */
function saturatedPair({ d, f }: StageContext, c: Collector): SaturatedPair | undefined {
  const standing = c.num(f('standingPressureKpa'))
  const ambient = c.num('ambientC')
  const phase = c.facts[f('standingPhase')]
  const tc = props.findRefrigerant(d)?.criticalTemperatureC
  const likelyTwoPhase = phase === 'two-phase' || (phase === undefined && tc !== undefined && ambient !== undefined && tc > ambient + 15)
  if (standing !== undefined && ambient !== undefined && likelyTwoPhase) {
    return { pKpa: standing, tC: ambient, tolK: 3, belowOnly: false }
  }
  const suction = c.num(f('suctionPressureKpa'))
  const evap = c.num(f('evaporatorTempC'))
  if (suction !== undefined && evap !== undefined && c.facts[f('compressorRunning')] !== false) {
    return { pKpa: suction, tC: evap, tolK: 4, belowOnly: true }
  }
  return undefined
}

function bestOtherFit(own: props.Designation, pair: SaturatedPair): { d: string; k: number } | undefined {
  let best: { d: string; k: number } | undefined
  for (const cand of CANDIDATE_REFRIGERANTS) {
    if (cand === own || !props.isDesignation(cand)) continue
    const off = saturationOffsetK(cand, pair.pKpa, pair.tC)
    if (off !== undefined && (!best || Math.abs(off) < best.k)) best = { d: cand, k: Math.abs(off) }
  }
  return best
}

function refrigerantFitFacts(ctx: StageContext, c: Collector): void {
  const pair = saturatedPair(ctx, c)
  if (!pair) return
  const offset = saturationOffsetK(ctx.d, pair.pKpa, pair.tC)
  if (offset === undefined) return
  const { f } = ctx
  c.set(f('refrigerantOffsetK'), offset)
  c.set(f('refrigerantFitK'), Math.abs(offset))
  const best = bestOtherFit(ctx.d, pair)
  if (!best) return
  c.set(f('bestFitRefrigerant'), best.d)
  c.set(f('bestFitK'), best.k)
  const misfit = pair.belowOnly ? offset < -pair.tolK : Math.abs(offset) > pair.tolK
  c.set(f('refrigerantMismatch'), misfit && best.k <= pair.tolK / 2 && best.k < Math.abs(offset) - 2)
}

// ------------------------------------------------------------------ running plausibility

function runningChecks({ stage, f }: StageContext, c: Collector): void {
  const sh = c.num(f('superheatK'))
  if (sh !== undefined && sh < -3) c.warn(`${stage} stage: suction temperature is ${(-sh).toFixed(1)} K below saturation; check the probe and the gauge`)
  const evap = c.num(f('evaporatorTempC'))
  const sst = c.num(f('saturatedSuctionC'))
  if (evap !== undefined && sst !== undefined && evap < sst - 5) {
    c.warn(`${stage} stage: evaporator reads ${(sst - evap).toFixed(1)} K below saturated suction; one of the two readings is off`)
  }
  const sc = c.num(f('subcoolingK'))
  if (sc !== undefined && sc < -3) c.warn(`${stage} stage: liquid line is warmer than condensing; probe misplaced or vapour leaving the condenser`)
}

// ------------------------------------------------------------------ cross-stage

function crossStageFacts(request: RankRequest, c: Collector): void {
  const kind = request.unit.kind
  const cabinetStage: Stage = kind === 'cascade' ? 'low' : 'single'
  const cabinet = c.num('cabinetC')
  const evap = c.num(`${cabinetStage}.evaporatorTempC`)
  if (cabinet !== undefined && evap !== undefined) c.set('cabinetToEvaporatorK', cabinet - evap)
  const hx = c.num('cascadeHxC')
  if (kind !== 'cascade' || hx === undefined) return
  const lowCond = c.num('low.saturatedCondensingC')
  const highSuct = c.num('high.saturatedSuctionC')
  if (lowCond !== undefined) c.set('lowCondensingAboveCascadeHxK', lowCond - hx)
  if (highSuct !== undefined) c.set('highSuctionBelowCascadeHxK', hx - highSuct)
}

const DERIVED_KEYS: (keyof StageDerived)[] = [
  'saturatedSuctionC',
  'saturatedCondensingC',
  'superheatK',
  'subcoolingK',
  'compressionRatio',
  'dischargeSuperheatK',
  'expectedStandingPressureKpa',
  'standingPercentOfExpected',
  'standingChargePercent',
  'standingPhase',
  'currentPercentOfRated',
  'refrigerantFitK',
  'bestFitRefrigerant',
]

function round(v: number, key: keyof StageDerived): number {
  const digits = key === 'compressionRatio' ? 100 : 10
  return Math.round(v * digits) / digits
}

function stageDerived(stage: Stage, facts: Facts): StageDerived {
  const out: Record<string, number | string> = {}
  for (const key of DERIVED_KEYS) {
    const v = facts[`${stage}.${key}`]
    if (typeof v === 'number') out[key] = round(v, key)
    else if (typeof v === 'string') out[key] = v
  }
  return out as StageDerived
}

export function deriveFacts(request: RankRequest): DerivedFacts {
  const c = new Collector()
  const readings = normaliseReadings(request, c)
  unitFacts(request, readings, c)
  for (const config of request.unit.stages) stageFacts(request, readings, config, c)
  crossStageFacts(request, c)
  for (const config of request.unit.stages) c.derived[config.stage] = stageDerived(config.stage, c.facts)
  return { facts: c.facts, warnings: c.warnings, derived: c.derived, readingsPresent: new Set(readings.keys()) }
}
