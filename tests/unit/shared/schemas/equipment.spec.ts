import { describe, expect, it } from 'vitest'
import { ContactInputSchema, SiteInputSchema, UnitInputSchema, UnitRegisterQuerySchema } from '#shared/schemas/equipment'

const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) => r.error?.issues.map((i) => i.path.join('.')) ?? []

const cascade = {
  name: 'Freezer Z-2', model: 'Icebox 9', serial: 'IB9-0002', kind: 'cascade', equipmentClass: 'ult-freezer', siteId: 1,
  designCabinetC: -86, designCascadeHxC: -35,
  stages: [
    { stage: 'high', refrigerant: 'R290', chargeG: 150 },
    { stage: 'low', refrigerant: 'R170', chargeG: 90, volumeL: 7, referenceStandingPressureKpa: 700, referenceAmbientC: 20 },
  ],
}

describe('UnitInputSchema', () => {
  it('accepts a cascade unit and writes refrigerant designations the catalogue way', () => {
    const r = UnitInputSchema.safeParse({ ...cascade, stages: [{ ...cascade.stages[0], refrigerant: 'r-290' }, cascade.stages[1]] })
    expect(r.success).toBe(true)
    expect(r.data?.stages[0]?.refrigerant).toBe('R290')
  })

  it('refuses a cascade without its low stage, and a single-stage unit with two', () => {
    expect(paths(UnitInputSchema.safeParse({ ...cascade, stages: [cascade.stages[0]] }))).toContain('stages')
    const single = { ...cascade, kind: 'single-stage', designCascadeHxC: null, stages: [{ stage: 'single', refrigerant: 'R290' }, { stage: 'single', refrigerant: 'R290' }] }
    expect(paths(UnitInputSchema.safeParse(single))).toContain('stages')
  })

  it('names the field of each plausibility failure', () => {
    const bad = {
      ...cascade,
      designCabinetC: -200,
      stages: [{ stage: 'high', refrigerant: 'R999', chargeG: -1 }, { stage: 'low', refrigerant: 'R170', volumeL: 0, referenceStandingPressureKpa: 700 }],
    }
    expect(paths(UnitInputSchema.safeParse(bad))).toEqual(expect.arrayContaining([
      'designCabinetC', 'stages.0.refrigerant', 'stages.0.chargeG', 'stages.1.volumeL', 'stages.1.referenceAmbientC',
    ]))
  })

  it('keeps the cascade heat exchanger to cascade units, warmer than the cabinet', () => {
    expect(paths(UnitInputSchema.safeParse({ ...cascade, designCascadeHxC: -90 }))).toEqual(['designCascadeHxC'])
    const single = { ...cascade, kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] }
    expect(paths(UnitInputSchema.safeParse(single))).toEqual(['designCascadeHxC'])
  })
})

describe('site, contact and register query schemas', () => {
  it('bounds the altitude and checks e-mail addresses', () => {
    expect(paths(SiteInputSchema.safeParse({ customerId: 1, name: 'Lab', altitudeM: 5200 }))).toEqual(['altitudeM'])
    expect(SiteInputSchema.safeParse({ customerId: 1, name: 'Lab', altitudeM: -430 }).success).toBe(true)
    expect(paths(ContactInputSchema.safeParse({ name: 'Desk', email: 'desk@' }))).toEqual(['email'])
  })

  it('fills register defaults and refuses unknown sort columns', () => {
    expect(UnitRegisterQuerySchema.parse({})).toEqual({ sort: 'name', direction: 'asc', page: 1, pageSize: 20 })
    expect(paths(UnitRegisterQuerySchema.safeParse({ sort: 'colour' }))).toEqual(['sort'])
  })
})
