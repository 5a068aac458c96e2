/** Trade quantities technicians read off gauges and thermometers. */
import { OutOfRangeError } from './errors'
import type { Designation } from './fluids'
import { saturationTemperature } from './properties'

/** Suction superheat (K): measured suction-line temperature minus the dew temperature at suction pressure. */
export function superheatK(d: Designation, suctionPressureKpa: number, suctionTemperatureC: number): number {
  return suctionTemperatureC - saturationTemperature(d, suctionPressureKpa).dewC
}

/** Liquid subcooling (K): bubble temperature at discharge/liquid pressure minus the measured liquid-line temperature. */
export function subcoolingK(d: Designation, dischargePressureKpa: number, liquidTemperatureC: number): number {
  return saturationTemperature(d, dischargePressureKpa).bubbleC - liquidTemperatureC
}

/** Compression ratio: absolute discharge over absolute suction pressure. */
export function compressionRatio(suctionKpaAbs: number, dischargeKpaAbs: number): number {
  for (const [v, what] of [[suctionKpaAbs, 'Suction'], [dischargeKpaAbs, 'Discharge']] as const) {
    if (!Number.isFinite(v) || v <= 0) throw new OutOfRangeError(`${what} pressure must be absolute and above 0 kPa (gauge readings: add atmospheric pressure first); got ${String(v)}.`)
  }
  return dischargeKpaAbs / suctionKpaAbs
}

/** Saturated suction temperature (°C): the dew temperature at suction pressure. */
export function saturatedSuctionC(d: Designation, suctionPressureKpa: number): number {
  return saturationTemperature(d, suctionPressureKpa).dewC
}

/**
 * Saturated condensing temperature (°C): the dew temperature at discharge pressure, as the trade usually
 * quotes condensing temperature for glide blends; subcooling uses the bubble temperature instead.
 */
export function saturatedCondensingC(d: Designation, dischargePressureKpa: number): number {
  return saturationTemperature(d, dischargePressureKpa).dewC
}
