/** Saturation look-ups shaped as the API answers them; the calculator page shows the same shapes. */
import { atmosphereOf, type SaturationQuery } from '#shared/schemas/properties'
import type { SaturationAtPressureDto, SaturationAtTemperatureDto, SaturationDto } from '#shared/types/properties-dto'
import {
  DESIGNATIONS, UnknownRefrigerantError, findRefrigerant, saturationPressure, saturationTemperature, toCelsius,
  type RefrigerantInfo,
} from '#shared/utils/properties'
import { absoluteKpa } from './pressure'

/** The catalogue entry for a designation typed by a person ('r-170' works); UnknownRefrigerantError otherwise. */
export function resolveRefrigerant(designation: string): RefrigerantInfo {
  const info = findRefrigerant(designation)
  if (!info) throw new UnknownRefrigerantError(designation, DESIGNATIONS)
  return info
}

/** Saturation pressure(s), absolute kPa, at a temperature in °C. */
export function saturationAtTemperature(info: RefrigerantInfo, temperatureC: number): SaturationAtTemperatureDto {
  const { bubbleKpa, dewKpa } = saturationPressure(info.designation, temperatureC)
  const base = { designation: info.designation, kind: info.kind, temperatureC }
  return info.kind === 'blend' ? { ...base, bubblePressureKpa: bubbleKpa, dewPressureKpa: dewKpa } : { ...base, pressureKpa: bubbleKpa }
}

/** Saturation temperature(s), °C, at an absolute pressure in kPa; blends add the glide (dew − bubble). */
export function saturationAtPressure(info: RefrigerantInfo, pressureKpa: number): SaturationAtPressureDto {
  const { bubbleC, dewC } = saturationTemperature(info.designation, pressureKpa)
  const base = { designation: info.designation, kind: info.kind, pressureKpa }
  return info.kind === 'blend'
    ? { ...base, bubbleTemperatureC: bubbleC, dewTemperatureC: dewC, glideK: dewC - bubbleC }
    : { ...base, temperatureC: bubbleC }
}

/** Answers a checked saturation query; unit conversions throw UnitError / OutOfRangeError like the look-ups. */
export function saturationLookup(info: RefrigerantInfo, q: SaturationQuery): SaturationDto {
  if (q.by === 'temperature') {
    if ('temperatureC' in q) return saturationAtTemperature(info, q.temperatureC)
    return { ...saturationAtTemperature(info, toCelsius(q.value, q.unit)), input: { value: q.value, unit: q.unit } }
  }
  if ('pressureKpa' in q) return saturationAtPressure(info, q.pressureKpa)
  const atmosphericKpa = atmosphereOf(q)
  const pressureKpa = absoluteKpa({ value: q.value, unit: q.unit, atmosphericKpa }, 'pressure')
  const input = { value: q.value, unit: q.unit, atmosphericKpa, ...(q.altitudeM !== undefined ? { altitudeM: q.altitudeM } : {}) }
  return { ...saturationAtPressure(info, pressureKpa), input }
}
