import { describe, expect, it } from 'vitest'
import type { RankRequest, RankResponse, Reading, TestResult } from '#shared/types/diagnosis'
import { rankDiagnosis, RankInputError } from '#server/domain/diagnosis/rank'
import { seedKb, satKpa } from './scenario-helpers'
import { buildScenario, type ScenarioSpec } from '#server/domain/diagnosis/scenarios/builder'
import { healthy, stopped, withState } from '#server/domain/diagnosis/scenarios/baselines'

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0)
const label = (c: { cause: string; stage?: string }) => (c.stage ? `${c.cause}@${c.stage}` : c.cause)
const top = (r: RankResponse, n = 1) => r.causes.slice(0, n).map(label)
const rank = (req: RankRequest) => rankDiagnosis(seedKb(), req)
const request = (spec: Omit<ScenarioSpec, 'id' | 'title' | 'source' | 'expected'>) => buildScenario({ id: 'x', title: 'x', source: 'x', expected: { cause: 'other' }, ...spec }).request
const probabilityOf = (r: RankResponse, key: string) => r.causes.find((c) => label(c) === key)?.probability ?? 0

// The contract's example unit: an ethane low stage of 250 g in 9.5 L.
const contractUnit: RankRequest['unit'] = {
  kind: 'cascade',
  stages: [{ stage: 'high', refrigerant: 'R404A', chargeG: 520 }, { stage: 'low', refrigerant: 'R170', chargeG: 250, volumeL: 9.5 }],
  design: { cabinetC: -80, cascadeHxC: -30 },
}
const lowNotCooling: Reading[] = [
  { quantity: 'cabinetTemperature', value: -38, unit: 'C' },
  { quantity: 'setpointTemperature', value: -80, unit: 'C' },
  { quantity: 'cascadeHxTemperature', value: -31, unit: 'C' },
  { quantity: 'compressorRunning', stage: 'high', value: true, unit: 'bool' },
  { quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' },
]

describe('response shape', () => {
  it('sorts causes, sums to 1, includes other and the healthy state, and sorts tests best first with their value in words', async () => {
    const r = await rank({ unit: contractUnit, symptoms: ['not-cooling'], readings: lowNotCooling })
    expect(sum(r.causes.map((c) => c.probability))).toBeCloseTo(1, 10)
    const ps = r.causes.map((c) => c.probability)
    expect(ps).toEqual([...ps].sort((a, b) => b - a))
    expect(r.causes.find((c) => c.cause === 'other')?.stage).toBeUndefined()
    expect(r.causes.find((c) => c.cause === 'no-refrigeration-fault')?.stage).toBeUndefined()
    expect(r.causes.every((c) => c.stage !== 'single')).toBe(true)
    const scores = r.tests.map((t) => t.score)
    expect(scores).toEqual([...scores].sort((a, b) => b - a))
    for (const t of r.tests) {
      expect(t).toMatchObject({ test: expect.any(String), stage: expect.any(String), expectedGain: expect.any(Number), minutes: expect.any(Number) })
      expect(t.value).toMatch(/^(Settles|Tells|Narrows)/)
      expect(t.value).not.toMatch(/bit/)
      expect(t.safetyNotes.length).toBeGreaterThan(0)
    }
    // Leak against blockage on the low stage is settled cheapest by the standing-pressure check (common practice, no source).
    expect(r.tests[0]).toMatchObject({ test: 'standing-pressure-check', stage: 'low', value: 'Settles a leak against a blockage on the low stage.' })
    expect(r.setAside).toEqual([])
  })

  it('ranks a bare unit by its starting odds, proposes tests and lists readings to take', async () => {
    const r = await rank({ unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] } })
    expect(sum(r.causes.map((c) => c.probability))).toBeCloseTo(1, 10)
    expect(r.tests.length).toBeGreaterThan(0)
    expect(r.missingReadings.length).toBeGreaterThan(0)
    expect(r.warnings).toEqual([])
    expect(r.priorNote).toMatch(/default weights for single-stage units/)
  })

  it('rejects unknown outcome words and stages a test does not apply to, listing the allowed words', async () => {
    const bare: RankRequest = { unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] } }
    await expect(rank({ ...bare, testResults: [{ test: 'standing-pressure-check', stage: 'single', outcome: 'lowish' }] })).rejects.toThrow(
      'Unknown outcome "lowish" for standing-pressure-check; allowed: low, as-expected, high',
    )
    await expect(rank({ unit: contractUnit, testResults: [{ test: 'condenser-inspection', stage: 'low', outcome: 'clean-and-running' }] })).rejects.toBeInstanceOf(RankInputError)
  })
})

