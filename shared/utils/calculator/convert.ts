/** Unit conversion of one reading, as `GET /api/units-conversion` answers it. */
import type { UnitsConversionQuery } from '#shared/schemas/properties'
import type { UnitsConversionDto } from '#shared/types/properties-dto'
import {
  PRESSURE_UNITS, TEMPERATURE_UNITS, UnitError, atmosphericPressureAtAltitude, fromCelsius, fromKpaAbs, toCelsius, toKpaAbs,
  type PressureUnit, type TemperatureUnit,
} from '#shared/utils/properties'
import { STANDARD_ATMOSPHERE_KPA } from '#shared/utils/properties/units'

const isPressureUnit = (u: string): u is PressureUnit => (PRESSURE_UNITS as readonly string[]).includes(u)
const isTemperatureUnit = (u: string): u is TemperatureUnit => (TEMPERATURE_UNITS as readonly string[]).includes(u)

/** Converts a pressure (through absolute kPa) or a temperature (through °C); throws UnitError / OutOfRangeError. */
export function convertReading(q: UnitsConversionQuery): UnitsConversionDto {
  const { value, from, to } = q
  if (isPressureUnit(from) && isPressureUnit(to)) {
    const atmosphericKpa = q.atmosphericKpa ?? (q.altitudeM !== undefined ? atmosphericPressureAtAltitude(q.altitudeM) : STANDARD_ATMOSPHERE_KPA)
    return { kind: 'pressure', value, from, to, result: fromKpaAbs(toKpaAbs(value, from, atmosphericKpa), to, atmosphericKpa), atmosphericKpa }
  }
  if (isTemperatureUnit(from) && isTemperatureUnit(to)) return { kind: 'temperature', value, from, to, result: fromCelsius(toCelsius(value, from), to) }
  throw new UnitError(`Cannot convert ${from} to ${to}: one is a pressure, the other a temperature.`, [...PRESSURE_UNITS, ...TEMPERATURE_UNITS])
}
