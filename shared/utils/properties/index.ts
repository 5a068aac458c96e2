/**
 * Refrigerant property module (pure TypeScript, browser- and server-safe: no framework or Node imports).
 * Saturation, gas density and standing-charge calculations from published reference Helmholtz equations
 * of state (coefficients as distributed in CoolProp 8.0.0, MIT licence; papers cited per fluid in data/).
 */
export { DESIGNATIONS, designationsMatching, findRefrigerant, isDesignation, listRefrigerants } from './fluids'
export type { Designation, RefrigerantFamily, RefrigerantInfo } from './fluids'
export { OutOfRangeError, UnitError, UnknownRefrigerantError } from './errors'
export { gasDensity, glideK, pressureFromDensity, saturatedLiquidDensity, saturationPressure, saturationTemperature } from './properties'
export { ABOVE_CRITICAL_AT_AMBIENT, ABOVE_SATURATION_MARGIN, ambientAtStandingPressure, assertWithinEos, chargeFromStandingPressure, eosLimits, shiftStandingPressure, standingPressureFromCharge } from './standing'
export type { StandingPhase, StandingResult } from './standing'
export {
  ALL_PRESSURE_UNITS, PRESSURE_UNIT_LABELS, PRESSURE_UNITS, STANDARD_ATMOSPHERE_KPA, TEMPERATURE_UNITS, VACUUM_UNITS,
  atmosphericPressureAtAltitude, fromCelsius, fromKpaAbs, isGaugeUnit, isPressureUnit, toCelsius, toKpaAbs,
} from './units'
export type { AnyPressureUnit, PressureUnit, PressureUnitLabel, TemperatureUnit, VacuumUnit } from './units'
export { compressionRatio, saturatedCondensingC, saturatedSuctionC, subcoolingK, superheatK } from './trade'
