/**
 * Refrigerant identity from a saturated pressure–temperature pair: the standing pressure of a
 * two-phase charge at room temperature, or a running evaporator temperature against suction pressure.
 *
 * The pair is compared with the nameplate curve and with every refrigerant the property module knows.
 * When the nameplate curve misses the pair by far more than the measurement allows while another
 * curve passes through it, the stage's derived values are worked out with that best fit instead, and
 * the nameplate-based expectations (standing pressure from the nameplate charge) are set aside: they
 * would otherwise add false evidence of a leak or an overcharge.
 */
import * as props from '#shared/utils/properties'

export interface SaturatedPair {
  pKpa: number
  tC: number
  /** Standard uncertainty of the pair expressed in K (temperature and pressure combined). */
  sigmaK: number
  source: 'standing' | 'running'
  /** Running pairs: a coil may run warmer than saturation (superheat), never colder. */
  belowOnly: boolean
}

export interface RefrigerantFit {
  /** Measured temperature minus the nameplate saturation band at the measured pressure; 0 inside the glide. */
  offsetK: number
  best?: { designation: props.Designation; k: number }
  /** The nameplate misfits by far more than the measurement allows and `best` passes through the pair. */
  mismatch: boolean
  working: props.Designation
}

/** The nameplate misfit must exceed both this and three standard uncertainties (common practice, no source). */
const MISFIT_MIN_K = 3
/** The best fit must pass within this or one standard uncertainty. */
const FIT_MAX_K = 1

/**
 * Signed offset in K of (p, T) from a refrigerant's saturation band [bubble, dew] at p: negative means
 * colder than saturation, i.e. the pressure is too high for that refrigerant at that temperature.
 */
export function saturationOffsetK(d: props.Designation, pKpa: number, tC: number): number | undefined {
  try {
    const { bubbleC, dewC } = props.saturationTemperature(d, pKpa)
    const lo = Math.min(bubbleC, dewC)
    const hi = Math.max(bubbleC, dewC)
    return tC < lo ? tC - lo : tC > hi ? tC - hi : 0
  } catch {
    return undefined
  }
}

/** Offset that counts against the refrigerant: running pairs only count when colder than saturation. */
function misfitK(offset: number, belowOnly: boolean): number {
  return belowOnly ? Math.max(0, -offset) : Math.abs(offset)
}

/** A running coil may read a few kelvin above saturation where the probe sits on a drier part (common practice, no source). */
const COIL_ABOVE_SATURATION_K = 3

/**
 * How far a pair lies from a candidate's curve. A running pair fits anywhere from saturation to a few
 * kelvin above it; within that range the candidate nearest saturation is preferred, by a tenth.
 */
function distanceK(offset: number, belowOnly: boolean): number {
  if (!belowOnly) return Math.abs(offset)
  if (offset < 0) return -offset
  return offset <= COIL_ABOVE_SATURATION_K ? offset / 10 : offset - COIL_ABOVE_SATURATION_K * 0.9
}

export function bestOtherFit(own: props.Designation, pair: SaturatedPair): { designation: props.Designation; k: number } | undefined {
  let best: { designation: props.Designation; k: number } | undefined
  for (const candidate of props.DESIGNATIONS) {
    if (candidate === own) continue
    const offset = saturationOffsetK(candidate, pair.pKpa, pair.tC)
    if (offset === undefined) continue
    const k = distanceK(offset, pair.belowOnly)
    if (!best || k < best.k) best = { designation: candidate, k }
  }
  return best
}

export function fitRefrigerant(nameplate: props.Designation, pair: SaturatedPair): RefrigerantFit | undefined {
  const offsetK = saturationOffsetK(nameplate, pair.pKpa, pair.tC)
  if (offsetK === undefined) return undefined
  const best = bestOtherFit(nameplate, pair)
  const misfit = misfitK(offsetK, pair.belowOnly)
  const mismatch =
    best !== undefined &&
    misfit > Math.max(MISFIT_MIN_K, 3 * pair.sigmaK) &&
    best.k <= Math.max(FIT_MAX_K, 1.2 * pair.sigmaK) &&
    best.k < misfit - 2
  const fit: RefrigerantFit = { offsetK, mismatch, working: mismatch && best ? best.designation : nameplate }
  if (best) fit.best = best
  return fit
}

/** dT_sat/dp at p (K per kPa), from a 1 % step on each side of the dew curve. */
export function saturationSlopeKPerKpa(d: props.Designation, pKpa: number): number | undefined {
  try {
    const lo = props.saturationTemperature(d, pKpa * 0.99).dewC
    const hi = props.saturationTemperature(d, pKpa * 1.01).dewC
    return (hi - lo) / (0.02 * pKpa)
  } catch {
    return undefined
  }
}
