import { describe, expect, it } from 'vitest'
import { inPlainWords } from '#shared/utils/vocabulary'

describe('machine words in free text', () => {
  it('become the labels of the readings they name', () => {
    expect(inPlainWords('low:suctionPressure: not derived (outside the range)')).toBe('Low stage suction pressure: not derived (outside the range)')
    expect(inPlainWords('cabinetTemperature: not derived')).toBe('Cabinet temperature: not derived')
    expect(inPlainWords('single stage: standing pressure given without ambientTemperature; it cannot be compared'))
      .toBe('single stage: standing pressure given without room (ambient) temperature; it cannot be compared')
  })
})
