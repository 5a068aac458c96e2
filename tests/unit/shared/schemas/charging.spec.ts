import { describe, expect, it } from 'vitest'
import { ChargingBodySchema, SubstitutionBodySchema } from '#shared/schemas/charging'

const fields = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) => (r.error?.issues ?? []).map((i) => i.path.join('.'))
const sub = { volumeL: 12, ambientC: 22, from: { designation: 'R13', chargeG: 600 }, to: 'R1150', basis: 'standing-pressure' }

describe('SubstitutionBodySchema', () => {
  it('accepts the documented body and defaults the display to kPag at sea level', () => {
    expect(SubstitutionBodySchema.parse(sub)).toMatchObject({ basis: 'standing-pressure', display: { unit: 'kPag', atmosphericKpa: 101.325 } })
  })

  it('reads the gauge unit against the site altitude (ISO 2533: 2000 m → 79.50 kPa)', () => {
    const r = SubstitutionBodySchema.parse({ ...sub, unit: 'psig', altitudeM: 2000, designPressure: 350 })
    expect(r.display.unit).toBe('psig')
    expect(r.display.atmosphericKpa).toBeCloseTo(79.50, 2)
    expect(r.designPressure).toMatchObject({ value: 350, unit: 'psig' })
  })

  it('names the fields at fault', () => {
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, basis: 'volume' }))).toEqual(['basis'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, basis: 'liquid-volume' }))).toEqual(['evaporatingC'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, from: { designation: 'R13' } }))).toEqual(['from.chargeG'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, from: undefined }))).toEqual(['from'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, volumeL: 0 }))).toEqual(['volumeL'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, designPressure: 300 }))).toEqual(['unit'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, designPressure: 300, designPressureKpa: 2000, unit: 'psig' }))).toEqual(['designPressure'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, unit: 'psi' }))).toEqual(['unit'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, altitudeM: 20000 }))).toEqual(['altitudeM'])
    expect(fields(SubstitutionBodySchema.safeParse({ ...sub, altitudeM: 100, atmosphericKpa: 99 }))).toEqual(['altitudeM'])
  })
})

describe('ChargingBodySchema', () => {
  const base = { designation: 'R1150', volumeL: 12, ambientC: 22, targetChargeG: 153.8 }
  it('takes a pressure (absolute or with a unit) or grams weighed in', () => {
    expect(ChargingBodySchema.parse({ ...base, pressureKpa: 790.8 }).reading).toEqual({ by: 'pressure', pressure: { kpa: 790.8 } })
    expect(ChargingBodySchema.parse({ ...base, pressure: 100, unit: 'psig' }).reading).toEqual({ by: 'pressure', pressure: { value: 100, unit: 'psig', atmosphericKpa: 101.325 } })
    expect(ChargingBodySchema.parse({ ...base, addedG: 50 }).reading).toEqual({ by: 'weight', addedG: 50, startG: 0 })
  })

  it('names the fields at fault', () => {
    expect(fields(ChargingBodySchema.safeParse(base))).toEqual(['pressureKpa', 'addedG'])
    expect(fields(ChargingBodySchema.safeParse({ ...base, pressureKpa: 700, addedG: 5 }))).toEqual(['pressureKpa', 'addedG'])
    expect(fields(ChargingBodySchema.safeParse({ ...base, pressure: 100 }))).toEqual(['unit'])
    expect(fields(ChargingBodySchema.safeParse({ ...base, pressureKpa: 700, startG: 5 }))).toEqual(['startG'])
    expect(fields(ChargingBodySchema.safeParse({ ...base, targetChargeG: 0, addedG: 1 }))).toEqual(['targetChargeG'])
  })
})
