import { describe, expect, it } from 'vitest'
import { PRESSURE_UNIT_WORDS } from '#shared/utils/vocabulary'

describe('PRESSURE_UNIT_WORDS', () => {
  it('says gauge or absolute for every unit', () => {
    for (const [unit, label] of Object.entries(PRESSURE_UNIT_WORDS)) {
      expect(label.gauge, unit).toBe(unit.endsWith('g'))
      expect(label.short, unit).toMatch(label.gauge ? /g$/ : /(abs|a)$/)
    }
  })
})
