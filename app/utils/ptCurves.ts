/**
 * Saturation curves for the pressure–temperature chart, sampled from the shared property module.
 * Curves are pure functions of the designation, so each is computed once per page load.
 */
import { findRefrigerant, saturationPressure, type Designation } from '#shared/utils/properties'

export interface CurvePoint { x: number; y: number }
export interface SaturationCurve {
  designation: Designation
  branch: 'saturation' | 'bubble' | 'dew'
  label: string
  points: CurvePoint[]
}

// Below ~1 kPa no service gauge reads anything, and above 70 °C no standing system sits: the chart
// keeps to the range a technician meets.
const MIN_KPA = 1
const MAX_C = 70
const FLOOR_C = -200
const SAMPLES = 80

const cache = new Map<Designation, SaturationCurve[]>()

/** The saturation curve (pure fluids) or bubble and dew curves (blends) of a refrigerant, °C vs kPa abs. */
export function saturationCurves(designation: Designation): SaturationCurve[] {
  const hit = cache.get(designation)
  if (hit) return hit
  const info = findRefrigerant(designation)
  if (!info) return []
  const lo = Math.max(info.validRange.minC, FLOOR_C)
  const hi = Math.min(info.validRange.maxC, MAX_C)
  const bubble: CurvePoint[] = []
  const dew: CurvePoint[] = []
  for (let i = 0; i <= SAMPLES; i++) {
    const c = lo + ((hi - lo) * i) / SAMPLES
    const { bubbleKpa, dewKpa } = saturationPressure(info.designation, c)
    if (bubbleKpa >= MIN_KPA) bubble.push({ x: c, y: bubbleKpa })
    if (dewKpa >= MIN_KPA) dew.push({ x: c, y: dewKpa })
  }
  const curves: SaturationCurve[] = info.kind === 'blend'
    ? [{ designation, branch: 'bubble', label: `${designation} bubble`, points: bubble }, { designation, branch: 'dew', label: `${designation} dew`, points: dew }]
    : [{ designation, branch: 'saturation', label: designation, points: bubble }]
  cache.set(designation, curves)
  return curves
}
