/**
 * Turns a rank request into the flat fact map the findings read (names in fact-vocabulary.ts):
 * readings normalised with their uncertainty (readings.ts), unit-wide facts (here), per-stage facts
 * with the refrigerant that fits (stage-facts.ts, refrigerant-fit.ts), then facts across stages.
 */
import { SYMPTOMS, type RankRequest, type Stage, type StageDerived } from '#shared/types/diagnosis'
import { FactSheet, type Facts } from './fact-sheet'
import { normaliseReadings, readingValue, type NormalisedReadings } from './readings'
import { EVAPORATOR_TD_K, stageFacts } from './stage-facts'

export type { FactValue, Facts } from './fact-sheet'

export interface DerivedFacts {
  facts: Facts
  warnings: string[]
  derived: Partial<Record<Stage, StageDerived>>
  /** `quantity` or `stage:quantity` for each reading used; lets the engine name missing ones. */
  readingsPresent: Set<string>
  /** Readings kept in the record but left out (repair and verification phases), in words. */
  setAside: string[]
}

/** Runtime after which a unit still far from target counts as stalled (common practice, no source). */
const STALL_RUNTIME_MIN = { cascade: 360, 'single-stage': 180 } as const
const STALL_ABOVE_TARGET_K = 10
/** Cabinet this much above target means the control should be calling for cooling. */
const CALLING_ABOVE_TARGET_K = 3
const CALLING_SYMPTOMS = ['not-cooling', 'slow-pulldown', 'warming-over-days', 'compressor-not-starting'] as const

const RAW_UNIT_FACTS = [
  ['ambientTemperature', 'ambientC'],
  ['cabinetTemperature', 'cabinetC'],
  ['setpointTemperature', 'setpointC'],
  ['cascadeHxTemperature', 'cascadeHxC'],
  ['condenserAirInTemperature', 'condenserAirInC'],
  ['condenserAirOutTemperature', 'condenserAirOutC'],
  ['runtime', 'runtimeMin'],
] as const

function unitFacts(request: RankRequest, readings: NormalisedReadings, sheet: FactSheet): void {
  const { unit } = request
  sheet.set('unit.kind', unit.kind)
  sheet.set('unit.isCascade', unit.kind === 'cascade')
  sheet.set('design.cabinetC', unit.design?.cabinetC)
  sheet.set('design.cascadeHxC', unit.kind === 'cascade' ? unit.design?.cascadeHxC : undefined)
  for (const [q, name] of RAW_UNIT_FACTS) {
    const v = readingValue(readings, q)?.value
    if (typeof v === 'number') sheet.set(name, v)
  }
  if (unit.kind !== 'cascade' && sheet.num('cascadeHxC') !== undefined) {
    sheet.warn('A cascade heat exchanger temperature was given for a single-stage unit; it is left out.')
    sheet.drop('cascadeHxC')
  }
  const symptoms = new Set(request.symptoms ?? [])
  for (const s of SYMPTOMS) sheet.set(`symptom.${s}`, symptoms.has(s))
  cabinetFacts(request, sheet)
  airAndHxFacts(sheet)
}

function cabinetFacts(request: RankRequest, sheet: FactSheet): void {
  const target = sheet.num('setpointC') ?? sheet.num('design.cabinetC')
  sheet.set('targetCabinetC', target)
  const cabinet = sheet.num('cabinetC')
  const symptoms = new Set(request.symptoms ?? [])
  const complaint = CALLING_SYMPTOMS.some((s) => symptoms.has(s))
  if (cabinet === undefined || target === undefined) {
    if (complaint) sheet.set('calledToRun', true)
    return
  }
  const above = cabinet - target
  sheet.set('cabinetAboveTargetK', above)
  sheet.set('calledToRun', above >= CALLING_ABOVE_TARGET_K || (above > 0 && complaint))
  const runtime = sheet.num('runtimeMin')
  if (runtime !== undefined) sheet.set('pulldownStalled', runtime >= STALL_RUNTIME_MIN[request.unit.kind] && above > STALL_ABOVE_TARGET_K)
}

