/**
 * Per-stage facts: running state, saturation temperatures with the refrigerant that fits, residuals
 * against what a healthy stage shows under the same conditions, standing pressure against the
 * expected one, and the readings that contradict each other.
 *
 * Healthy references (common practice, no source): a cabinet evaporator runs about 10 K below the
 * cabinet (12 K for the wall-bonded coils of cascade freezers), an air-cooled condenser about 15 K
 * above the air entering it, and a cascade heat exchanger about 5 K apart on each side.
 */
import * as props from '#shared/utils/properties'
import type { Quantity, RankRequest, Stage, StageConfig, UnitKind } from '#shared/types/diagnosis'
import { STAGE_LEAD, type FactSheet } from './fact-sheet'
import { readingValue, type NormalisedReadings } from './readings'
import { fitRefrigerant, saturationSlopeKPerKpa, type SaturatedPair } from './refrigerant-fit'

/** Evaporator-to-cabinet difference of a healthy coil, single-stage and cascade low stage. */
export const EVAPORATOR_TD_K = { single: 10, cascade: 12 } as const
/** Condensing above condenser air-in of a healthy, clean air-cooled condenser. */
export const AIR_CONDENSER_TD_K = 15
/** Approach on each side of a healthy cascade heat exchanger. */
export const CASCADE_HX_APPROACH_K = 5
/** Room temperature assumed when neither ambient nor condenser air is given, and its spread. */
const ASSUMED_ROOM_C = 22
const ASSUMED_ROOM_SIGMA_K = 6
/** Extra spread when the cabinet reading stands in for a missing setpoint. */
const TARGET_FROM_CABINET_SIGMA_K = 4
/** A stopped stage is rarely at exactly room temperature; spread of the system against the room air. */
const SYSTEM_VS_ROOM_K = 1.5
/** Current below which a compressor is not running, and above which it is (clamp meter). */
const STOPPED_BELOW_A = 0.3
const RUNNING_ABOVE_A = 0.5

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

/** Readings only a running stage gives. */
const RUNNING_READINGS: Quantity[] = ['suctionPressure', 'dischargePressure', 'suctionTemperature', 'dischargeTemperature', 'liquidLineTemperature']

export interface StageContext {
  stage: Stage
  config: StageConfig
  kind: UnitKind
  readings: NormalisedReadings
  sheet: FactSheet
  f: (name: string) => string
  lead: string
}

const isCabinetStage = (stage: Stage, kind: UnitKind) => (kind === 'cascade' ? stage === 'low' : true)
const isAirStage = (stage: Stage, kind: UnitKind) => (kind === 'cascade' ? stage === 'high' : true)
const quadrature = (...xs: number[]) => Math.sqrt(xs.reduce((a, x) => a + x * x, 0))

function sigmaOf(ctx: StageContext, q: Quantity): number {
  return readingValue(ctx.readings, q, ctx.stage)?.sigma ?? 0
}

export function stageFacts(request: RankRequest, config: StageConfig, readings: NormalisedReadings, sheet: FactSheet): void {
  const stage = config.stage
  const ctx: StageContext = { stage, config, kind: request.unit.kind, readings, sheet, f: (name) => `${stage}.${name}`, lead: STAGE_LEAD[stage] }
  const { f } = ctx
  sheet.set(f('refrigerant'), config.refrigerant)
  sheet.set(f('chargeG'), config.chargeG)
  sheet.set(f('volumeL'), config.volumeL)
  sheet.set(f('ratedCurrentA'), config.ratedCurrentA)
  sheet.set(f('meteringDevice'), config.meteringDevice)
  for (const [q, name] of RAW_STAGE_FACTS) {
    const v = readingValue(readings, q, stage)?.value
    if (typeof v === 'number') sheet.set(f(name), v)
  }
  const reported = readingValue(readings, 'compressorRunning', stage)?.value
  if (typeof reported === 'boolean') sheet.set(f('compressorRunning'), reported)
  runningState(ctx)
  if (!props.isDesignation(config.refrigerant)) {
    sheet.warn(`${ctx.lead}: Rimecase has no property tables for ${config.refrigerant}, so pressures on this stage are not turned into temperatures.`)
    return
  }
  const working = refrigerantIdentity(ctx, config.refrigerant)
  sheet.set(f('workingRefrigerant'), working)
  saturationFacts(ctx, working)
  expectationFacts(ctx)
  if (working === config.refrigerant) standingFacts(ctx, config.refrigerant)
  else if (readingValue(readings, 'standingPressure', stage)) {
    sheet.warn(`${ctx.lead}: the standing pressure is not compared with the nameplate charge, because the readings fit ${working} rather than ${config.refrigerant}.`)
  }
  contradictions(ctx)
}