describe('the standing pressure of the contract example', () => {
  const withStanding = (kpa: number): RankRequest => ({
    unit: contractUnit,
    symptoms: ['not-cooling'],
    readings: [...lowNotCooling, { quantity: 'standingPressure', stage: 'low', value: kpa, unit: 'kPa' }, { quantity: 'ambientTemperature', value: 21, unit: 'C' }],
  })

  it('puts a low-stage leak first when the standing pressure is a third of the expected one, with the reason in words', async () => {
    const r = await rank(withStanding(600))
    expect(top(r)).toEqual(['refrigerant-leak@low'])
    expect(r.causes[0]?.probability).toBeGreaterThan(0.8)
    expect(r.causes[0]?.evidence.map((e) => e.text).join(' ')).toMatch(/Low stage standing pressure 600 kPa is 3\d\.\d % of the 1\d\d\d kPa expected at 21\.0 °C/)
    // Each item says by how much it moves the cause against the field: for above 1, against below 1.
    expect(r.causes[0]?.evidence.every((e) => (e.factor ?? 0) > 1)).toBe(true)
    const blockage = r.causes.find((c) => label(c) === 'restriction@low')
    expect(blockage?.evidenceAgainst.find((e) => e.rule === 'standing-against-expected-gas@low')?.factor).toBeLessThan(0.1)
    expect(r.tests.some((t) => t.test === 'standing-pressure-check' && t.stage === 'low')).toBe(false)
  })

  it('a reading and the test of the same measurement count once', async () => {
    const reading = await rank(withStanding(600))
    const both = await rank({ ...withStanding(600), testResults: [{ test: 'standing-pressure-check', stage: 'low', outcome: 'low' }] })
    expect(both.causes.map((c) => [label(c), c.probability])).toEqual(reading.causes.map((c) => [label(c), c.probability]))
    expect(both.warnings).toEqual(reading.warnings)
  })

  it('a test that disagrees with the reading of the same measurement was taken at another moment: both count, with a warning', async () => {
    const reading = await rank(withStanding(600))
    const contradicting = await rank({ ...withStanding(600), testResults: [{ test: 'standing-pressure-check', stage: 'low', outcome: 'as-expected' }] })
    expect(probabilityOf(contradicting, 'refrigerant-leak@low')).toBeLessThan(probabilityOf(reading, 'refrigerant-leak@low'))
    expect(contradicting.warnings.join('\n')).toMatch(/recorded as "Within about 10 % of the expected pressure", but the reading says otherwise .* Both count/)
  })

  it('repair and verification results are kept out: a fixed leak does not turn into a blockage', async () => {
    const diagnosis: TestResult[] = [
      { test: 'standing-pressure-check', stage: 'low', outcome: 'low' },
      { test: 'leak-search', stage: 'low', outcome: 'leak-found' },
    ]
    const before = await rank({ unit: contractUnit, symptoms: ['not-cooling'], readings: lowNotCooling, testResults: diagnosis })
    const after = await rank({
      unit: contractUnit,
      symptoms: ['not-cooling'],
      readings: [...lowNotCooling, { quantity: 'standingPressure', stage: 'low', value: 1750, unit: 'kPa', phase: 'verification' }, { quantity: 'ambientTemperature', value: 21, unit: 'C' }],
      testResults: [
        ...diagnosis,
        { test: 'nitrogen-pressure-test', stage: 'low', outcome: 'holds', phase: 'repair' },
        { test: 'vacuum-decay-test', stage: 'low', outcome: 'holds', phase: 'repair' },
      ],
    })
    expect(top(before)).toEqual(['refrigerant-leak@low'])
    expect(top(after)).toEqual(['refrigerant-leak@low'])
    expect(probabilityOf(after, 'refrigerant-leak@low')).toBeCloseTo(probabilityOf(before, 'refrigerant-leak@low'), 2)
    expect(after.setAside).toHaveLength(3)
    expect(after.setAside.join('\n')).toMatch(/Nitrogen pressure test on the low stage \("Pressure holds"\), done during the repair, is kept in the record but does not move the diagnosis\./)
  })

  it('without phases, tests after a definitive outcome are read as repair and verification from their order', async () => {
    const after = await rank({
      unit: contractUnit,
      symptoms: ['not-cooling'],
      readings: lowNotCooling,
      testResults: [
        { test: 'standing-pressure-check', stage: 'low', outcome: 'low' },
        { test: 'leak-search', stage: 'low', outcome: 'leak-found' },
        { test: 'nitrogen-pressure-test', stage: 'low', outcome: 'holds' },
        { test: 'vacuum-decay-test', stage: 'low', outcome: 'holds' },
        { test: 'standing-pressure-check', stage: 'low', outcome: 'as-expected' },
      ],
    })
    expect(top(after)).toEqual(['refrigerant-leak@low'])
    expect(after.causes[0]?.probability).toBeGreaterThan(0.9)
    expect(after.setAside).toEqual([
      'Nitrogen pressure test on the low stage ("Pressure holds"), recorded after "Leak found", is taken as part of the repair; it is kept in the record but does not move the diagnosis.',
      'Vacuum decay test on the low stage ("Holds"), recorded after "Leak found", is taken as part of the repair; it is kept in the record but does not move the diagnosis.',
      'Standing pressure check on the low stage ("Within about 10 % of the expected pressure"), recorded after "Leak found", is taken as a check of the repair; it is kept in the record but does not move the diagnosis.',
    ])
  })
})

