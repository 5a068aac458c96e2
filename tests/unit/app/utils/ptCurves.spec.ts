import { describe, expect, it } from 'vitest'
import { saturationCurves } from '~/utils/ptCurves'

describe('saturationCurves', () => {
  it('draws one rising curve for a pure fluid, through R170 −80 °C / 157.41 kPa', () => {
    const [curve, ...rest] = saturationCurves('R170')
    expect(rest).toHaveLength(0)
    const ys = curve!.points.map((p) => p.y)
    expect(ys.every((y, i) => i === 0 || y > ys[i - 1]!)).toBe(true) // vapour pressure rises with temperature (physics)
    const near = curve!.points.reduce((a, b) => (Math.abs(b.x + 80) < Math.abs(a.x + 80) ? b : a))
    // Bücker & Wagner 2006 ethane EOS as tabulated by CoolProp 8.0.0; 2.5 K sample spacing allows ~15 %
    expect(Math.abs(near.y / 157.41 - 1)).toBeLessThan(0.15 + Math.abs(near.x + 80) * 0.05)
  })

  it('draws bubble and dew for a blend, dew below bubble', () => {
    const curves = saturationCurves('R404A')
    expect(curves.map((c) => c.branch)).toEqual(['bubble', 'dew'])
    expect(curves[1]!.points[0]!.y).toBeLessThan(curves[0]!.points[0]!.y)
  })

  it('keeps to readable pressures (at least 1 kPa)', () => {
    for (const c of saturationCurves('R134a')) expect(Math.min(...c.points.map((p) => p.y))).toBeGreaterThanOrEqual(1)
  })
})
