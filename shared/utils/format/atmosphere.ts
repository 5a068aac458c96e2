// The one place that turns a site's altitude into the atmospheric pressure gauge readings are
// read against. Every screen, the report and the diagnosis request go through here.
import { OutOfRangeError, UnitError, atmosphericPressureAtAltitude } from '#shared/utils/properties'
import { STANDARD_ATMOSPHERE_KPA } from '#shared/utils/properties/units'

/** The local atmosphere and where the figure comes from. */
export interface SiteAtmosphere {
  kpa: number
  /** False when the altitude is unknown or outside the standard atmosphere, so sea level was used. */
  fromAltitude: boolean
  /** "standard atmosphere at 1500 m", or why sea level was used. */
  source: string
}

/** ISO 2533 standard atmosphere at the site's altitude; sea level (101.325 kPa) when it is unknown or out of range. */
export function siteAtmosphere(altitudeM?: number | null): SiteAtmosphere {
  if (altitudeM === null || altitudeM === undefined) return { kpa: STANDARD_ATMOSPHERE_KPA, fromAltitude: false, source: 'standard atmosphere at sea level' }
  try {
    return { kpa: atmosphericPressureAtAltitude(altitudeM), fromAltitude: true, source: `standard atmosphere at ${altitudeM} m` }
  } catch (error) {
    if (!(error instanceof OutOfRangeError || error instanceof UnitError)) throw error
    return { kpa: STANDARD_ATMOSPHERE_KPA, fromAltitude: false, source: `sea level: an altitude of ${altitudeM} m is outside the standard atmosphere` }
  }
}
