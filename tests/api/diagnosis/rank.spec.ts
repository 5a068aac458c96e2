import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

// Cascade ULT freezer: ethane low stage, 250 g in 9.5 L (the contract's example unit).
const cascadeUnit = {
  kind: 'cascade',
  stages: [
    { stage: 'high', refrigerant: 'R404A', chargeG: 520 },
    { stage: 'low', refrigerant: 'R170', chargeG: 250, volumeL: 9.5 },
  ],
  design: { cabinetC: -80, cascadeHxC: -30 },
}
const lowNotCooling = [
  { quantity: 'cabinetTemperature', value: -38, unit: 'C' },
  { quantity: 'setpointTemperature', value: -80, unit: 'C' },
  { quantity: 'cascadeHxTemperature', value: -31, unit: 'C' },
  { quantity: 'compressorRunning', stage: 'high', value: true, unit: 'bool' },
  { quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' },
]

describe('POST /api/diagnosis/rank', () => {
  it('answers 401 when signed out', async () => {
    expect((await new ApiClient().post('/api/diagnosis/rank', { unit: cascadeUnit })).status).toBe(401)
  })

  it('ranks in the contract shape: sorted causes with other, probabilities summing to 1, sorted tests', async () => {
    const tech = await signedIn(DEMO.tech)
    const res = await tech.post('/api/diagnosis/rank', { unit: cascadeUnit, symptoms: ['not-cooling'], readings: lowNotCooling })
    expect(res.status).toBe(200)
    const { causes, tests, derived, warnings } = res.body
    expect(causes.some((c: { cause: string }) => c.cause === 'other')).toBe(true)
    const sum = causes.reduce((a: number, c: { probability: number }) => a + c.probability, 0)
    expect(sum).toBeCloseTo(1, 6)
    for (let i = 1; i < causes.length; i++) expect(causes[i - 1].probability).toBeGreaterThanOrEqual(causes[i].probability)
    for (let i = 1; i < tests.length; i++) expect(tests[i - 1].score).toBeGreaterThanOrEqual(tests[i].score)
    expect(typeof derived).toBe('object')
    expect(Array.isArray(warnings)).toBe(true)
    // Leak against blockage on the low stage is settled cheapest by a standing-pressure check (common practice, no source).
    expect(tests[0]).toMatchObject({ test: 'standing-pressure-check', stage: 'low', minutes: expect.any(Number), expectedGain: expect.any(Number) })
  })

  it('puts a low-stage leak first when the standing pressure is far below the expected one', async () => {
    const tech = await signedIn(DEMO.tech)
    // Ethane 250 g in 9.5 L at 21 °C stands near 1.8 MPa (Bücker & Wagner 2006 EOS); 600 kPa is about a third of it.
    const res = await tech.post('/api/diagnosis/rank', {
      unit: cascadeUnit,
      symptoms: ['not-cooling'],
      readings: [...lowNotCooling, { quantity: 'standingPressure', stage: 'low', value: 600, unit: 'kPa' }, { quantity: 'ambientTemperature', value: 21, unit: 'C' }],
    })
    expect(res.status).toBe(200)
    expect(res.body.causes[0]).toMatchObject({ cause: 'refrigerant-leak', stage: 'low' })
    expect(res.body.causes[0].evidence.length).toBeGreaterThan(0)
    expect(res.body.derived.low.expectedStandingPressureKpa).toBeGreaterThan(1700)
  })

  it('answers 400 listing the allowed words for an unknown symptom, quantity or unit', async () => {
    const tech = await signedIn(DEMO.tech)
    const badSymptom = await tech.post('/api/diagnosis/rank', { unit: cascadeUnit, symptoms: ['smells-funny'] })
    expect(badSymptom.status).toBe(400)
    expect(JSON.stringify(badSymptom.body)).toContain('not-cooling')
    const badUnit = await tech.post('/api/diagnosis/rank', { unit: cascadeUnit, readings: [{ quantity: 'suctionPressure', stage: 'low', value: 1, unit: 'atm' }] })
    expect(badUnit.status).toBe(400)
    expect(JSON.stringify(badUnit.body)).toContain('psig')
    const badQuantity = await tech.post('/api/diagnosis/rank', { unit: cascadeUnit, readings: [{ quantity: 'vibes', value: 1, unit: 'C' }] })
    expect(badQuantity.status).toBe(400)
    const badOutcome = await tech.post('/api/diagnosis/rank', { unit: cascadeUnit, testResults: [{ test: 'standing-pressure-check', stage: 'low', outcome: 'wobbly' }] })
    expect(badOutcome.status).toBe(400)
    expect(JSON.stringify(badOutcome.body)).toContain('as-expected')
  })

  it('still ranks contradictory readings, with a data-quality warning', async () => {
    const tech = await signedIn(DEMO.tech)
    const res = await tech.post('/api/diagnosis/rank', {
      unit: cascadeUnit,
      readings: [
        { quantity: 'suctionPressure', stage: 'high', value: 900, unit: 'kPa' },
        { quantity: 'dischargePressure', stage: 'high', value: 300, unit: 'kPa' },
        { quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' },
        { quantity: 'compressorCurrent', stage: 'low', value: 0, unit: 'A' },
      ],
    })
    expect(res.status).toBe(200)
    expect(res.body.warnings.length).toBeGreaterThanOrEqual(2)
  })

  it('lists the tests with their outcomes, and the vocabulary', async () => {
    const tech = await signedIn(DEMO.tech)
    const tests = (await tech.get('/api/diagnosis/tests')).body as { test: string; outcomes: { outcome: string }[] }[]
    expect(tests.map((t) => t.test)).toEqual(expect.arrayContaining(['standing-pressure-check', 'leak-search', 'nitrogen-pressure-test', 'refrigerant-identification']))
    expect(tests.find((t) => t.test === 'standing-pressure-check')!.outcomes.map((o) => o.outcome)).toEqual(expect.arrayContaining(['low', 'as-expected', 'high']))
    const vocabulary = (await tech.get('/api/diagnosis/vocabulary')).body
    expect(vocabulary.symptoms).toContain('frost-on-capillary')
    expect(vocabulary.causes.map((c: { cause: string }) => c.cause)).toContain('oil-return-blocked')
    expect(vocabulary.units.pressure).toEqual(['kPa', 'kPag', 'bar', 'barg', 'psia', 'psig', 'MPa'])
  })
})

describe('GET /api/diagnosis/agreement', () => {
  it('reports how often the closed cases ranking had the confirmed cause first and in the top three', async () => {
    const engineer = await signedIn(DEMO.engineer)
    const res = await engineer.get('/api/diagnosis/agreement')
    expect(res.status).toBe(200)
    expect(res.body.closedCases).toBeGreaterThanOrEqual(30)
    expect(res.body.topThreeMatches).toBeGreaterThanOrEqual(res.body.topMatches)
    expect(res.body.topShare).toBeCloseTo(res.body.topMatches / res.body.closedCases, 9)
    expect((await new ApiClient().get('/api/diagnosis/agreement')).status).toBe(401)
  })
})
