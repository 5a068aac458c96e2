import { DESIGNATIONS, findRefrigerant, saturationPressure } from '#shared/utils/properties'

// Each refrigerant's saturation table is solved from its equation of state on first use (up to
// ~0.1 s for the R508B mixture). Doing it at start-up keeps that pause away from the first
// technician who enters a reading.
export default defineNitroPlugin(() => {
  for (const designation of DESIGNATIONS) {
    const range = findRefrigerant(designation)!.validRange
    saturationPressure(designation, (range.minC + range.maxC) / 2)
  }
})
