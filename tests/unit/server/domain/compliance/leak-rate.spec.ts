import { describe, expect, it } from 'vitest'
import { annualizingLeakRate, assessLeakRate, governingRule, rollingAverageLeakRate } from '#server/domain/compliance/leak-rate'
import { BadInputError, NotFoundError } from '#server/domain/errors'

const LB = 453.59237 // grams per avoirdupois pound (exact by definition)

describe('annualizingLeakRate (40 CFR 82.152 "leak rate", annualizing method)', () => {
  // Worked example by the regulation's own four steps: 10 lb into a 100 lb full charge 180 days after the
  // last addition: (10/100) / (180/365) × 100 = 20.277…% per year.
  it('annualizes a 10 lb addition to a 100 lb charge after 180 days: 20.28 %', () => {
    const r = annualizingLeakRate(10 * LB, 100 * LB, 180)
    expect(r.leakRatePercent).toBeCloseTo(20.2778, 4)
    expect(r.daysUsed).toBe(180)
    expect(r.working).toContain('= 20.28 % per year')
  })

  // 40 CFR 82.152, step 1 to 4: 2 lb into 50 lb after 30 days: (2/50)/(30/365) × 100 = 48.67 %.
  it('gives 48.67 % for 2 lb into 50 lb after 30 days', () => {
    expect(annualizingLeakRate(2 * LB, 50 * LB, 30).leakRatePercent).toBeCloseTo(48.6667, 4)
  })

  // 40 CFR 82.152, step 2: "the shorter of the number of days ... or 365 days".
  it('caps the days at 365: 2 lb into 50 lb, last addition 400 days ago, is 4 %', () => {
    const r = annualizingLeakRate(2 * LB, 50 * LB, 400)
    expect(r.leakRatePercent).toBe(4)
    expect(r.daysUsed).toBe(365)
    expect(r.working).toMatch(/capped at 365/)
  })

  it('is unit-free: grams give the same rate as pounds (ratio of masses; physics, no source needed)', () => {
    expect(annualizingLeakRate(10, 100, 180).leakRatePercent).toBe(annualizingLeakRate(10 * LB, 100 * LB, 180).leakRatePercent)
  })

  it('refuses a zero charge, zero days or a negative addition', () => {
    expect(() => annualizingLeakRate(10, 0, 30)).toThrow(BadInputError)
    expect(() => annualizingLeakRate(10, 100, 0)).toThrow(BadInputError)
    expect(() => annualizingLeakRate(-1, 100, 30)).toThrow(BadInputError)
  })
})

describe('rollingAverageLeakRate (40 CFR 82.152 "leak rate", rolling average method)', () => {
  // 3 + 2 + 4 lb added within 365 days to a 60 lb charge: 9/60 × 100 = 15 %.
  it('sums the past 365 days: 9 lb into a 60 lb charge is exactly 15 %', () => {
    const r = rollingAverageLeakRate((3 + 2 + 4) * LB, 60 * LB)
    expect(r.leakRatePercent).toBe(15)
    expect(r.method).toBe('rolling-average')
  })
})

