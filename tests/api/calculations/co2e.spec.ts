import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

interface Co2e {
  tonnesCo2e: number | null
  gwp: number | null
  leakCheckIntervalMonths: number | null
  fGas: boolean
  text: string[]
  message?: string
  data?: { fieldErrors?: Record<string, string[]> }
}

const URL = '/api/calculations/co2e'
const post = async (body: unknown) => (await signedIn(DEMO.engineer)).post<Co2e>(URL, body)

describe('POST /api/calculations/co2e', () => {
  // Reg. (EU) 517/2014: R508B GWP 13 396 (Annex IV sum of Annex I values); 0.5 kg → 6.698 t; Art. 4(3)(a): 12 months.
  it('gives 6.698 t and a 12-month check for 500 g R508B under the 2014 regulation', async () => {
    const res = await post({ designation: 'R508B', chargeG: 500, basis: 'eu-2014' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ gwp: 13396, leakCheckIntervalMonths: 12 })
    expect(res.body.tonnesCo2e).toBeCloseTo(6.698, 6)
  })

  // Reg. (EU) 2024/573 Annex I: R508B 13 504 → 6.752 t.
  it('uses the 2024 value for the 2024 regulation', async () => {
    const res = await post({ designation: 'R508B', chargeG: 500, basis: 'eu-2024' })
    expect(res.body.gwp).toBe(13504)
    expect(res.body.tonnesCo2e).toBeCloseTo(6.752, 6)
  })

  // Reg. (EU) 517/2014 Art. 4(2); Reg. (EU) 2024/573 Art. 5(1)(a): hermetically sealed and < 10 t → no check.
  it('honours hermeticallySealed below 10 t, and halves the check frequency with a leak detection system', async () => {
    expect((await post({ designation: 'R508B', chargeG: 500, basis: 'eu-2024', hermeticallySealed: true })).body.leakCheckIntervalMonths).toBeNull()
    // 3 kg R404A = 11.77 t: sealed but over 10 t, still every 12 months; 24 with a detection system.
    expect((await post({ designation: 'R404A', chargeG: 3000, basis: 'eu-2014', hermeticallySealed: true })).body.leakCheckIntervalMonths).toBe(12)
    expect((await post({ designation: 'R404A', chargeG: 3000, basis: 'eu-2014', leakDetectionSystem: true })).body.leakCheckIntervalMonths).toBe(24)
  })

  // Hydrocarbons and natural refrigerants are outside the F-gas rules (517/2014 Annex I; 2024/573 Annexes I–III).
  it('says when a gas is outside the F-gas rules', async () => {
    const res = await post({ designation: 'R170', chargeG: 300, basis: 'eu-2024' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ fGas: false, leakCheckIntervalMonths: null })
    expect(res.body.text[0]).toMatch(/not a fluorinated greenhouse gas/)
  })

  it('answers 404 for an unknown designation and 400 for malformed input', async () => {
    expect((await post({ designation: 'R9999', chargeG: 500, basis: 'eu-2014' })).status).toBe(404)
    const cases: [string, unknown, string][] = [
      ['no basis', { designation: 'R23', chargeG: 500 }, 'basis'],
      ['unknown basis', { designation: 'R23', chargeG: 500, basis: 'eu-2030' }, 'basis'],
      ['negative charge', { designation: 'R23', chargeG: -5, basis: 'eu-2014' }, 'chargeG'],
      ['string flag', { designation: 'R23', chargeG: 5, basis: 'eu-2014', hermeticallySealed: 'yes' }, 'hermeticallySealed'],
      ['no designation', { chargeG: 5, basis: 'eu-2014' }, 'designation'],
    ]
    for (const [what, body, field] of cases) {
      const res = await post(body)
      expect(res.status, what).toBe(400)
      expect(res.body.data?.fieldErrors?.[field], what).toBeDefined()
    }
  })

  it('answers 401 when signed out', async () => {
    expect((await new ApiClient().post(URL, { designation: 'R23', chargeG: 5, basis: 'eu-2014' })).status).toBe(401)
  })
})
