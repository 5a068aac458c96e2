import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

interface LeakRate {
  leakRatePercent: number
  method: string
  working: string
  assessment?: { applies: boolean | null; thresholdPercent: number | null; exceedsThreshold: boolean | null; text: string[] }
  message?: string
  data?: { fieldErrors?: Record<string, string[]> }
}

const URL = '/api/calculations/leak-rate'
const LB = 453.59237 // g per lb, exact
const post = async (body: unknown) => (await signedIn(DEMO.tech)).post<LeakRate>(URL, body)

describe('POST /api/calculations/leak-rate', () => {
  // 40 CFR 82.152, annualizing method: (10/100) / (180/365) × 100 = 20.28 % per year.
  it('annualizes: 10 lb into 100 lb after 180 days is 20.28 %', async () => {
    const res = await post({ method: 'annualizing', addedG: 10 * LB, fullChargeG: 100 * LB, daysSinceLastAddition: 180 })
    expect(res.status).toBe(200)
    expect(res.body.leakRatePercent).toBeCloseTo(20.2778, 3)
    expect(res.body.assessment).toBeUndefined()
  })

  // 40 CFR 82.152, annualizing step 2: the shorter of the days since the last addition or 365.
  it('caps the days at 365', async () => {
    const res = await post({ method: 'annualizing', addedG: 2000, fullChargeG: 50_000, daysSinceLastAddition: 400 })
    expect(res.body.leakRatePercent).toBeCloseTo(4, 6)
  })

  // 40 CFR 82.152, rolling average method: (3 + 2 + 4) lb / 60 lb × 100 = 15 %.
  it('averages over the past 365 days', async () => {
    const res = await post({ method: 'rolling-average', addedLast365DaysG: 9 * LB, fullChargeG: 60 * LB })
    expect(res.status).toBe(200)
    expect(res.body.leakRatePercent).toBeCloseTo(15, 6)
  })

  // 40 CFR 82.157(c)(2)(i): 20 % for commercial refrigeration, R22 from 50 lb.
  it('judges the rate against the limit when the refrigerant and appliance type are given', async () => {
    const res = await post({ method: 'annualizing', addedG: 10 * LB, fullChargeG: 100 * LB, daysSinceLastAddition: 180, designation: 'R22', applianceType: 'commercial-refrigeration', date: '2026-02-01' })
    expect(res.body.assessment).toMatchObject({ applies: true, thresholdPercent: 20, exceedsThreshold: true })
    // 40 CFR 84.106: only from 15 lb; a 500 g R508B ULT stage is far below.
    const ult = await post({ method: 'rolling-average', addedLast365DaysG: 200, fullChargeG: 500, designation: 'R508B', applianceType: 'other', date: '2026-02-01' })
    expect(ult.body.assessment?.applies).toBe(false)
    expect(ult.body.assessment?.text.join(' ')).toMatch(/15 lb/)
  })

  it('answers 404 naming the field for an unknown refrigerant or jurisdiction', async () => {
    const gas = await post({ method: 'rolling-average', addedLast365DaysG: 200, fullChargeG: 500, designation: 'R9999' })
    expect(gas.status).toBe(404)
    expect(gas.body.data?.fieldErrors?.designation).toBeDefined()
    const place = await post({ method: 'rolling-average', addedLast365DaysG: 200, fullChargeG: 500, jurisdiction: 'atlantis' })
    expect(place.status).toBe(404)
    expect(place.body.data?.fieldErrors?.jurisdiction).toBeDefined()
  })

  it('answers 400 with field errors for malformed input', async () => {
    const cases: [string, unknown, string][] = [
      ['no method', { addedG: 1, fullChargeG: 10, daysSinceLastAddition: 5 }, 'method'],
      ['unknown method', { method: 'monthly', addedG: 1, fullChargeG: 10 }, 'method'],
      ['zero full charge', { method: 'annualizing', addedG: 1, fullChargeG: 0, daysSinceLastAddition: 5 }, 'fullChargeG'],
      ['zero days', { method: 'annualizing', addedG: 1, fullChargeG: 10, daysSinceLastAddition: 0 }, 'daysSinceLastAddition'],
      ['negative addition', { method: 'annualizing', addedG: -1, fullChargeG: 10, daysSinceLastAddition: 5 }, 'addedG'],
      ['string number', { method: 'rolling-average', addedLast365DaysG: '5', fullChargeG: 10 }, 'addedLast365DaysG'],
      ['missing rolling sum', { method: 'rolling-average', fullChargeG: 10 }, 'addedLast365DaysG'],
      ['annualizing fields with the rolling method', { method: 'rolling-average', addedG: 1, fullChargeG: 10, daysSinceLastAddition: 5 }, 'addedLast365DaysG'],
      ['bad appliance type', { method: 'rolling-average', addedLast365DaysG: 5, fullChargeG: 10, applianceType: 'lab-freezer' }, 'applianceType'],
      ['bad date', { method: 'rolling-average', addedLast365DaysG: 5, fullChargeG: 10, date: '01/02/2026' }, 'date'],
    ]
    for (const [what, body, field] of cases) {
      const res = await post(body)
      expect(res.status, what).toBe(400)
      expect(res.body.data?.fieldErrors?.[field], what).toBeDefined()
    }
    // A form-encoded body is refused by its type before it is read.
    expect((await post('addedG=1')).status).toBe(415)
  })

  it('answers 401 when signed out', async () => {
    expect((await new ApiClient().post(URL, { method: 'rolling-average', addedLast365DaysG: 1, fullChargeG: 10 })).status).toBe(401)
  })
})
