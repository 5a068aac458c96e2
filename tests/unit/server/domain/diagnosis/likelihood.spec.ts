import { describe, expect, it } from 'vitest'
import { anyDensity, bandLikelihoods, bandOf, checkTable, erfc, normalInterval, orderBands, resolveEntry, tableKeyProblems } from '#server/domain/diagnosis/likelihood'

describe('normal distribution helpers', () => {
  it('erfc matches tabulated values (Abramowitz & Stegun 1964, table 7.1)', () => {
    expect(erfc(0)).toBeCloseTo(1, 7)
    expect(erfc(0.5)).toBeCloseTo(0.4795001222, 6)
    expect(erfc(1)).toBeCloseTo(0.1572992071, 6)
    expect(erfc(2)).toBeCloseTo(0.004677734981, 8)
    expect(erfc(-1)).toBeCloseTo(1.8427007929, 6)
  })

  it('keeps relative precision in the far tail, where likelihood ratios are decided', () => {
    // erfc(5) = 1.5374597944e-12 (Abramowitz & Stegun 1964, table 7.1)
    expect(erfc(5) / 1.5374597944e-12).toBeCloseTo(1, 5)
    // P(6σ < X < 7σ) = Q(6) − Q(7) = 9.8659e-10 − 1.28e-12 (standard normal tail values)
    expect(normalInterval(6, 7) / (9.8658765e-10 - 1.279813e-12)).toBeCloseTo(1, 4)
    expect(normalInterval(-Infinity, Infinity)).toBeCloseTo(1, 12)
    expect(normalInterval(-1, 1)).toBeCloseTo(0.682689492, 6)
  })
})

describe('graded likelihood of bands', () => {
  const bands = orderBands({ low: [-25, -4], normal: [-4, 4], high: [4, 20] })

  it('orders bands and finds the band of a value', () => {
    expect(bands.names).toEqual(['low', 'normal', 'high'])
    expect(bandOf(bands, -10)).toBe('low')
    expect(bandOf(bands, 0)).toBe('normal')
    expect(bandOf(bands, 4)).toBe('high')
    expect(anyDensity(bands)).toBeCloseTo(1 / 45, 12)
  })

  it('is smooth across a band edge: a value on the edge counts half for each side', () => {
    const [low, normal] = bandLikelihoods(bands, -4, 1.5)
    expect((low as number) * 21).toBeCloseTo(0.5, 6)
    expect((normal as number) * 8).toBeCloseTo(0.5 - (1 - 0.5 * erfc(-8 / 1.5 / Math.SQRT2)), 3)
    // A value a hair either side of an edge gives nearly the same answer: no step on noise.
    const at = (r: number) => bandLikelihoods(bands, r, 1.5)
    const a = at(-3.99)
    const b = at(-4.01)
    expect(Math.abs(((a[0] as number) - (b[0] as number)) / (a[0] as number))).toBeLessThan(0.02)
    expect(Math.abs(((a[1] as number) - (b[1] as number)) / (a[1] as number))).toBeLessThan(0.02)
  })

  it('keeps open outer bands flat beyond their declared range', () => {
    const far = bandLikelihoods(bands, -60, 1.5)
    expect((far[0] as number) * 21).toBeCloseTo(1, 6)
    expect(far[1] as number).toBeLessThan(1e-8)
  })
})

describe('likelihood tables', () => {
  const table = { healthy: 0.9, default: 0.5, other: 0.3, 'refrigerant-leak': 0.8, 'refrigerant-leak@low': 0.95, 'condenser-airflow@other': 0.7, 'high-heat-load@cabinet': 0.6 }

  it('resolves a cause on the finding’s stage, a stage variant, a coupled cause on the other stage and the rest', () => {
    expect(resolveEntry(table, { cause: 'refrigerant-leak', stage: 'high' }, 'high', 'cascade')).toBe(0.8)
    expect(resolveEntry(table, { cause: 'refrigerant-leak', stage: 'low' }, 'low', 'cascade')).toBe(0.95)
    // A leak on the high stage leaves the low stage healthy for a low-stage finding.
    expect(resolveEntry(table, { cause: 'refrigerant-leak', stage: 'high' }, 'low', 'cascade')).toBe(0.9)
    expect(resolveEntry(table, { cause: 'condenser-airflow', stage: 'high' }, 'low', 'cascade')).toBe(0.7)
    expect(resolveEntry(table, { cause: 'restriction', stage: 'low' }, 'low', 'cascade')).toBe(0.5)
    expect(resolveEntry(table, { cause: 'high-heat-load', stage: 'single' }, 'single', 'single-stage')).toBe(0.6)
    expect(resolveEntry(table, { cause: 'no-refrigeration-fault' }, 'low', 'cascade')).toBe(0.9)
    expect(resolveEntry(table, { cause: 'other' }, 'low', 'cascade')).toBe(0.3)
    // A unit-wide finding applies named causes on any stage.
    expect(resolveEntry(table, { cause: 'refrigerant-leak', stage: 'high' }, undefined, 'cascade')).toBe(0.8)
  })

  it('requires healthy, default and other, and names unknown keys', () => {
    expect(tableKeyProblems({ other: 0.1 }).map(([p]) => p[0])).toEqual(['healthy', 'default'])
    expect(tableKeyProblems({ healthy: 1, default: 1, other: 1, gremlins: 1 })[0]?.[1]).toMatch(/unknown key "gremlins"/)
    expect(tableKeyProblems({ healthy: 1, default: 1, other: 1, 'restriction@middle': 1 })[0]?.[1]).toMatch(/unknown stage "middle"/)
  })

  it('checks that outcome tables give every hypothesis a distribution', () => {
    const ok = [
      { healthy: 0.9, default: 0.9, 'refrigerant-leak': 0.2, other: 0.8 },
      { healthy: 0.1, default: 0.1, 'refrigerant-leak': 0.8, other: 0.2 },
    ]
    expect(checkTable(ok, 0.02)).toEqual([])
    const broken = [{ ...ok[0], 'refrigerant-leak': 0.5 }, ok[1] as Record<string, number>]
    expect(checkTable(broken, 0.02).join('\n')).toMatch(/refrigerant-leak on the tested stage .* sum to 1\.300/)
  })
})
