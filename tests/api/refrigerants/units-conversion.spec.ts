import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

interface Conversion { result: number; atmosphericKpa?: number; message?: string; data?: { fieldErrors?: Record<string, string[]> } }

describe('GET /api/units-conversion', () => {
  it('converts gauge pressures with the standard or a site atmosphere, and temperatures', async () => {
    const tech = await signedIn(DEMO.tech)
    // 15 psig = 15 × 6.894757 kPa (NIST SP 811) + 101.325 kPa (ISO 2533 sea level) = 204.746 kPa abs
    const psig = await tech.get<Conversion>('/api/units-conversion?value=15&from=psig&to=kPa')
    expect(psig.status).toBe(200)
    expect(psig.body.result).toBeCloseTo(204.746, 2)
    // ISO 2533 troposphere at 1450 m: 85.076 kPa, so 0 barg there is 0.85076 bar abs
    const high = await tech.get<Conversion>('/api/units-conversion?value=0&from=barg&to=bar&altitudeM=1450')
    expect(high.body.atmosphericKpa).toBeCloseTo(85.076, 2)
    expect(high.body.result).toBeCloseTo(0.85076, 4)
    const f = await tech.get<Conversion>('/api/units-conversion?value=-40&from=C&to=F')
    expect(f.body.result).toBeCloseTo(-40, 9) // −40 °C = −40 °F (definition of the scales)
  })

  it('converts the vacuum units of evacuation: micron, mbar, Pa and inHg vacuum', async () => {
    const tech = await signedIn(DEMO.tech)
    // 500 micron = 0.5 mmHg × 133.322387 Pa (conventional millimetre of mercury) = 66.661 Pa
    expect((await tech.get<Conversion>('/api/units-conversion?value=500&from=micron&to=Pa')).body.result).toBeCloseTo(66.661, 2)
    expect((await tech.get<Conversion>('/api/units-conversion?value=1&from=mbar&to=Pa')).body.result).toBeCloseTo(100, 9)
    // 20 inHg vacuum at 2000 m: 79.495 kPa (ISO 2533) − 20 × 3.386389 kPa = 11.767 kPa abs
    const vac = await tech.get<Conversion>('/api/units-conversion?value=20&from=inHgV&to=kPa&altitudeM=2000')
    expect(vac.body.result).toBeCloseTo(79.495 - 20 * 3.386389, 2)
    // There is only 23.5 inHg of atmosphere at 2000 m: 25 inHg vacuum is past a perfect vacuum.
    expect((await tech.get<Conversion>('/api/units-conversion?value=25&from=inHgV&to=kPa&altitudeM=2000')).status).toBe(422)
  })

  it('answers 400 for mixed kinds or bad numbers, 422 below a perfect vacuum, 401 signed out', async () => {
    const tech = await signedIn(DEMO.tech)
    for (const q of ['value=1&from=psig&to=C', 'value=abc&from=psig&to=kPa', 'value=1&from=inHg&to=kPa', 'from=kPa&to=bar']) {
      const res = await tech.get<Conversion>(`/api/units-conversion?${q}`)
      expect(res.status, q).toBe(400)
      expect(Object.keys(res.body.data?.fieldErrors ?? {}).length, q).toBeGreaterThan(0)
    }
    expect((await tech.get('/api/units-conversion?value=-200&from=kPag&to=kPa')).status).toBe(422)
    expect((await new ApiClient().get('/api/units-conversion?value=1&from=kPa&to=bar')).status).toBe(401)
  })
})
