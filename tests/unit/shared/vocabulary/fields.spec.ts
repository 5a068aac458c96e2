import { describe, expect, it } from 'vitest'
import { fieldMessage, fieldName } from '#shared/utils/vocabulary'

describe('field names in messages', () => {
  it('name a field of a list line in words', () => {
    expect(fieldMessage(['refrigerantTransactions', 1, 'grams'], 'Grams must be a number')).toBe('Refrigerant added or recovered, line 2: grams must be a number')
    expect(fieldMessage(['readings', 0, 'value'], 'Invalid input: expected number, received string')).toBe('Reading 1, value: invalid input: expected number, received string')
    expect(fieldMessage(['stages', 1, 'chargeG'], 'Charge must be between 1 and 500 000 g')).toBe('Stage 2: charge must be between 1 and 500 000 g')
  })

  it('keep a message that already names its top-level field, and keep capitals of symbols', () => {
    expect(fieldMessage(['complaint'], 'Describe the complaint in a few words')).toBe('Complaint: describe the complaint in a few words')
    expect(fieldMessage(['name'], 'Name is too short')).toBe('Name is too short')
    expect(fieldMessage(['refrigerantTransactions', 0, 'refrigerant'], 'R9999 is not a known refrigerant')).toBe('Refrigerant added or recovered, line 1, refrigerant: R9999 is not a known refrigerant')
    expect(fieldMessage([], 'Malformed request')).toBe('Malformed request')
  })

  it('never show an API field name', () => {
    expect(fieldName(['confirmedCauses', 0, 'stage'])).toBe('Confirmed cause 1, stage')
    expect(fieldName(['someNewField'])).toBe('Some new field')
  })
})
