import { describe, expect, it } from 'vitest'
import { CloseCaseSchema } from '#shared/schemas/cases'
import { rankRequestSchema } from '#shared/schemas/diagnosis'
import { zodFieldErrors, zodMessages, zodSummary } from '#shared/utils/input-errors'

describe('field errors from zod', () => {
  const bad = CloseCaseSchema.safeParse({
    confirmedCauses: [],
    workDone: 'x',
    refrigerantTransactions: [{ stage: 'low', refrigerant: 'R170', grams: 5, direction: 'added' }, { stage: 'low', refrigerant: 'R170', grams: Number.NaN, direction: 'added' }],
  })

  it('key each message by its dotted field path, as forms and the API expect', () => {
    expect(bad.success).toBe(false)
    const errors = zodFieldErrors(bad.error!)
    expect(errors.confirmedCauses).toEqual(['Confirm at least one cause (or "other")'])
    expect(errors.workDone).toEqual(['Describe the work done'])
    expect(errors['refrigerantTransactions.1.grams']).toEqual(['Grams must be a number'])
  })

  it('name each field in words for a summary or a list', () => {
    expect(zodMessages(bad.error!)).toContain('Refrigerant added or recovered, line 2: grams must be a number')
    expect(zodSummary(bad.error!)).toMatch(/ \(and 2 more\)$/)
  })

  it('unfold union problems into the fields they concern', () => {
    const result = rankRequestSchema.safeParse({ unit: { kind: 'cascade', stages: [{ stage: 'low', refrigerant: 'R170' }] }, readings: [{ quantity: 'suctionPressure', stage: 'low', value: 'ten', unit: 'psig' }] })
    expect(result.success).toBe(false)
    expect(Object.keys(zodFieldErrors(result.error!)).some((k) => k.startsWith('readings.0'))).toBe(true)
    expect(zodSummary(result.error!)).not.toMatch(/readings\.0/)
  })
})
