import { describe, expect, it } from 'vitest'
import { safetyClassTone } from '../../../../app/utils/safetyTone'

// Class meanings per ASHRAE Standard 34 (A/B toxicity, 1/2L/2/3 flammability); the colour mapping is ours.
describe('safetyClassTone', () => {
  it('reads flammable and higher-toxicity classes as danger, 2L as caution, A1 as neutral', () => {
    expect(['A3', 'A2', 'B1', 'B2L'].map(safetyClassTone)).toEqual(['danger', 'danger', 'danger', 'danger'])
    expect(safetyClassTone('A2L')).toBe('caution')
    expect(safetyClassTone('A1')).toBe('neutral')
  })
})
