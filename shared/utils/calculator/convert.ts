/** Measurement-unit conversion of one reading, as `GET /api/conversions/measurement` answers it. */
import type { MeasurementConversionQuery } from '#shared/schemas/properties'
import type { MeasurementConversionDto } from '#shared/types/properties-dto'
import { siteAtmosphere } from '#shared/utils/format'
import {
  ALL_PRESSURE_UNITS, TEMPERATURE_UNITS, UnitError, fromCelsius, fromKpaAbs, isPressureUnit, toCelsius, toKpaAbs, type TemperatureUnit,
} from '#shared/utils/properties'

const isTemperatureUnit = (u: string): u is TemperatureUnit => (TEMPERATURE_UNITS as readonly string[]).includes(u)

/** Converts a pressure (through absolute kPa) or a temperature (through °C); throws UnitError / OutOfRangeError. */
export function convertReading(q: MeasurementConversionQuery): MeasurementConversionDto {
  const { value, from, to } = q
  if (isPressureUnit(from) && isPressureUnit(to)) {
    const atmosphericKpa = q.atmosphericKpa ?? siteAtmosphere(q.altitudeM).kpa
    return { kind: 'pressure', value, from, to, result: fromKpaAbs(toKpaAbs(value, from, atmosphericKpa), to, atmosphericKpa), atmosphericKpa }
  }
  if (isTemperatureUnit(from) && isTemperatureUnit(to)) return { kind: 'temperature', value, from, to, result: fromCelsius(toCelsius(value, from), to) }
  throw new UnitError(`Cannot convert ${from} to ${to}: one is a pressure, the other a temperature.`, [...ALL_PRESSURE_UNITS, ...TEMPERATURE_UNITS])
}