// ------------------------------------------------------------------ running state

function runningState(ctx: StageContext): void {
  const { sheet, f, lead, stage } = ctx
  const amps = sheet.num(f('compressorCurrentA'))
  const reported = sheet.bool(f('compressorRunning'))
  const ps = sheet.num(f('suctionPressureKpa'))
  const pd = sheet.num(f('dischargePressureKpa'))
  const pumping = ps !== undefined && pd !== undefined ? pd / ps : undefined
  let running: boolean | undefined
  if (amps !== undefined && amps < STOPPED_BELOW_A) {
    if (reported === false) {
      // Seen stopped and drawing nothing: two direct observations agree. Pressures still apart only
      // mean it stopped minutes ago, or the stage does not equalise (an expansion valve or a
      // solenoid closes at standstill).
      running = false
    } else if (pumping !== undefined && pumping >= 2) {
      running = true
      sheet.warn(`${lead}: the pressures show the compressor pumping, yet the clamp meter reads ${amps.toFixed(1)} A; check the clamp is round one conductor only. The current is left out.`)
      sheet.drop(f('compressorCurrentA'))
    } else {
      running = false
      if (reported) sheet.warn(`${lead}: reported running, but the compressor draws ${amps.toFixed(1)} A, so it is not running; what is heard may be the fan. It is treated as stopped.`)
    }
  } else if (amps !== undefined && amps >= RUNNING_ABOVE_A) {
    running = true
    if (reported === false) sheet.warn(`${lead}: reported stopped, yet the compressor draws ${amps.toFixed(1)} A; it is treated as running.`)
  } else if (reported !== undefined) {
    running = reported
  } else if (pumping !== undefined && pumping >= 0.95) {
    running = pumping >= 1.5 ? true : pumping < 1.15 ? false : undefined
  } else if (RUNNING_READINGS.some((q) => readingValue(ctx.readings, q, stage))) {
    // Suction and discharge readings are taken with the compressor running unless the technician says otherwise.
    running = true
  }
  sheet.set(f('running'), running)
  // A stage whose standing pressure was read was stopped on purpose for that reading.
  const stoppedForStanding = readingValue(ctx.readings, 'standingPressure', stage) !== undefined
  if (running === false && sheet.bool('calledToRun') && !stoppedForStanding) sheet.set(f('stoppedWhileCalled'), true)
  else if (running !== undefined) sheet.set(f('stoppedWhileCalled'), false)
}

// ------------------------------------------------------------------ refrigerant identity

function standingPairLikelyTwoPhase(ctx: StageContext, d: props.Designation, ambient: number): boolean {
  const { chargeG, volumeL, referenceStandingPressureKpa: refP, referenceAmbientC: refT } = ctx.config
  try {
    if (refP !== undefined && refT !== undefined) return props.shiftStandingPressure({ designation: d, referencePressureKpa: refP, referenceAmbientC: refT, ambientC: ambient }).phase === 'two-phase'
    if (chargeG !== undefined && volumeL !== undefined) return props.standingPressureFromCharge({ designation: d, ambientC: ambient, volumeL, chargeG }).phase === 'two-phase'
  } catch {
    return false
  }
  const tc = props.findRefrigerant(d)?.criticalTemperatureC
  return tc !== undefined && tc > ambient + 15
}

function saturatedPair(ctx: StageContext, d: props.Designation): SaturatedPair | undefined {
  const { sheet, f, stage } = ctx
  const standing = readingValue(ctx.readings, 'standingPressure', stage)
  const ambient = readingValue(ctx.readings, 'ambientTemperature')
  if (standing && ambient && typeof standing.value === 'number' && typeof ambient.value === 'number' && standingPairLikelyTwoPhase(ctx, d, ambient.value)) {
    const slope = saturationSlopeKPerKpa(d, standing.value) ?? 0
    return { pKpa: standing.value, tC: ambient.value, sigmaK: quadrature(ambient.sigma, SYSTEM_VS_ROOM_K, standing.sigma * slope), source: 'standing', belowOnly: false }
  }
  const suction = readingValue(ctx.readings, 'suctionPressure', stage)
  const evap = readingValue(ctx.readings, 'evaporatorTemperature', stage)
  if (suction && evap && typeof suction.value === 'number' && typeof evap.value === 'number' && sheet.bool(f('running')) !== false) {
    const slope = saturationSlopeKPerKpa(d, suction.value) ?? 0
    return { pKpa: suction.value, tC: evap.value, sigmaK: quadrature(evap.sigma, 1, suction.sigma * slope), source: 'running', belowOnly: true }
  }
  return undefined
}

