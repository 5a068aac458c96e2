import { describe, expect, it } from 'vitest'
import { BadInputError, ConflictError } from '#server/domain/errors'
import { assertWritable, planAddendum, planClosing, planNote, planReadings, planSymptoms, planTestResult, type CurrentCase } from '#server/domain/cases/case-changes'
import type { UnitDto } from '#shared/types/equipment-dto'

const unit: UnitDto = {
  id: 3, name: 'Freezer Q-17', kind: 'cascade', equipmentClass: 'ult-freezer', model: 'Icebox 9', serial: 'IB9-1', location: '', customer: 'Harbour Cryo',
  customerId: 1, siteId: 1, site: 'Quay lab', siteAltitudeM: 0, design: { cabinetC: -86, cascadeHxC: -35 },
  stages: [
    { stage: 'high', refrigerant: 'R404A', chargeG: 400, volumeL: 8, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: null },
    { stage: 'low', refrigerant: 'R170', chargeG: 90, volumeL: 7.5, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: null },
  ],
}
const current: CurrentCase = { status: 'open', lockVersion: 4, symptoms: [], readings: [], testResults: [], notes: 'First look: door closes.' }
const now = new Date('2026-12-02T13:05:00Z')

describe('planning a change to a case', () => {
  it('appends readings stamped with when and by whom, one timeline event each, and asks to rank again', () => {
    const plan = planReadings(unit, current, [{ quantity: 'suctionPressure', stage: 'low', value: 15, unit: 'psig' }, { quantity: 'cabinetTemperature', value: -41, unit: 'C' }], 9, now, { atmosphericKpa: 101.325 })
    expect(plan.changes.readings).toEqual([
      { quantity: 'suctionPressure', stage: 'low', value: 15, unit: 'psig', at: now.toISOString(), by: 9 },
      { quantity: 'cabinetTemperature', value: -41, unit: 'C', at: now.toISOString(), by: 9 },
    ])
    expect(plan.events.map((e) => e.type)).toEqual(['reading-entered', 'reading-entered'])
    expect(plan.rerank).toBe(true)
  })

  it('refuses a stage the unit does not have, with a field error per item and the stages named in words', () => {
    let error: unknown
    try {
      planTestResult(unit, current, { test: 'standing-pressure-check', stage: 'single', outcome: 'low' }, 9, now)
    } catch (e) {
      error = e
    }
    expect(error).toBeInstanceOf(BadInputError)
    expect((error as BadInputError).fieldErrors).toEqual({ 'testResults.0.stage': ['Single stage is not a stage of Freezer Q-17; it has High stage and Low stage'] })
    expect((error as BadInputError).message).toBe('Test result 1: single stage is not a stage of Freezer Q-17; it has High stage and Low stage')
  })

  it('keeps symptoms unique, appends notes, and takes addenda only on closed cases', () => {
    expect(planSymptoms(['not-cooling', 'not-cooling', 'frost-on-capillary']).changes.symptoms).toEqual(['not-cooling', 'frost-on-capillary'])
    expect(planNote(current, 'Fan blade cracked.').changes.notes).toBe('First look: door closes.\n\nFan blade cracked.')
    expect(() => planAddendum(current, 'Called back')).toThrow(ConflictError)
    expect(planAddendum({ status: 'closed' }, 'Called back')).toEqual([{ type: 'addendum', payload: { text: 'Called back' } }])
  })

  it('refuses changes to a closed case and to an outdated copy', () => {
    expect(() => assertWritable({ status: 'closed', lockVersion: 4 }, undefined)).toThrow(/closed/)
    expect(() => assertWritable(current, 3)).toThrow(/changed by someone else/)
    expect(() => assertWritable(current, 4)).not.toThrow()
    expect(() => assertWritable(current, undefined)).not.toThrow()
  })

  it('closes with the findings and refuses a refrigerant Rimecase does not know, naming the line', () => {
    const closing = planClosing(unit, { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }], workDone: 'Brazed the flare.', refrigerantTransactions: [{ stage: 'low', refrigerant: 'R170', grams: 205, direction: 'added' }] }, 9, now)
    expect(closing.changes).toMatchObject({ status: 'closed', confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }], closedAt: now })
    expect(closing.closure.refrigerantTransactions).toEqual([{ stage: 'low', refrigerant: 'R170', grams: 205, direction: 'added', cylinder: '' }])
    expect(closing.rerank).toBe(false)
    expect(() => planClosing(unit, { confirmedCauses: [{ cause: 'other' }], workDone: 'x', refrigerantTransactions: [{ stage: 'low', refrigerant: 'R9999', grams: 5, direction: 'added' }] }, 9, now))
      .toThrow('Refrigerant added or recovered, line 1, refrigerant: R9999 is not a refrigerant Rimecase knows')
  })
})
