/** Unit conversion of one reading, as `GET /api/units-conversion` answers it. */
import type { UnitsConversionQuery } from '#shared/schemas/properties'
import type { UnitsConversionDto } from '#shared/types/properties-dto'
import {
  ALL_PRESSURE_UNITS, STANDARD_ATMOSPHERE_KPA, TEMPERATURE_UNITS, UnitError, atmosphericPressureAtAltitude, fromCelsius, fromKpaAbs, isPressureUnit,
  toCelsius, toKpaAbs, type TemperatureUnit,
} from '#shared/utils/properties'

const isTemperatureUnit = (u: string): u is TemperatureUnit => (TEMPERATURE_UNITS as readonly string[]).includes(u)

/** Converts a pressure (through absolute kPa) or a temperature (through °C); throws UnitError / OutOfRangeError. */
export function convertReading(q: UnitsConversionQuery): UnitsConversionDto {
  const { value, from, to } = q
  if (isPressureUnit(from) && isPressureUnit(to)) {
    const atmosphericKpa = q.atmosphericKpa ?? (q.altitudeM !== undefined ? atmosphericPressureAtAltitude(q.altitudeM) : STANDARD_ATMOSPHERE_KPA)
    return { kind: 'pressure', value, from, to, result: fromKpaAbs(toKpaAbs(value, from, atmosphericKpa), to, atmosphericKpa), atmosphericKpa }
  }
  if (isTemperatureUnit(from) && isTemperatureUnit(to)) return { kind: 'temperature', value, from, to, result: fromCelsius(toCelsius(value, from), to) }
  throw new UnitError(`Cannot convert ${from} to ${to}: one is a pressure, the other a temperature.`, [...ALL_PRESSURE_UNITS, ...TEMPERATURE_UNITS])
}