describe('assessLeakRate against the US limits (40 CFR 82.157(a), (c)(2); 40 CFR 84.106)', () => {
  const base = { jurisdiction: 'us-federal', date: '2026-03-01' } as const

  // 82.157(c)(2)(i): 20 % for commercial refrigeration; (a): 50 lb or more of class I/II refrigerant.
  it('flags 20.28 % on a 100 lb R22 commercial system as over the 20 % limit', () => {
    const a = assessLeakRate(20.2778, { ...base, designation: 'R22', fullChargeG: 100 * LB, applianceType: 'commercial-refrigeration' })
    expect(a).toMatchObject({ applies: true, thresholdPercent: 20, exceedsThreshold: true, repairWithinDays: 30 })
    expect(a.rule?.citation).toMatch(/82\.157/)
    expect(a.text.join(' ')).toMatch(/exceeds the 20 % limit/)
  })

  // 82.157(c)(2)(ii) 30 % industrial process refrigeration; (iii) 10 % comfort cooling and other.
  it('uses 30 % for industrial process refrigeration and 10 % for comfort cooling', () => {
    const ipr = assessLeakRate(25, { ...base, designation: 'R22', fullChargeG: 60 * LB, applianceType: 'industrial-process-refrigeration' })
    expect(ipr).toMatchObject({ thresholdPercent: 30, exceedsThreshold: false })
    const cc = assessLeakRate(12, { ...base, designation: 'R22', fullChargeG: 60 * LB, applianceType: 'comfort-cooling' })
    expect(cc).toMatchObject({ thresholdPercent: 10, exceedsThreshold: true })
  })

  it('does not count a rate equal to the limit as over it (82.157(c)(1): "a leak rate over the applicable leak rate")', () => {
    expect(assessLeakRate(20, { ...base, designation: 'R22', fullChargeG: 100 * LB, applianceType: 'commercial-refrigeration' }).exceedsThreshold).toBe(false)
  })

  // 82.157(a): as of 10 April 2020 only 50 lb or more of class I/II refrigerant.
  it('says the rule does not apply below 50 lb of R22', () => {
    const a = assessLeakRate(80, { ...base, designation: 'R22', fullChargeG: 20 * LB, applianceType: 'commercial-refrigeration' })
    expect(a.applies).toBe(false)
    expect(a.text[0]).toMatch(/only from a full charge of 50 lb/)
  })

  // 84.106 (from 1 Jan 2026): 15 lb or more of a refrigerant containing an HFC. A lab ULT freezer's
  // low stage of 0.5 kg R508B is far below 15 lb.
  it('says a 500 g R508B ULT stage is below the 15 lb threshold of Part 84', () => {
    const a = assessLeakRate(40, { ...base, designation: 'R508B', fullChargeG: 500, applianceType: 'other' })
    expect(a.applies).toBe(false)
    expect(a.rule?.citation).toBe('40 CFR 84.106')
    expect(a.text[0]).toMatch(/15 lb/)
  })

  it('applies Part 84 to 20 lb of R404A in commercial refrigeration from 2026 but not in 2025', () => {
    const in2026 = assessLeakRate(25, { ...base, designation: 'R404A', fullChargeG: 20 * LB, applianceType: 'commercial-refrigeration' })
    expect(in2026).toMatchObject({ applies: true, thresholdPercent: 20, exceedsThreshold: true })
    const in2025 = assessLeakRate(25, { ...base, date: '2025-06-01', designation: 'R404A', fullChargeG: 20 * LB, applianceType: 'commercial-refrigeration' })
    expect(in2025.applies).toBe(false)
    expect(in2025.text.join(' ')).toMatch(/HFC/)
  })

  // 84.106(a): substitutes count only with a GWP above 53; ethane (GWP 6, Reg. (EU) 517/2014 Annex IV) does not.
  it('leaves ethane out of Part 84 because its GWP is not above 53', () => {
    const a = assessLeakRate(50, { ...base, designation: 'R170', fullChargeG: 30 * LB, applianceType: 'other' })
    expect(a.applies).toBe(false)
    expect(a.text.join(' ')).toMatch(/GWP of 6, not above 53/)
  })

  it('names the limits when the appliance type is not given, and the rules when the refrigerant is not', () => {
    const noType = assessLeakRate(25, { ...base, designation: 'R22', fullChargeG: 60 * LB })
    expect(noType).toMatchObject({ applies: true, thresholdPercent: null, exceedsThreshold: null })
    expect(noType.text.join(' ')).toMatch(/20 % commercial refrigeration/)
    const noGas = assessLeakRate(25, { ...base, fullChargeG: 60 * LB, applianceType: 'other' })
    expect(noGas.applies).toBeNull()
  })

  it('knows no leak-rate limit in the EU and refuses unknown refrigerants and jurisdictions', () => {
    const eu = assessLeakRate(25, { jurisdiction: 'eu', date: '2026-01-01', designation: 'R404A', fullChargeG: 20_000 })
    expect(eu.applies).toBe(false)
    expect(eu.text[0]).toMatch(/no leak-rate limit/)
    expect(() => assessLeakRate(25, { ...base, designation: 'R9999', fullChargeG: 1000 })).toThrow(NotFoundError)
    expect(() => assessLeakRate(25, { ...base, jurisdiction: 'atlantis', fullChargeG: 1000 })).toThrow(NotFoundError)
  })

  it('finds the governing rule for a stage', () => {
    expect(governingRule({ ...base, designation: 'R22', fullChargeG: 60 * LB })?.id).toBe('epa-82-157-ods')
    expect(governingRule({ ...base, designation: 'R404A', fullChargeG: 16 * LB })?.id).toBe('epa-84-106')
    expect(governingRule({ ...base, designation: 'R404A', fullChargeG: 14 * LB })).toBeUndefined()
  })
})
