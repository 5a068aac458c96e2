import { describe, expect, it } from 'vitest'
import { formatZodIssues, rankRequestSchema } from '#shared/schemas/diagnosis'
import { SYMPTOMS, type RankRequest } from '#shared/types/diagnosis'

const unit = { kind: 'cascade', stages: [{ stage: 'high', refrigerant: 'R290' }, { stage: 'low', refrigerant: 'R1150', chargeG: 250, volumeL: 9.5, referenceStandingPressureKpa: 790, referenceAmbientC: 21 }], design: { cabinetC: -80, cascadeHxC: -20 } }
const messages = (input: unknown) => {
  const r = rankRequestSchema.safeParse(input)
  return r.success ? [] : formatZodIssues(r.error)
}

describe('rank request schema', () => {
  it('accepts the contract example', () => {
    const r = rankRequestSchema.safeParse({
      unit,
      symptoms: ['not-cooling'],
      readings: [{ quantity: 'suctionPressure', stage: 'low', value: 15, unit: 'psig' }],
      testResults: [{ test: 'standing-pressure-check', stage: 'low', outcome: 'low' }],
    })
    expect(r.success).toBe(true)
    // The parsed value is usable as the domain type without a cast.
    const typed: RankRequest | undefined = r.data
    expect(typed?.unit.stages[1]?.referenceStandingPressureKpa).toBe(790)
  })

  it('names an unknown symptom and lists the allowed words', () => {
    expect(messages({ unit, symptoms: ['smells-funny'] })).toEqual([`symptoms.0: Unknown symptom "smells-funny"; allowed: ${SYMPTOMS.join(', ')}`])
  })

  it('rejects unknown quantities, causes of tests and units with the allowed words', () => {
    expect(messages({ unit, readings: [{ quantity: 'headPressure', stage: 'low', value: 1, unit: 'bar' }] })[0]).toMatch(/Unknown quantity "headPressure"; allowed: suctionPressure, /)
    expect(messages({ unit, testResults: [{ test: 'sniff', outcome: 'x' }] })[0]).toMatch(/Unknown test "sniff"; allowed: standing-pressure-check/)
    expect(messages({ unit, readings: [{ quantity: 'runtime', value: 1, unit: 'h' }] })[0]).toMatch(/Unknown unit "h"; allowed: kPa, kPag/)
  })

  it('requires the unit to fit the quantity', () => {
    expect(messages({ unit, readings: [{ quantity: 'suctionPressure', stage: 'low', value: 1, unit: 'C' }] })).toEqual([
      'readings.0.unit: Unit "C" does not fit suctionPressure; allowed: kPa, kPag, bar, barg, psia, psig, MPa',
    ])
    expect(messages({ unit, readings: [{ quantity: 'compressorCurrent', stage: 'low', value: 1, unit: 'min' }] })[0]).toMatch(/allowed: A$/)
    expect(messages({ unit, readings: [{ quantity: 'compressorRunning', stage: 'low', value: 1, unit: 'bool' }] })[0]).toMatch(/true or false/)
  })

  it('needs a stage on per-stage quantities and forbids one on unit-wide quantities', () => {
    expect(messages({ unit, readings: [{ quantity: 'standingPressure', value: 1, unit: 'kPa' }] })[0]).toMatch(/measured per stage/)
    expect(messages({ unit, readings: [{ quantity: 'ambientTemperature', stage: 'low', value: 21, unit: 'C' }] })[0]).toMatch(/unit-wide; omit "stage"/)
  })

  it('checks stages against the kind of unit', () => {
    expect(messages({ unit: { kind: 'single-stage', stages: [{ stage: 'low', refrigerant: 'R290' }] } }).join('\n')).toMatch(/does not belong to a single-stage unit/)
    expect(messages({ unit: { kind: 'cascade', stages: [{ stage: 'high', refrigerant: 'R290' }] } }).join('\n')).toMatch(/needs a "low" stage/)
    expect(messages({ unit, readings: [{ quantity: 'standingPressure', stage: 'single', value: 1, unit: 'kPa' }] }).join('\n')).toMatch(/not a stage of this unit/)
  })

  it('accepts the optional rated current and rejects unknown stage fields', () => {
    expect(messages({ unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290', ratedCurrentA: 4.2 }] } })).toEqual([])
    expect(messages({ unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290', chargeg: 4 }] } })[0]).toMatch(/Unrecognized key/)
  })
})
