import { describe, expect, it } from 'vitest'
import { UnitInputSchema } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'
import { emptyUnitDraft, unitDraftFrom, unitInputFrom } from '../../../../app/utils/unitDraft'

const unit: UnitDto = {
  id: 3, name: 'Freezer Z-3', kind: 'cascade', equipmentClass: 'ult-freezer', model: 'Icebox 9', serial: 'IB9-3', location: '',
  customer: 'C', customerId: 1, site: 'S', siteId: 2, siteAltitudeM: 0, design: { cabinetC: -80, cascadeHxC: null },
  stages: [
    { stage: 'high', refrigerant: 'R404A', chargeG: 520, volumeL: null, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: 6.2, designPressureKpa: null, meteringDevice: 'capillary' },
    { stage: 'low', refrigerant: 'R170', chargeG: 210, volumeL: 9.5, referenceStandingPressureKpa: 790, referenceAmbientC: 21, ratedCurrentA: 4.1, designPressureKpa: 2800, meteringDevice: null },
  ],
}

describe('unit form drafts', () => {
  it('round-trips a saved unit into the same request body', () => {
    const input = UnitInputSchema.parse(unitInputFrom(unitDraftFrom(unit)))
    expect(input).toMatchObject({ siteId: 2, designCabinetC: -80, designCascadeHxC: null })
    expect(input.stages).toEqual(unit.stages)
    // A stage whose metering device is not recorded shows "Not recorded" (empty) in the form and sends null.
    expect(unitDraftFrom(unit).stages.low.meteringDevice).toBe('')
    expect(unitDraftFrom(unit).stages.high.meteringDevice).toBe('capillary')
  })

  it('sends only the stages of the chosen kind and keeps the others in the draft', () => {
    const draft = unitDraftFrom(unit)
    draft.kind = 'single-stage'
    draft.stages.single = { ...draft.stages.single, refrigerant: 'R290', chargeG: '145' }
    const body = unitInputFrom(draft)
    expect(body.stages).toEqual([expect.objectContaining({ stage: 'single', refrigerant: 'R290', chargeG: 145 })])
    expect(body.designCascadeHxC).toBeNull()
    expect(draft.stages.low.chargeG).toBe('210')
  })

  it('lets the schema name unreadable numbers and a missing site', () => {
    const draft = emptyUnitDraft()
    draft.stages.high.chargeG = 'lots'
    const result = UnitInputSchema.safeParse(unitInputFrom(draft))
    const paths = result.error!.issues.map((i) => i.path.join('.'))
    expect(paths).toEqual(expect.arrayContaining(['siteId', 'stages.0.chargeG', 'stages.0.refrigerant', 'name']))
  })
})
