// Pressures always say whether they are absolute or gauge: an absolute figure is shown as
// "kPa abs", a gauge one in the gauge unit the technician reads ("psig", "kPag").
import { fromKpaAbs, type PressureUnit } from '#shared/utils/properties'
import { PRESSURE_UNIT_WORDS } from '../vocabulary/measurement-units'
import { formatQuantity } from './figures'

/** An absolute pressure in `unit` (absolute kPa by default): "204.7 kPa abs", "15.0 psig"; gauge units use `atmosphericKpa`. */
export function formatPressure(kpaAbs: number | null | undefined, options: { unit?: PressureUnit; atmosphericKpa?: number; decimals?: number } = {}): string {
  const unit = options.unit ?? 'kPa'
  if (kpaAbs === null || kpaAbs === undefined) return formatQuantity(null, unit)
  const value = unit === 'kPa' ? kpaAbs : fromKpaAbs(kpaAbs, unit, options.atmosphericKpa)
  return formatQuantity(value, unit, options.decimals ?? PRESSURE_UNIT_WORDS[unit].decimals)
}
