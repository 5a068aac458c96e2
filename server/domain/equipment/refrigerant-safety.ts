// The safety facts a unit page shows beside each stage, taken from the refrigerant catalogue so that
// the phone does not need to load the property equations just to show a class and its cautions.
import { findRefrigerant } from '#shared/utils/properties'
import type { RefrigerantSafetyDto } from '#shared/types/equipment-dto'

/** Safety facts of each distinct known designation, in the order given; unknown ones are skipped. */
export function refrigerantSafety(designations: string[]): RefrigerantSafetyDto[] {
  const out: RefrigerantSafetyDto[] = []
  for (const d of new Set(designations)) {
    const info = findRefrigerant(d)
    if (!info) continue
    const { designation, name, safetyClass, flammable, toxic, highPressure, cautions } = info
    out.push({ designation, name, safetyClass, flammable, toxic, highPressure, cautions })
  }
  return out
}
