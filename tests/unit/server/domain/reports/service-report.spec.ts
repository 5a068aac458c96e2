import { describe, expect, it } from 'vitest'
import { buildServiceReport, reportEmailText } from '#server/domain/reports/service-report'
import type { CaseDto } from '#shared/types/cases'

const unit: CaseDto['unit'] = {
  id: 3, name: 'Freezer Q-17', kind: 'cascade', equipmentClass: 'ult-freezer', model: 'Icebox 9', serial: 'IB9-1', location: 'Cell 4', customer: 'Harbour Cryo',
  customerId: 1, siteId: 1, site: 'Quay lab', siteAltitudeM: 0, design: { cabinetC: -86, cascadeHxC: -35 },
  stages: [
    { stage: 'high', refrigerant: 'R404A', chargeG: 400, volumeL: 8, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: null },
    { stage: 'low', refrigerant: 'R170', chargeG: 90, volumeL: 7.5, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: null },
  ],
}
const at = '2026-12-02T13:05:00.000Z'
const closed: CaseDto = {
  id: 41, unitId: 3, status: 'closed', complaint: 'Cabinet at -40 °C', symptoms: ['not-cooling', 'line-tap-valve-present'],
  readings: [{ quantity: 'suctionPressure', stage: 'low', value: 157.41, unit: 'kPa', at, by: 1 }, { quantity: 'cabinetTemperature', value: -40, unit: 'C', at, by: 1 }],
  testResults: [{ test: 'standing-pressure-check', stage: 'low', outcome: 'low', at, by: 1 }],
  ranking: null, events: [], version: 9, technician: 'Ola Tech', openedAt: at, closedAt: '2026-12-02T15:40:00.000Z', notes: '',
  closure: {
    confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'expansion-tank-isolated' as never, stage: 'low' }], workDone: 'Brazed the drier flare.', parts: ['drier'],
    refrigerantTransactions: [], unitStateAtDeparture: 'Pulling down', followUp: '', closedBy: 1,
  },
  unit, transactions: [{ id: 1, stage: 'low', refrigerant: 'R170', grams: 205, direction: 'added', cylinder: 'ETH-0107', at }], uploads: [], emails: [],
  steps: [], reportPhotoIds: [],
}
const setting = {
  organisation: 'Nordkyl Service', timeZone: 'Europe/Stockholm', atmosphericKpa: 101.325,
  titles: { causes: { 'expansion-tank-isolated': 'Expansion tank valve left shut' }, tests: {}, outcomes: {} },
}

describe('service report', () => {
  const report = buildServiceReport(closed, setting)
  const row = (section: string, label: string) => report.sections.find((s) => s.title === section)!.rows.find((r) => r.label === label)

  it('writes readings with their units and what a stage pressure means for its refrigerant', () => {
    // Ethane saturates at −80 °C under 157.41 kPa absolute (Bücker & Wagner 2006 EOS via CoolProp 8.0.0).
    expect(row('Readings as found', 'Low stage: suction pressure')).toMatchObject({ label: 'Low stage: suction pressure', value: '157.41 kPa abs', note: '157 kPa abs; R170 saturation −80.0 °C', figure: true, time: '2026-12-02 14:05 CET' })
    expect(row('Readings as found', 'Cabinet temperature')?.value).toBe('−40 °C')
  })

  it('names tests, outcomes, causes and symptoms in words, falling back to the knowledge base title', () => {
    expect(row('Tests and outcomes', 'Standing pressure check, Low stage')).toMatchObject({ value: 'Below the expected pressure', time: '2026-12-02 14:05 CET' })
    expect(report.sections.find((s) => s.title === 'Findings')!.rows.filter((r) => r.label === 'Confirmed cause').map((r) => r.value))
      .toEqual(['Refrigerant leak (undercharge), Low stage', 'Expansion tank valve left shut, Low stage'])
    expect(row('Complaint', 'Symptoms')?.value).toBe('Not cooling, Line-tap valve fitted')
    expect(row('Refrigerant transactions', 'Low stage: R170 added')).toMatchObject({ value: '205 g', note: 'cylinder ETH-0107' })
  })

  it('gives the times in the organisation\'s time zone, in the report and its e-mail alike', () => {
    // Stockholm keeps Central European Time (UTC+1) in winter (IANA tz database, from memory).
    expect(report.when).toBe('opened 2026-12-02 14:05 CET · closed 2026-12-02 16:40 CET')
    const text = reportEmailText(report)
    expect(text).toContain('Opened 2026-12-02 14:05 CET · closed 2026-12-02 16:40 CET')
    expect(text).toContain('Confirmed cause: Refrigerant leak (undercharge), Low stage')
    expect(text).not.toMatch(/refrigerant-leak|standing-pressure-check|suctionPressure|not-cooling/)
  })
})

