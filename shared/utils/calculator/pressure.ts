/** Typed pressures to absolute kPa, with the field named when the reading is impossible (below a vacuum). */
import type { PressureGiven } from '#shared/schemas/properties'
import { OutOfRangeError, toKpaAbs } from '#shared/utils/properties'

/** Absolute kPa of a given pressure; an OutOfRangeError names `field` so the 422 lands beside it. */
export function absoluteKpa(given: PressureGiven, field: string): number {
  if ('kpa' in given) return given.kpa
  try {
    return toKpaAbs(given.value, given.unit, given.atmosphericKpa)
  } catch (error) {
    if (error instanceof OutOfRangeError) throw new OutOfRangeError(error.message, error.range, field)
    throw error
  }
}

/** The reading as typed, echoed in answers so the caller sees which atmosphere a gauge value was read against. */
export function typedInput(given: PressureGiven | undefined) {
  return given && !('kpa' in given) ? { value: given.value, unit: given.unit, atmosphericKpa: given.atmosphericKpa } : undefined
}
