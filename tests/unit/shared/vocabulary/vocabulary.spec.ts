import { describe, expect, it } from 'vitest'
import { CAUSES, QUANTITIES, STAGES, SYMPTOMS, TESTS } from '#shared/types/diagnosis'
import { ROLES } from '#shared/utils/permissions'
import {
  CAUSE_WORDS, QUANTITY_WORDS, SYMPTOM_WORDS, TEST_WORDS, causeLabel, hypothesisLabel, humanise, measurementSymbol, outcomeLabel,
  readingName, roleLabel, stageLabel, symptomLabel, testLabel,
} from '#shared/utils/vocabulary'

// Every word of the public contract as it stands; a word added later may go without an entry.
const CONTRACT_CAUSES = ['refrigerant-leak', 'overcharge', 'restriction', 'moisture-freeze', 'oil-return-blocked', 'oil-logging', 'non-condensables',
  'condenser-airflow', 'evaporator-airflow', 'compressor-inefficient', 'compressor-electrical', 'wrong-refrigerant', 'high-heat-load', 'control-sensor-fault', 'other']
const CONTRACT_TESTS = ['standing-pressure-check', 'leak-search', 'nitrogen-pressure-test', 'vacuum-decay-test', 'restriction-temperature-drop', 'compressor-current-check',
  'compressor-pumping-test', 'oil-return-line-check', 'condenser-inspection', 'refrigerant-identification', 'sensor-verification', 'warm-capillary-test', 'door-and-load-check']
const CONTRACT_SYMPTOMS = ['not-cooling', 'slow-pulldown', 'warming-over-days', 'intermittent-cooling', 'compressor-short-cycling', 'compressor-not-starting',
  'compressor-tripping', 'frost-on-capillary', 'oil-at-fitting', 'line-tap-valve-present', 'recently-serviced', 'refrigerant-label-mismatch', 'noisy-compressor']

describe('vocabulary entries', () => {
  it('label every contract cause, test, symptom and quantity in both forms', () => {
    for (const c of CONTRACT_CAUSES) expect(CAUSE_WORDS[c], c).toMatchObject({ short: expect.any(String), long: expect.any(String) })
    for (const t of CONTRACT_TESTS) expect(TEST_WORDS[t], t).toMatchObject({ short: expect.any(String), long: expect.any(String) })
    for (const s of CONTRACT_SYMPTOMS) expect((SYMPTOM_WORDS as Record<string, unknown>)[s], s).toMatchObject({ short: expect.any(String), long: expect.any(String) })
    for (const q of QUANTITIES) expect(QUANTITY_WORDS[q], q).toMatchObject({ short: expect.any(String), long: expect.any(String) })
  })

  it('never answers with the machine word itself for any word in the lists', () => {
    for (const c of CAUSES) if (c !== 'other') expect(causeLabel(c)).not.toBe(c)
    for (const t of TESTS) expect(testLabel(t)).not.toBe(t)
    for (const s of SYMPTOMS) expect(symptomLabel(s)).not.toBe(s)
    for (const q of QUANTITIES) expect(QUANTITY_WORDS[q].long).not.toBe(q)
    for (const s of STAGES) expect(stageLabel(s)).not.toBe(s)
    for (const r of ROLES) expect(roleLabel(r)).not.toMatch(/^[a-z]/)
  })

  it('labels every outcome each test of the shipped knowledge base offers', () => {
    expect(outcomeLabel('standing-pressure-check', 'as-expected')).toBe('Within about 10 % of the expected pressure')
    expect(outcomeLabel('standing-pressure-check', 'low', { form: 'short' })).toBe('Low')
  })
})

describe('words without an entry', () => {
  it('fall back to the title the knowledge base stores, then to a phrase, never to the slug', () => {
    expect(causeLabel('expansion-valve-underfeeding', { title: 'Expansion valve underfeeding (starved evaporator)' })).toBe('Expansion valve underfeeding (starved evaporator)')
    expect(causeLabel('expansion-tank-isolated')).toBe('Expansion tank isolated')
    expect(testLabel('superheat-probe-check', { title: '' })).toBe('Superheat probe check')
    expect(outcomeLabel('new-test', 'partly-open', { label: 'Valve partly open' })).toBe('Valve partly open')
    expect(outcomeLabel('new-test', 'partly-open')).toBe('Partly open')
    expect(humanise('cabinetTemperature')).toBe('Cabinet temperature')
  })
})

describe('compound labels', () => {
  it('name a cause on a stage and a reading on a stage', () => {
    expect(hypothesisLabel({ cause: 'refrigerant-leak', stage: 'low' })).toBe('Refrigerant leak · Low stage')
    expect(hypothesisLabel({ cause: 'other' })).toBe('Something else')
    expect(readingName({ quantity: 'suctionPressure', stage: 'low' })).toBe('Low stage: suction pressure')
    expect(readingName({ quantity: 'cabinetTemperature' })).toBe('Cabinet temperature')
  })

  it('give measurement units their symbol, gauge or absolute', () => {
    expect(measurementSymbol('kPa')).toBe('kPa abs')
    expect(measurementSymbol('psig')).toBe('psig')
    expect(measurementSymbol('C')).toBe('°C')
    expect(measurementSymbol('g')).toBe('g')
  })
})
