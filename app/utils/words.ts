// Plain labels for the vocabulary words the API uses. The words themselves stay as they are on
// the wire; these are only what a technician reads.
import type { Quantity, Stage, Symptom } from '#shared/types/diagnosis'
import type { SubstitutionBasis } from '#shared/utils/charging'
import { ABOVE_CRITICAL_AT_AMBIENT, type StandingPhase } from '#shared/utils/properties'

export const STAGE_LABELS: Record<Stage, string> = { high: 'High stage', low: 'Low stage', single: 'Single stage' }

export const QUANTITY_LABELS: Record<Quantity, string> = {
  suctionPressure: 'Suction pressure',
  dischargePressure: 'Discharge pressure',
  suctionTemperature: 'Suction line temperature',
  dischargeTemperature: 'Discharge line temperature',
  liquidLineTemperature: 'Liquid line temperature',
  evaporatorTemperature: 'Evaporator temperature',
  compressorCurrent: 'Compressor current',
  compressorRunning: 'Compressor running',
  standingPressure: 'Standing pressure (off, equalised)',
  cabinetTemperature: 'Cabinet temperature',
  setpointTemperature: 'Setpoint',
  cascadeHxTemperature: 'Cascade heat exchanger',
  ambientTemperature: 'Room (ambient) temperature',
  condenserAirInTemperature: 'Condenser air in',
  condenserAirOutTemperature: 'Condenser air out',
  runtime: 'Runtime since start',
}

export const SYMPTOM_LABELS: Record<Symptom, string> = {
  'not-cooling': 'Not cooling',
  'slow-pulldown': 'Slow pull-down',
  'warming-over-days': 'Warming over days',
  'intermittent-cooling': 'Cools on and off',
  'compressor-short-cycling': 'Compressor short-cycling',
  'compressor-not-starting': 'Compressor does not start',
  'compressor-tripping': 'Compressor trips',
  'frost-on-capillary': 'Frost on a capillary',
  'oil-at-fitting': 'Oil at a fitting',
  'line-tap-valve-present': 'Line-tap valve fitted',
  'recently-serviced': 'Recently serviced',
  'refrigerant-label-mismatch': 'Refrigerant label does not match',
  'noisy-compressor': 'Noisy compressor',
}

export const UNIT_SYMBOLS: Record<string, string> = { C: '°C', F: '°F', K: 'K', A: 'A', min: 'min', bool: '' }

/** A unit word as shown beside a number ("psig", "°C"). */
export function unitSymbol(unit: string): string {
  return UNIT_SYMBOLS[unit] ?? unit
}

/** Human label of a cause slug when no title is at hand. */
export function causeLabel(slug: string): string {
  return slug.replaceAll('-', ' ').replace(/^./, (c) => c.toUpperCase())
}

/** What the phase of a standing charge means for the technician, one line each. */
export const PHASE_LABELS: Record<StandingPhase, string> = {
  gas: 'All gas: the standing pressure measures the charge',
  'two-phase': 'Liquid present (two-phase): the pressure is the saturation pressure',
  liquid: 'LIQUID-FULL: compressed liquid fills the stage',
  supercritical: ABOVE_CRITICAL_AT_AMBIENT.charAt(0).toUpperCase() + ABOVE_CRITICAL_AT_AMBIENT.slice(1),
}

/** The three ways of planning a substitute charge, as headings. */
export const BASIS_LABELS: Record<SubstitutionBasis, string> = {
  'standing-pressure': 'Same standing pressure',
  mass: 'Same mass',
  'liquid-volume': 'Same liquid volume',
}