describe('service report of a repaired unit', () => {
  const by = 1
  const repaired: CaseDto = {
    ...closed,
    events: [{ id: 1, at, type: 'case-opened', by: 'Ola Tech', byUserId: by }],
    readings: [
      { quantity: 'standingPressure', stage: 'low', value: 0, unit: 'psig', at, by },
      { quantity: 'ambientTemperature', value: 21, unit: 'C', at, by },
      { quantity: 'cabinetTemperature', value: -400, unit: 'F', at, by, struck: { at, by, reason: 'typed in the wrong field' } },
      { quantity: 'standingPressure', stage: 'low', value: 235, unit: 'psig', phase: 'repair', at: '2026-12-02T15:00:00.000Z', by, corrected: { at, by, reason: 'misread the gauge', from: { value: 253, unit: 'psig' } } },
      { quantity: 'cabinetTemperature', value: -79, unit: 'C', phase: 'verification', at: '2026-12-02T15:30:00.000Z', by },
    ],
    steps: [{
      index: 0, kind: 'pressure-hold', stage: 'low', at: '2026-12-02T14:30:00.000Z', by,
      input: { kind: 'pressure-hold', stage: 'low', gas: 'nitrogen', pressureUnit: 'psig', testPressure: 300, startPressure: 300, endPressure: 296, temperatureUnit: 'C', startTemperature: 20, endTemperature: 15, holdMinutes: 60 },
      result: { verdict: 'pass', summary: 'Held.', figures: [{ label: 'Test pressure', value: '300 psig' }], warnings: [], cautions: [] },
    }],
  }
  const report = buildServiceReport(repaired, setting)
  const section = (title: string) => report.sections.find((s) => s.title === title)

  it('keeps every reading, grouped as found, after repair and as left, with who took it', () => {
    expect(section('Readings as found')!.rows.map((r) => r.value)).toEqual(['0 psig', '21 °C', '−400 °F'])
    expect(section('Readings after repair')!.rows[0]).toMatchObject({ value: '235 psig', by: 'Ola Tech', time: '2026-12-02 16:00 CET' })
    expect(section('Readings as left')!.rows[0]!.value).toBe('−79 °C')
  })

  it('shows the corrected value and that it was corrected, and a struck-out reading as struck with its reason', () => {
    expect(section('Readings after repair')!.rows[0]!.note).toContain('corrected from 253 psig: misread the gauge')
    expect(section('Readings as found')!.rows.find((r) => r.value === '−400 °F')).toMatchObject({ struck: true, note: 'struck out: typed in the wrong field' })
  })

  it('lists the repair steps with their figures, and only the worked stage\'s cautions', () => {
    const steps = section('Repair and verification')!.rows
    expect(steps[0]).toMatchObject({ label: 'Pressure hold with dry nitrogen, Low stage', value: 'Passed', note: 'Held.' })
    expect(steps[1]).toMatchObject({ label: 'Test pressure', value: '300 psig', detail: true, figure: true })
    expect(report.safetyNotes.some((n) => n.startsWith('Low stage (R170)'))).toBe(true)
    expect(report.safetyNotes.some((n) => n.startsWith('High stage'))).toBe(false)
    expect(report.acknowledgement).toMatch(/on behalf of the customer/)
  })
})