describe('preconditions', () => {
  it('a low stage called to run but stopped at 0 A is an electrical fault, not a leak', async () => {
    const r = await rank(request({ unit: 'ultR404aR170', symptoms: ['not-cooling'], state: withState(healthy('ultR404aR170'), { cabinet: -45, cascadeHx: -40, low: { ...stopped, running: true } }) }))
    expect(top(r)).toEqual(['compressor-electrical@low'])
    // Running signatures are switched off: no suction finding speaks for the low stage.
    expect(r.causes.flatMap((c) => c.evidence.map((e) => e.rule)).some((rule) => rule.startsWith('suction-against-design-cabinet@low'))).toBe(false)
    expect(r.warnings.join(' ')).toMatch(/reported running, but the compressor draws 0\.0 A/)
  })

  it('a stage running at design cannot carry a cabinet tens of kelvin warm: the cabinet probe is suspect, not a leak', async () => {
    const r = await rank(request({ unit: 'freezerR290', symptoms: ['not-cooling'], state: withState(healthy('freezerR290', 25), { cabinet: 20 }) }))
    expect(top(r)).toEqual(['control-sensor-fault@single'])
    expect(probabilityOf(r, 'refrigerant-leak@single')).toBeLessThan(0.1)
  })

  it('works a stage out with the refrigerant that fits its pressure–temperature pair, and says so', async () => {
    const r = await rank({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R134a' }], design: { cabinetC: -20 } },
      symptoms: ['slow-pulldown', 'recently-serviced'],
      readings: [
        { quantity: 'compressorRunning', stage: 'single', value: true, unit: 'bool' },
        { quantity: 'suctionPressure', stage: 'single', value: Math.round(satKpa('R404A', -30)), unit: 'kPa' },
        { quantity: 'evaporatorTemperature', stage: 'single', value: -30, unit: 'C' },
        { quantity: 'suctionTemperature', stage: 'single', value: -24, unit: 'C' },
      ],
    })
    expect(top(r)).toEqual(['wrong-refrigerant@single'])
    expect(r.derived.single?.workingRefrigerant).toMatch(/R404A|R507A/)
    expect(r.derived.single?.superheatK).toBeCloseTo(6, 0)
    expect(r.warnings.join(' ')).toMatch(/not the nameplate R134a/)
  })

  it('takes expansion-valve causes off a stage the record says is capillary-fed', async () => {
    const base = request({ unit: 'coldRoomR404a', symptoms: ['not-cooling'], state: withState(healthy('coldRoomR404a', 25), { cabinet: 8, single: { sst: -16, superheat: 18, subcooling: 7 } }) })
    const capillary = await rank({ ...base, unit: { ...base.unit, stages: base.unit.stages.map((s) => ({ ...s, meteringDevice: 'capillary' as const })) } })
    expect(capillary.causes.some((c) => c.cause.startsWith('expansion-valve'))).toBe(false)
    const valve = await rank({ ...base, unit: { ...base.unit, stages: base.unit.stages.map((s) => ({ ...s, meteringDevice: 'expansion-valve' as const })) } })
    expect(probabilityOf(valve, 'expansion-valve-underfeeding@single')).toBeGreaterThan(probabilityOf(await rank(base), 'expansion-valve-underfeeding@single'))
  })
})

describe('graded evidence', () => {
  const withSuperheat = (sh: number) =>
    request({ unit: 'chestR290', symptoms: ['not-cooling'], state: withState(healthy('chestR290'), { cabinet: -14, single: { sst: -39, superheat: sh, subcooling: 3 } }) })

  it('does not flip on noise at a band edge: superheat 3.0 K and 3.05 K rank alike', async () => {
    const a = await rank(withSuperheat(3))
    const b = await rank(withSuperheat(3.05))
    expect(top(a, 3)).toEqual(top(b, 3))
    expect(Math.abs((a.causes[0]?.probability ?? 0) - (b.causes[0]?.probability ?? 0))).toBeLessThan(0.02)
  })

  it('counts a suction line colder than saturation as a sign of a faulty reading, not as superheat', async () => {
    const r = await rank(withSuperheat(-20))
    expect(r.warnings.join(' ')).toMatch(/colder than saturation, which a running circuit cannot do/)
    expect(probabilityOf(r, 'control-sensor-fault@single') + probabilityOf(r, 'other')).toBeGreaterThan(probabilityOf(await rank(withSuperheat(12)), 'control-sensor-fault@single') + probabilityOf(await rank(withSuperheat(12)), 'other'))
  })

  it('raises other when the readings fit no cause of the knowledge base', async () => {
    const r = await rank(
      request({ unit: 'freezerR290', state: withState(healthy('freezerR290', 25), { cabinet: -35, single: { sst: -10, sct: 22, superheat: 40, subcooling: 0, currentPct: 160 } }) }),
    )
    expect(probabilityOf(r, 'other')).toBeGreaterThan(0.1)
  })
})
