import { describe, expect, it } from 'vitest'
import { factChoices, formatConditionValue, parseConditionValue } from '~/utils/conditionValue'

describe('condition values in the structured editor', () => {
  it('reads text back in the shape each operator needs', () => {
    expect(parseConditionValue('360', 'greaterThan', 'number')).toBe(360)
    expect(parseConditionValue('360, 2000', 'between', 'number')).toEqual([360, 2000])
    expect(parseConditionValue('-5,5', 'outside', 'number')).toEqual([-5, 5])
    expect(parseConditionValue('true', 'equal', 'boolean')).toBe(true)
    expect(parseConditionValue('false', 'equal', undefined)).toBe(false)
    expect(parseConditionValue('R170, R1150', 'in', 'string')).toEqual(['R170', 'R1150'])
    expect(parseConditionValue('standing', 'equal', 'string')).toBe('standing')
    expect(parseConditionValue('12', 'equal', 'string')).toBe('12')
  })

  it('shows values as text and round-trips them', () => {
    for (const [value, op, type] of [[[360, 2000], 'between', 'number'], [4.5, 'lessThan', 'number'], [true, 'equal', 'boolean'], [['a', 'b'], 'notIn', 'string']] as const) {
      expect(parseConditionValue(formatConditionValue(value), op, type)).toEqual(value)
    }
  })

  it('offers per-stage facts as {stage}.x besides the concrete names', () => {
    expect(factChoices(['low.superheatK', 'high.superheatK', 'cabinetAboveTargetK'])).toEqual(['{stage}.superheatK', 'cabinetAboveTargetK', 'high.superheatK', 'low.superheatK'])
  })
})
