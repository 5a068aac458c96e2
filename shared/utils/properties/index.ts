/**
 * Refrigerant property module (pure TypeScript, browser- and server-safe: no framework or Node imports).
 * Saturation, gas density and standing-charge calculations from published reference Helmholtz equations
 * of state (coefficients as distributed in CoolProp 8.0.0, MIT licence; papers cited per fluid in data/).
 */
export { DESIGNATIONS, findRefrigerant, isDesignation, listRefrigerants } from './fluids'
export type { Designation, RefrigerantInfo } from './fluids'
export { OutOfRangeError, UnitError, UnknownRefrigerantError } from './errors'
export { gasDensity, glideK, pressureFromDensity, saturationPressure, saturationTemperature } from './properties'
export { chargeFromStandingPressure, shiftStandingPressure, standingPressureFromCharge } from './standing'
export type { StandingPhase, StandingResult } from './standing'
export { PRESSURE_UNITS, TEMPERATURE_UNITS, atmosphericPressureAtAltitude, fromCelsius, fromKpaAbs, toCelsius, toKpaAbs } from './units'
export type { PressureUnit, TemperatureUnit } from './units'
export { compressionRatio, saturatedCondensingC, saturatedSuctionC, subcoolingK, superheatK } from './trade'
