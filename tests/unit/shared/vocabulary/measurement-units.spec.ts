import { describe, expect, it } from 'vitest'
import { PRESSURE_UNIT_WORDS } from '#shared/utils/vocabulary'

describe('PRESSURE_UNIT_WORDS', () => {
  it('says gauge, vacuum or absolute for every unit', () => {
    for (const [unit, label] of Object.entries(PRESSURE_UNIT_WORDS)) {
      // Gauge units and inches of mercury vacuum both read against the local atmosphere.
      expect(label.gauge, unit).toBe(unit.endsWith('g') || unit === 'inHgV')
      expect(label.short, unit).toMatch(label.gauge ? /(g|vac)$/ : /(abs|a)$/)
    }
  })
})
