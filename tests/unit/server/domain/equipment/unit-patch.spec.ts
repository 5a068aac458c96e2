import { describe, expect, it } from 'vitest'
import { mergeUnitPatch } from '#server/domain/equipment/unit-patch'
import { UnitInputSchema } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'

const saved: UnitDto = {
  id: 7, name: 'Freezer Z-1', kind: 'cascade', equipmentClass: 'ult-freezer', model: 'Icebox 9', serial: 'IB9-0001',
  location: 'Bay 1', customer: 'Test customer', customerId: 3, site: 'Test site', siteId: 4, siteAltitudeM: 10,
  design: { cabinetC: -80, cascadeHxC: -30 },
  stages: [
    { stage: 'high', refrigerant: 'R290', chargeG: 150, volumeL: null, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: 5 },
    { stage: 'low', refrigerant: 'R170', chargeG: 90, volumeL: 7, referenceStandingPressureKpa: 700, referenceAmbientC: 20, ratedCurrentA: 3.5 },
  ],
}

describe('mergeUnitPatch', () => {
  it('keeps every saved field the patch does not mention', () => {
    const merged = mergeUnitPatch(saved, { location: 'Bay 2' })
    expect(merged).toMatchObject({ name: 'Freezer Z-1', serial: 'IB9-0001', location: 'Bay 2', siteId: 4, designCabinetC: -80, designCascadeHxC: -30 })
    expect(merged.stages).toEqual(saved.stages)
    expect(UnitInputSchema.safeParse(merged).success).toBe(true)
  })

  it('lets a patch clear a design temperature with null', () => {
    expect(mergeUnitPatch(saved, { designCabinetC: null }).designCabinetC).toBeNull()
  })

  it('replaces all stages when stages are sent', () => {
    const stages = [{ stage: 'single' as const, refrigerant: 'R290', chargeG: 140 }]
    const merged = mergeUnitPatch(saved, { kind: 'single-stage', stages })
    expect(merged.stages).toEqual(stages)
    expect(merged.designCascadeHxC).toBeNull()
    expect(UnitInputSchema.safeParse(merged).success).toBe(true)
  })

  it('leaves a kind change without matching stages for the schema to refuse', () => {
    const result = UnitInputSchema.safeParse(mergeUnitPatch(saved, { kind: 'single-stage' }))
    expect(result.success).toBe(false)
    expect(result.error?.issues.map((i) => i.path.join('.'))).toContain('stages')
  })
})
