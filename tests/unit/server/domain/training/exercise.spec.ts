import { describe, expect, it } from 'vitest'
import { answerRequest, enginePath, exerciseView, knownAfter, scrubText, type ExerciseMaterial } from '#server/domain/training/exercise'
import type { ExerciseStart } from '#shared/types/training'

const secrets = {
  names: ['Lindqvarn Biobank', 'Cold Store Wing', 'Petra Voss'],
  addresses: ['12 Heronsgate Row, Aldmere AL4 9ZQ'],
  emails: ['petra.voss@lindqvarn.example'],
  phones: ['+00 555 0101'],
  serials: ['LQ-88-1021'],
}

const material: ExerciseMaterial = {
  unit: {
    name: 'Practice unit', customer: 'Practice customer', site: 'Practice site', kind: 'cascade', equipmentClass: 'ult-freezer', siteAltitudeM: 0,
    design: { cabinetC: -80, cascadeHxC: -35 },
    stages: [
      { stage: 'high', refrigerant: 'R404A', chargeG: 900, volumeL: null, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: null },
      { stage: 'low', refrigerant: 'R170', chargeG: 180, volumeL: 12, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: null },
    ],
  },
  complaint: 'Warm',
  symptoms: ['not-cooling'],
  readings: [{ quantity: 'cabinetTemperature', value: -40, unit: 'C' }, { quantity: 'suctionPressure', stage: 'low', value: 95, unit: 'kPa' }],
  testResults: [{ test: 'standing-pressure-check', stage: 'low', outcome: 'low' }, { test: 'leak-search', stage: 'low', outcome: 'found' }],
  confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }],
  tests: [
    { test: 'standing-pressure-check', title: 'Standing pressure', minutes: 20, opensSystem: false, hotWork: false, stages: ['high', 'low', 'single'], safetyNotes: [], outcomes: [{ outcome: 'low', label: 'Below expected' }] },
    { test: 'nitrogen-pressure-test', title: 'Nitrogen hold', minutes: 120, opensSystem: true, hotWork: false, stages: ['high', 'low', 'single'], safetyNotes: ['Regulator and relief valve'], outcomes: [] },
    { test: 'leak-search', title: 'Leak search', minutes: 45, opensSystem: false, hotWork: false, stages: ['high', 'low', 'single'], safetyNotes: [], outcomes: [{ outcome: 'found', label: 'Leak found' }] },
  ],
  causes: [{ cause: 'refrigerant-leak', title: 'Leak' }],
  knowledgeBaseVersionId: 3,
  engine: { steps: [], minutes: 0 },
}
const start: ExerciseStart = { complaint: true, symptoms: true, readings: [{ quantity: 'cabinetTemperature' }] }
const now = new Date('2026-11-02T10:00:00Z')

describe('exercise material', () => {
  it('replaces every personal detail in free text and removes other e-mails and telephone numbers', () => {
    const text = 'Lindqvarn biobank, cold store wing (12 Heronsgate Row, Aldmere AL4 9ZQ): PETRA VOSS reports LQ-88-1021 at -40 °C, 1500 kPa. Call +00 555 0101, petra.voss@lindqvarn.example or night desk 0700 123 4567 / desk@else.example.'
    const out = scrubText(text, secrets)
    for (const s of [...secrets.names, ...secrets.addresses, ...secrets.emails, ...secrets.phones, ...secrets.serials, '0700 123 4567', 'desk@else.example']) {
      expect(out.toLowerCase()).not.toContain(s.toLowerCase())
    }
    // Figures stay: they are the point of the exercise.
    expect(out).toContain('-40 °C')
    expect(out).toContain('1500 kPa')
  })

  it('shows the trainee only what the trainer chose at the start', () => {
    const view = exerciseView(9, 'Warm freezer', now, material, { complaint: false, symptoms: true, readings: [{ quantity: 'cabinetTemperature' }] })
    expect(view.complaint).toBeNull()
    expect(view.startReadings).toEqual([{ quantity: 'cabinetTemperature', value: -40, unit: 'C' }])
    expect(Object.keys(view).sort()).toEqual(['causes', 'complaint', 'createdAt', 'id', 'readingMinutes', 'startReadings', 'symptoms', 'tests', 'title', 'unit'])
    expect(JSON.stringify(view)).not.toContain('refrigerant-leak","stage')
    expect(JSON.stringify(view)).not.toContain('found')
  })

  it('answers requests from the record, "not recorded" otherwise, and charges a repeated request nothing', () => {
    const reading = answerRequest(material, start, [], { kind: 'reading', quantity: 'suctionPressure', stage: 'low' }, now)!
    expect(reading).toMatchObject({ found: true, value: 95, unit: 'kPa', minutes: 2, invasive: false })
    expect(answerRequest(material, start, [reading], { kind: 'reading', quantity: 'suctionPressure', stage: 'low' }, now)).toBeNull()
    expect(answerRequest(material, start, [], { kind: 'reading', quantity: 'cabinetTemperature' }, now)).toMatchObject({ found: true, minutes: 0 })
    expect(answerRequest(material, start, [], { kind: 'reading', quantity: 'dischargePressure', stage: 'high' }, now)).toMatchObject({ found: false, minutes: 2 })
    expect(answerRequest(material, start, [], { kind: 'test', test: 'standing-pressure-check', stage: 'low' }, now)).toMatchObject({ found: true, outcome: 'low', outcomeLabel: 'Below expected', minutes: 20 })
    expect(answerRequest(material, start, [], { kind: 'test', test: 'nitrogen-pressure-test', stage: 'low' }, now)).toMatchObject({ found: false, minutes: 120, invasive: true })
    expect(() => answerRequest(material, start, [], { kind: 'test', test: 'leak-search' }, now)).toThrow(/stage/)
    expect(() => answerRequest(material, start, [], { kind: 'reading', quantity: 'suctionPressure', stage: 'single' }, now)).toThrow(/no single stage/)
  })

  it('knows after requests exactly what was shown or asked for', () => {
    const known = knownAfter(material, start, [{ kind: 'test', test: 'standing-pressure-check', stage: 'low' }])
    expect(known.readings).toEqual([material.readings[0]])
    expect(known.testResults).toEqual([material.testResults[0]])
  })

  it('follows the engine: readings not shown, then its first recorded proposal, until it is confident', async () => {
    const seen: number[] = []
    const path = await enginePath(material, start, async (known) => {
      seen.push(known.testResults.length)
      const done = known.testResults.length
      return {
        causes: [{ cause: 'refrigerant-leak', stage: 'low', probability: done >= 1 ? 0.85 : 0.4, title: '', prior: 0, evidence: [], evidenceAgainst: [] }],
        // The unrecorded nitrogen test is passed over for the recorded standing-pressure check.
        tests: [
          { test: 'nitrogen-pressure-test', stage: 'low', minutes: 120, expectedGain: 1, value: '', title: '', score: 1, opensSystem: true, hotWork: false, safetyNotes: [], separates: [] },
          { test: 'standing-pressure-check', stage: 'low', minutes: 20, expectedGain: 1, value: '', title: '', score: 1, opensSystem: false, hotWork: false, safetyNotes: [], separates: [] },
        ],
      }
    })
    expect(path.steps).toEqual([
      { kind: 'reading', quantity: 'suctionPressure', stage: 'low', minutes: 2 },
      { kind: 'test', test: 'standing-pressure-check', stage: 'low', minutes: 20 },
    ])
    expect(path.minutes).toBe(22)
    expect(seen).toEqual([0, 1])
  })
})