/** Sets the fit facts and returns the refrigerant the stage's values are worked out with. */
function refrigerantIdentity(ctx: StageContext, nameplate: props.Designation): props.Designation {
  const { sheet, f, lead } = ctx
  const pair = saturatedPair(ctx, nameplate)
  if (!pair) return nameplate
  const fit = fitRefrigerant(nameplate, pair)
  if (!fit) return nameplate
  sheet.set(f('fitSource'), pair.source)
  sheet.set(f('refrigerantOffsetK'), fit.offsetK)
  sheet.set(f('refrigerantOffsetUncertaintyK'), pair.sigmaK)
  sheet.set(f('refrigerantFitK'), Math.abs(fit.offsetK))
  if (fit.best) {
    // The nameplate refrigerant is the best fit when no other curve lies closer (R404A readings
    // also lie within a kelvin of R507A's curve: that names no other refrigerant).
    const nameplateFits = Math.abs(fit.offsetK) <= fit.best.k
    sheet.set(f('bestFitRefrigerant'), nameplateFits ? nameplate : fit.best.designation)
    sheet.set(f('bestFitK'), nameplateFits ? Math.abs(fit.offsetK) : fit.best.k)
  }
  sheet.set(f('refrigerantMismatch'), fit.mismatch)
  if (fit.mismatch) {
    const what = pair.source === 'standing' ? `the standing pressure at ${pair.tC.toFixed(1)} °C` : `the evaporator temperature against the suction pressure`
    sheet.warn(
      `${lead}: ${what} fits ${fit.working}, not the nameplate ${nameplate} (off its curve by ${Math.abs(fit.offsetK).toFixed(1)} K). Saturation temperatures, superheat and subcooling on this stage are worked out for ${fit.working}.`,
    )
  }
  return fit.working
}

// ------------------------------------------------------------------ saturation

function saturationFacts(ctx: StageContext, d: props.Designation): void {
  const { sheet, f, lead } = ctx
  const ps = sheet.num(f('suctionPressureKpa'))
  const pd = sheet.num(f('dischargePressureKpa'))
  const ts = sheet.num(f('suctionTempC'))
  const td = sheet.num(f('dischargeTempC'))
  const tl = sheet.num(f('liquidLineTempC'))
  const skip = 'The value is not worked out.'
  // The discharge side is never below the suction side; a running compressor keeps it well above.
  const reversed = ps !== undefined && pd !== undefined && (ps > pd * 1.05 + 20 || (ps >= pd && sheet.bool(f('running')) === true))
  if (reversed) {
    sheet.warn(`${lead}: the suction pressure is not below the discharge pressure; the gauges may be swapped or read at different moments. Both pressures are left out.`)
    sheet.drop(f('suctionPressureKpa'))
    sheet.drop(f('dischargePressureKpa'))
    return saturationFacts(ctx, d)
  }
  const sst = ps === undefined ? undefined : sheet.attempt(`${lead} suction pressure`, skip, () => props.saturatedSuctionC(d, ps))
  const sct = pd === undefined ? undefined : sheet.attempt(`${lead} discharge pressure`, skip, () => props.saturatedCondensingC(d, pd))
  sheet.set(f('saturatedSuctionC'), sst)
  sheet.set(f('saturatedCondensingC'), sct)
  const suctionSlope = ps === undefined ? undefined : saturationSlopeKPerKpa(d, ps)
  const dischargeSlope = pd === undefined ? undefined : saturationSlopeKPerKpa(d, pd)
  const sstSigma = quadrature(sigmaOf(ctx, 'suctionPressure') * (suctionSlope ?? 0))
  const sctSigma = quadrature(sigmaOf(ctx, 'dischargePressure') * (dischargeSlope ?? 0))
  if (sst !== undefined && ts !== undefined) {
    sheet.set(f('superheatK'), ts - sst)
    sheet.set(f('superheatUncertaintyK'), quadrature(sstSigma, sigmaOf(ctx, 'suctionTemperature')))
  }
  if (pd !== undefined && tl !== undefined) {
    const bubble = sheet.attempt(`${lead} discharge pressure`, skip, () => props.saturationTemperature(d, pd).bubbleC)
    if (bubble !== undefined) {
      sheet.set(f('subcoolingK'), bubble - tl)
      sheet.set(f('subcoolingUncertaintyK'), quadrature(sctSigma, sigmaOf(ctx, 'liquidLineTemperature')))
    }
  }
  if (ps !== undefined && pd !== undefined) sheet.set(f('compressionRatio'), pd / ps)
  if (td !== undefined && sct !== undefined) sheet.set(f('dischargeSuperheatK'), td - sct)
  if (sst !== undefined) sheet.set(f('evaporatingUncertaintyK'), sstSigma)
  if (sct !== undefined) sheet.set(f('condensingUncertaintyK'), sctSigma)
}

