// The service report as data: the same model feeds the printable page, the PDF and the e-mail.
// Pure: it reads a case record and the property module, and formats numbers with their units.
import type { CaseDto } from '#shared/types/cases'
import type { ReportRow, ReportSection, ServiceReport } from '#shared/types/reports'
import type { Reading, Stage, StageDerived } from '#shared/types/diagnosis'
import { findRefrigerant, isDesignation, saturationTemperature, toKpaAbs } from '#shared/utils/properties'
import { latestReadings } from '../cases/case-record'

export type { ReportRow, ReportSection, ServiceReport }

const STAGE_LABEL: Record<Stage, string> = { high: 'High stage', low: 'Low stage', single: 'System' }
const QUANTITY_LABEL: Record<string, string> = {
  suctionPressure: 'Suction pressure', dischargePressure: 'Discharge pressure', suctionTemperature: 'Suction line temperature',
  dischargeTemperature: 'Discharge line temperature', liquidLineTemperature: 'Liquid line temperature', evaporatorTemperature: 'Evaporator temperature',
  compressorCurrent: 'Compressor current', compressorRunning: 'Compressor running', standingPressure: 'Standing pressure',
  cabinetTemperature: 'Cabinet temperature', setpointTemperature: 'Setpoint', cascadeHxTemperature: 'Cascade heat exchanger temperature',
  ambientTemperature: 'Ambient temperature', condenserAirInTemperature: 'Condenser air in', condenserAirOutTemperature: 'Condenser air out', runtime: 'Runtime',
}
const UNIT_TEXT: Record<string, string> = { C: '°C', F: '°F', K: 'K', A: 'A', min: 'min', bool: '' }

const fmt = (n: number, digits = 1) => (Math.abs(n) < 1e-9 ? 0 : n).toFixed(digits).replace('-', '−')

/** "12 psig" / "−80.0 °C" / "yes": a reading exactly as entered, always with its unit. */
export function formatReading(r: Reading): string {
  if (typeof r.value === 'boolean') return r.value ? 'yes' : 'no'
  return `${fmt(r.value, Number.isInteger(r.value) ? 0 : 1)} ${UNIT_TEXT[r.unit] ?? r.unit}`.trim()
}

/** For a stage pressure: absolute value and the refrigerant's saturation temperature at it. */
export function pressureNote(r: Reading, refrigerant: string | undefined, atmosphericKpa: number): string | undefined {
  if (typeof r.value !== 'number' || !refrigerant || !isDesignation(refrigerant) || !r.quantity.endsWith('Pressure')) return undefined
  try {
    const kpa = toKpaAbs(r.value, r.unit, atmosphericKpa)
    const sat = saturationTemperature(refrigerant, kpa)
    const satText = Math.abs(sat.dewC - sat.bubbleC) > 0.05 ? `dew ${fmt(sat.dewC)} °C, bubble ${fmt(sat.bubbleC)} °C` : `${fmt(sat.dewC)} °C`
    return `${fmt(kpa, 0)} kPa abs; ${refrigerant} saturation ${satText}`
  } catch {
    return `${refrigerant}: outside the saturation range`
  }
}

function derivedRows(stage: Stage, d: StageDerived): ReportRow[] {
  const rows: ReportRow[] = []
  const add = (label: string, v: number | undefined, unit: string, digits = 1) => {
    if (v !== undefined && Number.isFinite(v)) rows.push({ label: `${STAGE_LABEL[stage]}: ${label}`, value: `${fmt(v, digits)} ${unit}`.trim() })
  }
  add('saturated suction', d.saturatedSuctionC, '°C')
  add('saturated condensing', d.saturatedCondensingC, '°C')
  add('superheat', d.superheatK, 'K')
  add('subcooling', d.subcoolingK, 'K')
  add('compression ratio', d.compressionRatio, ': 1')
  add('expected standing pressure', d.expectedStandingPressureKpa, 'kPa abs', 0)
  add('standing pressure as % of expected', d.standingPercentOfExpected, '%', 0)
  add('charge remaining (from standing pressure)', d.standingChargePercent, '% of nameplate', 0)
  add('compressor current', d.currentPercentOfRated, '% of rated load', 0)
  return rows
}

