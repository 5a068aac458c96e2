import { describe, expect, it } from 'vitest'
import { inPlainWords } from '#shared/utils/vocabulary'

describe('machine words in free text', () => {
  it('become the labels of the readings they name', () => {
    expect(inPlainWords('low:suctionPressure: not derived (outside the range)')).toBe('Low stage suction pressure: not derived (outside the range)')
    expect(inPlainWords('cabinetTemperature: not derived')).toBe('Cabinet temperature: not derived')
    expect(inPlainWords('single stage: standing pressure given without ambientTemperature; it cannot be compared'))
      .toBe('single stage: standing pressure given without room (ambient) temperature; it cannot be compared')
  })

  it('put hyphenated words of causes, tests, unit kinds and equipment classes in words too', () => {
    expect(inPlainWords('Starting odds: Rimecase default weights for ult-freezer units; no closed cases of this class to learn from yet.'))
      .toBe('Starting odds: Rimecase default weights for ultra-low freezer units; no closed cases of this class to learn from yet.')
    expect(inPlainWords('for single-stage units')).toBe('for single stage units')
    expect(inPlainWords('standing-pressure-check ruled out refrigerant-leak')).toBe('Standing pressure check ruled out refrigerant leak')
    expect(inPlainWords('other causes on a cascade')).toBe('other causes on a cascade')
  })
})
