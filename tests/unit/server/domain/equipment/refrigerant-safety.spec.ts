import { describe, expect, it } from 'vitest'
import { refrigerantSafety } from '#server/domain/equipment/refrigerant-safety'

describe('refrigerantSafety', () => {
  // Safety classes per ASHRAE Standard 34 (ethane A3, R404A A1, ammonia B2L).
  it('gives class and cautions once per refrigerant and skips unknown designations', () => {
    const facts = refrigerantSafety(['R404A', 'R170', 'R170', 'R717', 'R999'])
    expect(facts.map((f) => [f.designation, f.safetyClass])).toEqual([['R404A', 'A1'], ['R170', 'A3'], ['R717', 'B2L']])
    expect(facts.find((f) => f.designation === 'R170')).toMatchObject({ flammable: true, toxic: false })
    expect(facts.find((f) => f.designation === 'R170')!.cautions.join(' ')).toMatch(/Flammable/)
  })
})
