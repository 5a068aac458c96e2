// What a refill does to the stage's reference standing pressure: the figures given with it become
// the reference; a new refrigerant or charge without figures clears the old one, and says so.
import { describe, expect, it } from 'vitest'
import { planRefill } from '#server/domain/equipment/nameplate'
import { NameplateRefillSchema } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'

const unit: Pick<UnitDto, 'name' | 'stages'> = {
  name: 'Freezer Z-1',
  stages: [
    { stage: 'high', refrigerant: 'R290', chargeG: 150, volumeL: null, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: 5, designPressureKpa: 2500 },
    { stage: 'low', refrigerant: 'R13', chargeG: 600, volumeL: 12, referenceStandingPressureKpa: 1050, referenceAmbientC: 22, ratedCurrentA: 3.5, designPressureKpa: 2600 },
  ],
}

describe('planRefill: the reference standing pressure', () => {
  it('takes the standing pressure and ambient given with the refill as the new reference, and keeps them on the record', () => {
    const plan = planRefill(unit, { stage: 'low', refrigerant: 'R1150', chargeG: 153.8, basis: 'standing-pressure', standingPressureKpa: 1050.1, ambientC: 22 })
    expect(plan.given).toEqual({ standingPressureKpa: 1050.1, ambientC: 22 })
    expect(plan.reference).toEqual(plan.given)
    expect(plan.warnings.join(' ')).not.toMatch(/reference standing pressure/)
  })

  it('clears a reference taken with another refrigerant or charge when no new one is given, and says why', () => {
    const plan = planRefill(unit, { stage: 'low', refrigerant: 'R1150', chargeG: 153.8, basis: 'mass' })
    expect(plan.given).toBeNull()
    expect(plan.reference).toBeNull()
    expect(plan.warnings.join(' ')).toMatch(/reference standing pressure on record \(1050 kPa abs at 22\.0 °C\) was taken with the previous fill/)
    // The same refrigerant with another charge: the old reference measured the old charge.
    expect(planRefill(unit, { stage: 'low', refrigerant: 'R13', chargeG: 500, basis: 'mass' }).reference).toBeNull()
  })

  it('keeps the reference on record when the fill stays the same (the stage topped up to its nameplate charge)', () => {
    const plan = planRefill(unit, { stage: 'low', refrigerant: 'R13', chargeG: 600, basis: 'mass' })
    expect(plan.reference).toEqual({ standingPressureKpa: 1050, ambientC: 22 })
    expect(plan.warnings).toEqual([])
  })

  it('warns when the new fill is said to stand above the stage design pressure', () => {
    const plan = planRefill(unit, { stage: 'low', refrigerant: 'R1150', chargeG: 400, basis: 'mass', standingPressureKpa: 2900, ambientC: 22 })
    expect(plan.warnings.join(' ')).toMatch(/above the stage's design pressure of 2600 kPa abs: do not charge it/)
  })

  it('the route schema wants the standing pressure and its ambient together, within range', () => {
    const base = { stage: 'low', refrigerant: 'R1150', basis: 'mass' }
    expect(NameplateRefillSchema.safeParse({ ...base, standingPressureKpa: 1050 }).error?.issues[0]?.path).toEqual(['ambientC'])
    expect(NameplateRefillSchema.safeParse({ ...base, ambientC: 22 }).error?.issues[0]?.path).toEqual(['standingPressureKpa'])
    expect(NameplateRefillSchema.safeParse({ ...base, standingPressureKpa: 0, ambientC: 22 }).success).toBe(false)
    expect(NameplateRefillSchema.safeParse({ ...base, standingPressureKpa: 1050, ambientC: 22 }).success).toBe(true)
  })
})