// ------------------------------------------------------------------ expectations

interface Expectation {
  c: number
  sigma: number
}

/** Evaporating temperature a healthy stage runs at, with the spread of that expectation. */
function expectedEvaporating(ctx: StageContext): Expectation | undefined {
  const { sheet, stage, kind } = ctx
  if (isCabinetStage(stage, kind)) {
    const td = kind === 'cascade' ? EVAPORATOR_TD_K.cascade : EVAPORATOR_TD_K.single
    const target = sheet.num('targetCabinetC')
    if (target !== undefined) return { c: target - td, sigma: 0 }
    const cabinet = sheet.num('cabinetC')
    return cabinet === undefined ? undefined : { c: cabinet - td, sigma: TARGET_FROM_CABINET_SIGMA_K }
  }
  const design = sheet.num('design.cascadeHxC')
  if (design !== undefined) return { c: design - CASCADE_HX_APPROACH_K, sigma: 0 }
  const hx = sheet.num('cascadeHxC')
  return hx === undefined ? undefined : { c: hx - CASCADE_HX_APPROACH_K, sigma: 2 }
}

/** Condensing temperature a healthy stage runs at: air-in + 15 K, or the cascade heat exchanger design + 5 K. */
function expectedCondensing(ctx: StageContext): Expectation | undefined {
  const { sheet, stage, kind } = ctx
  if (isAirStage(stage, kind)) {
    const air = sheet.num('condenserAirInC')
    if (air !== undefined) return { c: air + AIR_CONDENSER_TD_K, sigma: 0 }
    const ambient = sheet.num('ambientC')
    if (ambient !== undefined) return { c: ambient + AIR_CONDENSER_TD_K, sigma: 1.5 }
    return { c: ASSUMED_ROOM_C + AIR_CONDENSER_TD_K, sigma: ASSUMED_ROOM_SIGMA_K }
  }
  const design = sheet.num('design.cascadeHxC')
  if (design !== undefined) return { c: design + CASCADE_HX_APPROACH_K, sigma: 0 }
  const hx = sheet.num('cascadeHxC')
  return hx === undefined ? undefined : { c: hx + CASCADE_HX_APPROACH_K, sigma: 2 }
}

function expectationFacts(ctx: StageContext): void {
  const { sheet, f, stage, kind } = ctx
  const evap = expectedEvaporating(ctx)
  const cond = expectedCondensing(ctx)
  sheet.set(f('expectedEvaporatingC'), evap?.c)
  sheet.set(f('expectedCondensingC'), cond?.c)
  const sst = sheet.num(f('saturatedSuctionC'))
  const sct = sheet.num(f('saturatedCondensingC'))
  if (sst !== undefined && evap) {
    sheet.set(f('evaporatingResidualK'), sst - evap.c)
    sheet.set(f('evaporatingUncertaintyK'), quadrature(sheet.num(f('evaporatingUncertaintyK')) ?? 0, evap.sigma))
  }
  if (sct !== undefined && cond) {
    sheet.set(f('condensingResidualK'), sct - cond.c)
    sheet.set(f('condensingUncertaintyK'), quadrature(sheet.num(f('condensingUncertaintyK')) ?? 0, cond.sigma))
  }
  const air = sheet.num('condenserAirInC') ?? sheet.num('ambientC')
  if (sct !== undefined && air !== undefined && isAirStage(stage, kind)) sheet.set(f('condensingAboveAirK'), sct - air)
  const amps = sheet.num(f('compressorCurrentA'))
  const rated = ctx.config.ratedCurrentA
  if (amps !== undefined && rated) sheet.set(f('currentPercentOfRated'), (amps / rated) * 100)
}

// ------------------------------------------------------------------ standing pressure

interface ExpectedStanding {
  pressureKpa: number
  phase: props.StandingPhase
}

