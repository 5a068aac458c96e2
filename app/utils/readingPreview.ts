// What a reading means while it is typed: converts it and, for stage pressures and temperatures,
// computes the saturation temperature, superheat or subcooling with the shared property module.
import type { Quantity, Reading, Stage } from '#shared/types/diagnosis'
import { formatPressure, formatQuantity } from '#shared/utils/format'
import { ABOVE_CRITICAL_AT_AMBIENT, findRefrigerant, isDesignation, saturationTemperature, superheatK, subcoolingK, toCelsius, toKpaAbs } from '#shared/utils/properties'

export interface PreviewContext {
  refrigerant?: string
  atmosphericKpa: number
  /** Latest suction/discharge pressure of the same stage, kPa absolute. */
  suctionKpa?: number
  dischargeKpa?: number
  /** Latest room temperature, °C: a stage standing above its critical temperature has no saturation temperature. */
  ambientC?: number
}

/**
 * A fluid whose critical temperature is below this is above critical in any plant room (common practice,
 * no source), so its standing pressure never has a saturation temperature even when the room was not read.
 */
const ALWAYS_ABOVE_CRITICAL_BELOW_C = 15

/** The room temperature (°C) of the latest unit-wide ambient reading, if any. */
export function latestAmbientC(readings: readonly Reading[]): number | undefined {
  const r = [...readings].reverse().find((x) => x.quantity === 'ambientTemperature' && typeof x.value === 'number')
  if (!r || typeof r.value !== 'number') return undefined
  try { return toCelsius(r.value, r.unit) } catch { return undefined }
}

/** True when a standing stage of this refrigerant is above its critical temperature at the room temperature. */
function aboveCriticalAtAmbient(designation: string, ambientC: number | undefined): boolean {
  const tc = findRefrigerant(designation)?.criticalTemperatureC
  if (tc === undefined) return false
  return ambientC !== undefined ? ambientC >= tc : tc < ALWAYS_ABOVE_CRITICAL_BELOW_C
}

/** A short line such as "−97.8 °C saturated (dew)" or "superheat 8.2 K", or '' when nothing applies. */
export function previewReading(quantity: Quantity, value: number, unit: string, ctx: PreviewContext): string {
  if (!Number.isFinite(value)) return ''
  try {
    if (quantity.endsWith('Pressure')) {
      const kpa = toKpaAbs(value, unit, ctx.atmosphericKpa)
      if (!ctx.refrigerant || !isDesignation(ctx.refrigerant)) return formatPressure(kpa, { decimals: 0 })
      if (quantity === 'standingPressure' && aboveCriticalAtAmbient(ctx.refrigerant, ctx.ambientC)) return `${formatPressure(kpa, { decimals: 0 })}: ${ABOVE_CRITICAL_AT_AMBIENT}`
      const sat = saturationTemperature(ctx.refrigerant, kpa)
      const glide = Math.abs(sat.dewC - sat.bubbleC) > 0.05
      const temp = quantity === 'dischargePressure' && glide ? sat.bubbleC : sat.dewC
      return `${formatPressure(kpa, { decimals: 0 })} → ${formatQuantity(temp, 'C')} sat.${glide ? (quantity === 'dischargePressure' ? ' (bubble)' : ' (dew)') : ''}`
    }
    if (unit === 'C' || unit === 'F' || unit === 'K') {
      const c = toCelsius(value, unit)
      const d = ctx.refrigerant
      if (d && isDesignation(d) && quantity === 'suctionTemperature' && ctx.suctionKpa) return `${formatQuantity(c, 'C')} → superheat ${formatQuantity(superheatK(d, ctx.suctionKpa, c), 'K', 1)}`
      if (d && isDesignation(d) && quantity === 'liquidLineTemperature' && ctx.dischargeKpa) return `${formatQuantity(c, 'C')} → subcooling ${formatQuantity(subcoolingK(d, ctx.dischargeKpa, c), 'K', 1)}`
      return unit === 'C' ? '' : formatQuantity(c, 'C')
    }
  } catch (error) {
    return error instanceof Error ? error.message : 'Outside the refrigerant range'
  }
  return ''
}

export type { Stage }