function airAndHxFacts(sheet: FactSheet): void {
  const airIn = sheet.num('condenserAirInC')
  const airOut = sheet.num('condenserAirOutC')
  if (airIn !== undefined && airOut !== undefined) {
    sheet.set('condenserAirRiseK', airOut - airIn)
    if (airOut < airIn - 1) sheet.warn('The condenser air-out reads colder than the air-in: the probes may be swapped, or the condenser is not rejecting heat.')
  }
  const hx = sheet.num('cascadeHxC')
  const design = sheet.num('design.cascadeHxC')
  if (hx !== undefined && design !== undefined) sheet.set('cascadeHxAboveDesignK', hx - design)
}

/** Extra spread of the healthy evaporator difference against the cabinet (common practice, no source). */
const CABINET_TD_SIGMA_K = 3

function crossStageFacts(request: RankRequest, readings: NormalisedReadings, sheet: FactSheet): void {
  const kind = request.unit.kind
  const cabinetStage: Stage = kind === 'cascade' ? 'low' : 'single'
  const cabinet = sheet.num('cabinetC')
  const evap = sheet.num(`${cabinetStage}.evaporatorTempC`)
  const sst = sheet.num(`${cabinetStage}.saturatedSuctionC`)
  const running = sheet.bool(`${cabinetStage}.running`)
  if (cabinet !== undefined && evap !== undefined && running !== false) sheet.set('cabinetToEvaporatorK', cabinet - evap)
  if (cabinet !== undefined && sst !== undefined && running !== false) {
    const td = kind === 'cascade' ? EVAPORATOR_TD_K.cascade : EVAPORATOR_TD_K.single
    sheet.set('cabinetVsEvaporatingK', cabinet - (sst + td))
    const cabinetSigma = readingValue(readings, 'cabinetTemperature')?.sigma ?? 0
    const sstSigma = sheet.num(`${cabinetStage}.evaporatingUncertaintyK`) ?? 0
    sheet.set('cabinetVsEvaporatingUncertaintyK', Math.sqrt(cabinetSigma ** 2 + sstSigma ** 2 + CABINET_TD_SIGMA_K ** 2))
  }
  const hx = sheet.num('cascadeHxC')
  if (kind !== 'cascade' || hx === undefined) return
  const lowCond = sheet.num('low.saturatedCondensingC')
  const highSuct = sheet.num('high.saturatedSuctionC')
  if (lowCond !== undefined && sheet.bool('low.running') !== false) sheet.set('lowCondensingAboveCascadeHxK', lowCond - hx)
  if (highSuct !== undefined && sheet.bool('high.running') !== false) sheet.set('cascadeHxAboveHighSuctionK', hx - highSuct)
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
  'workingRefrigerant',
  'running',
]

function round(v: number, key: keyof StageDerived): number {
  const digits = key === 'compressionRatio' ? 100 : 10
  return Math.round(v * digits) / digits
}

function stageDerived(stage: Stage, facts: Facts): StageDerived {
  const out: Record<string, number | string | boolean> = {}
  for (const key of DERIVED_KEYS) {
    const v = facts[`${stage}.${key}`]
    if (typeof v === 'number') out[key] = round(v, key)
    else if (v !== undefined) out[key] = v
  }
  return out as StageDerived
}

export function deriveFacts(request: RankRequest): DerivedFacts {
  const sheet = new FactSheet()
  const readings = normaliseReadings(request, sheet)
  unitFacts(request, readings, sheet)
  for (const config of request.unit.stages) stageFacts(request, config, readings, sheet)
  crossStageFacts(request, readings, sheet)
  for (const config of request.unit.stages) sheet.derived[config.stage] = stageDerived(config.stage, sheet.facts)
  return { facts: sheet.facts, warnings: sheet.warnings, derived: sheet.derived, readingsPresent: new Set(readings.values.keys()), setAside: readings.setAside }
}