/** Builds the report of a case; `atmosphericKpa` is the site's (from its altitude). */
export function buildServiceReport(c: CaseDto, organisation: string, atmosphericKpa: number): ServiceReport {
  const refrigerantOf = (stage?: Stage) => c.unit.stages.find((s) => s.stage === stage)?.refrigerant
  const unitRows: ReportRow[] = [
    { label: 'Unit', value: c.unit.name },
    { label: 'Customer and site', value: `${c.unit.customer}, ${c.unit.site}` },
    { label: 'Model and serial', value: `${c.unit.model}, serial ${c.unit.serial}` },
    { label: 'Location', value: c.unit.location || 'not recorded' },
    ...c.unit.stages.map((s) => {
      const info = findRefrigerant(s.refrigerant)
      const charge = s.chargeG !== null ? `${fmt(s.chargeG, 0)} g nameplate` : 'charge not recorded'
      return { label: STAGE_LABEL[s.stage], value: `${s.refrigerant} (${info?.safetyClass ?? 'class unknown'}), ${charge}${s.volumeL !== null ? `, ${fmt(s.volumeL)} L` : ''}` }
    }),
  ]
  const readings = latestReadings(c.readings).map((r) => ({
    label: `${r.stage ? `${STAGE_LABEL[r.stage]}: ` : ''}${QUANTITY_LABEL[r.quantity] ?? r.quantity}`,
    value: formatReading(r),
    note: pressureNote(r, refrigerantOf(r.stage), atmosphericKpa),
  }))
  const derived = Object.entries(c.ranking?.derived ?? {}).flatMap(([stage, d]) => derivedRows(stage as Stage, d as StageDerived))
  const tests = c.testResults.map((t) => ({ label: `${t.test}${t.stage ? ` (${STAGE_LABEL[t.stage]})` : ''}`, value: t.outcome, note: new Date(t.at).toISOString().slice(0, 16).replace('T', ' ') }))
  const findings: ReportRow[] = c.closure
    ? [
        ...c.closure.confirmedCauses.map((k) => ({ label: 'Confirmed cause', value: `${k.cause}${k.stage ? ` (${STAGE_LABEL[k.stage]})` : ''}` })),
        { label: 'Work done', value: c.closure.workDone },
        ...(c.closure.parts.length ? [{ label: 'Parts', value: c.closure.parts.join(', ') }] : []),
        { label: 'Unit at departure', value: c.closure.unitStateAtDeparture || 'not recorded' },
        ...(c.closure.followUp ? [{ label: 'Follow-up', value: c.closure.followUp }] : []),
      ]
    : (c.ranking?.causes ?? []).slice(0, 3).map((k) => ({ label: 'Likely cause (open case)', value: `${k.cause}${k.stage ? ` (${STAGE_LABEL[k.stage]})` : ''}`, note: `${fmt(k.probability * 100, 0)} %` }))
  const transactions = c.transactions.map((t) => ({
    label: `${STAGE_LABEL[t.stage]}: ${t.refrigerant} ${t.direction}`,
    value: `${fmt(t.grams, 0)} g`,
    note: t.cylinder ? `cylinder ${t.cylinder}` : undefined,
  }))
  const safetyNotes = [
    ...new Set(c.unit.stages.flatMap((s) => findRefrigerant(s.refrigerant)?.cautions ?? [])),
    'Work was carried out by a trained technician under local codes; this report supports, and does not replace, their judgement.',
  ]
  return {
    title: `Service report: ${c.unit.name}`,
    reference: `Case ${c.id}`,
    organisation,
    technician: c.technician ?? 'not recorded',
    openedAt: c.openedAt,
    closedAt: c.closedAt,
    sections: [
      { title: 'Unit', rows: unitRows },
      { title: 'Complaint', rows: [{ label: 'Reported', value: c.complaint }, ...(c.symptoms.length ? [{ label: 'Symptoms', value: c.symptoms.join(', ') }] : [])] },
      { title: 'Readings', rows: readings.length ? readings : [{ label: 'Readings', value: 'none recorded' }] },
      { title: 'Derived values', rows: derived.length ? derived : [{ label: 'Derived values', value: 'not enough readings' }] },
      { title: 'Tests and outcomes', rows: tests.length ? tests : [{ label: 'Tests', value: 'none recorded' }] },
      { title: 'Findings', rows: findings },
      { title: 'Refrigerant transactions', rows: transactions.length ? transactions : [{ label: 'Refrigerant', value: 'none added or recovered' }] },
    ],
    safetyNotes,
  }
}
