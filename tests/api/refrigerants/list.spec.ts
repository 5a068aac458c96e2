import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

// The designations outside scripts rely on: the usual fills of cascade and single-stage units, and the
// original CFC fills (R13, R12, R503) that substitution plans start from.
const REQUIRED = ['R1150', 'R170', 'R290', 'R600a', 'R1270', 'R50', 'R14', 'R23', 'R116', 'R508B', 'R404A', 'R507A', 'R134a', 'R22', 'R410A', 'R744', 'R717', 'R13', 'R12', 'R503']

interface Refrigerant {
  designation: string
  name: string
  safetyClass: string
  gwpAR4: number | null
  gwpAR5: number | null
  kind: 'pure' | 'blend'
  criticalTemperatureC: number
  criticalPressureKpa: number
  normalBoilingPointC: number
  validRange: { minC: number; maxC: number }
  cautions: string[]
  flammable: boolean
}

describe('GET /api/refrigerants', () => {
  it('answers 401 when signed out', async () => {
    const res = await new ApiClient().get<{ message: string }>('/api/refrigerants')
    expect(res.status).toBe(401)
  })

  it('lists all 20 designations with the public fields', async () => {
    const tech = await signedIn(DEMO.tech)
    const res = await tech.get<Refrigerant[]>('/api/refrigerants')
    expect(res.status).toBe(200)
    expect(res.body.map((r) => r.designation)).toEqual(expect.arrayContaining(REQUIRED))
    for (const r of res.body) {
      expect(r).toMatchObject({
        designation: expect.any(String), name: expect.any(String), safetyClass: expect.stringMatching(/^[AB][123]L?$/),
        kind: expect.stringMatching(/^(pure|blend)$/), criticalTemperatureC: expect.any(Number),
        criticalPressureKpa: expect.any(Number), normalBoilingPointC: expect.any(Number),
      })
      expect(r.gwpAR4 === null || typeof r.gwpAR4 === 'number').toBe(true)
      expect(r.gwpAR5 === null || typeof r.gwpAR5 === 'number').toBe(true)
      expect(r.cautions.length).toBeGreaterThan(0)
    }
  })

  it('gives known identity and safety data', async () => {
    const tech = await signedIn(DEMO.trainer)
    const list = (await tech.get<Refrigerant[]>('/api/refrigerants')).body
    const ethane = list.find((r) => r.designation === 'R170')!
    // ASHRAE 34 safety class of ethane (A3) and its critical temperature 32.17 °C (Bücker & Wagner 2006, via CoolProp 8.0.0).
    expect(ethane).toMatchObject({ name: 'ethane', safetyClass: 'A3', kind: 'pure', flammable: true })
    expect(ethane.criticalTemperatureC).toBeCloseTo(32.17, 1)
    // R404A is an R125/R143a/R134a blend (ASHRAE 34 composition, from memory).
    expect(list.find((r) => r.designation === 'R404A')).toMatchObject({ kind: 'blend', safetyClass: 'A1' })
    // R13: A1 (ASHRAE 34, from memory); critical point of the Platzer et al. 1990 EOS 303.05 K (CoolProp 8.0.0).
    expect(list.find((r) => r.designation === 'R13')).toMatchObject({ name: 'chlorotrifluoromethane', safetyClass: 'A1', kind: 'pure' })
    expect(list.find((r) => r.designation === 'R13')!.criticalTemperatureC).toBeCloseTo(29.9, 1)
    // R12: normal boiling point 243.398 K (Marx et al. 1992 EOS).
    expect(list.find((r) => r.designation === 'R12')!.normalBoilingPointC).toBeCloseTo(-29.75, 1)
  })
})

describe('GET /api/refrigerants/{designation}', () => {
  it('answers one refrigerant, also for a loosely typed designation', async () => {
    const tech = await signedIn(DEMO.tech)
    const res = await tech.get<Refrigerant>('/api/refrigerants/r-23')
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ designation: 'R23', kind: 'pure' })
    expect(res.body.validRange.maxC).toBeCloseTo(res.body.criticalTemperatureC, 6)
  })

  it('answers 404 naming an unknown designation', async () => {
    const tech = await signedIn(DEMO.tech)
    const res = await tech.get<{ message: string }>('/api/refrigerants/R9999')
    expect(res.status).toBe(404)
    expect(res.body.message).toContain('R9999')
  })

  it('answers 401 when signed out', async () => {
    expect((await new ApiClient().get('/api/refrigerants/R170')).status).toBe(401)
  })
})