/** A reference standing pressure measured on this unit wins over a computation from nameplate data. */
function expectedStanding(ctx: StageContext, d: props.Designation, ambientC: number, quiet = false): ExpectedStanding | undefined {
  const { lead, sheet } = ctx
  const { referenceStandingPressureKpa: refP, referenceAmbientC: refT, chargeG, volumeL } = ctx.config
  const skip = 'The expected standing pressure is not worked out.'
  const run = <T>(fn: () => T): T | undefined => (quiet ? tryQuietly(fn) : sheet.attempt(`${lead} standing pressure`, skip, fn))
  const fromRef = refP !== undefined && refT !== undefined ? run(() => props.shiftStandingPressure({ designation: d, referencePressureKpa: refP, referenceAmbientC: refT, ambientC })) : undefined
  const fromCharge = chargeG !== undefined && volumeL !== undefined ? run(() => props.standingPressureFromCharge({ designation: d, ambientC, volumeL, chargeG })) : undefined
  if (!quiet && fromRef && fromCharge && Math.abs(fromRef.pressureKpa / fromCharge.pressureKpa - 1) > 0.15) {
    sheet.warn(
      `${lead}: the reference standing pressure and the nameplate charge and volume disagree by more than 15 % (${Math.round(fromRef.pressureKpa)} against ${Math.round(fromCharge.pressureKpa)} kPa); the reference is used.`,
    )
  }
  const chosen = fromRef ?? fromCharge
  return chosen ? { pressureKpa: chosen.pressureKpa, phase: chosen.phase } : undefined
}

function tryQuietly<T>(fn: () => T): T | undefined {
  try {
    return fn()
  } catch {
    return undefined
  }
}

function standingFacts(ctx: StageContext, d: props.Designation): void {
  const { sheet, f, lead, stage } = ctx
  const measured = readingValue(ctx.readings, 'standingPressure', stage)
  const ambient = readingValue(ctx.readings, 'ambientTemperature')
  if (!ambient || typeof ambient.value !== 'number') {
    if (measured) sheet.warn(`${lead}: a standing pressure needs the room temperature beside it to be compared with the expected value.`)
    return
  }
  const expected = expectedStanding(ctx, d, ambient.value)
  if (!expected) return
  sheet.set(f('expectedStandingPressureKpa'), expected.pressureKpa)
  sheet.set(f('standingPhase'), expected.phase)
  if (!measured || typeof measured.value !== 'number') return
  const p = measured.value
  const ratio = p / expected.pressureKpa
  sheet.set(f('standingRatio'), ratio)
  sheet.set(f('standingPercentOfExpected'), ratio * 100)
  sheet.set(f('standingResidualPct'), (ratio - 1) * 100)
  const warmer = expectedStanding(ctx, d, ambient.value + SYSTEM_VS_ROOM_K, true)
  const ambientEffect = warmer ? Math.abs(warmer.pressureKpa / expected.pressureKpa - 1) * 100 : 0
  sheet.set(f('standingUncertaintyPct'), quadrature((measured.sigma / expected.pressureKpa) * 100, ambientEffect))
  const { chargeG, volumeL } = ctx.config
  // With liquid present the pressure says nothing about the amount (two-phase) or the nameplate data are
  // impossible (liquid-full), so no charge estimate there.
  if (chargeG !== undefined && volumeL !== undefined && expected.phase !== 'two-phase' && expected.phase !== 'liquid') {
    const est = tryQuietly(() => props.chargeFromStandingPressure({ designation: d, ambientC: ambient.value as number, volumeL, pressureKpa: p }))
    // A reading at or above the saturation pressure does not measure a gas charge (liquid, air or another gas).
    if (est && (est.phase === 'gas' || est.phase === 'supercritical')) sheet.set(f('standingChargePercent'), (est.chargeG / chargeG) * 100)
  }
}

// ------------------------------------------------------------------ contradictions

function contradictions(ctx: StageContext): void {
  const { sheet, f, lead } = ctx
  const sh = sheet.num(f('superheatK'))
  if (sh !== undefined && sh < -3) {
    sheet.warn(`${lead}: the suction line reads ${(-sh).toFixed(1)} K colder than saturation, which a running circuit cannot do; check the probe and the gauge. The ranking counts it as a sign of a faulty sensor or reading.`)
  }
  const evap = sheet.num(f('evaporatorTempC'))
  const sst = sheet.num(f('saturatedSuctionC'))
  if (evap !== undefined && sst !== undefined && sheet.bool(f('running')) !== false) {
    sheet.set(f('evaporatorVsSaturationK'), evap - sst)
    if (evap < sst - 5 && !sheet.bool(f('refrigerantMismatch'))) {
      sheet.warn(`${lead}: the evaporator reads ${(sst - evap).toFixed(1)} K below saturated suction, which a coil cannot do; one of the two readings is off.`)
    }
  }
  const sc = sheet.num(f('subcoolingK'))
  if (sc !== undefined && sc < -3) sheet.warn(`${lead}: the liquid line reads warmer than condensing; the probe may be misplaced, or vapour is leaving the condenser.`)
}
