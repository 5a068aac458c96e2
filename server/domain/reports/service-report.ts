// The service report as data: the same model feeds the printable page, the PDF and the e-mail.
// Pure: it reads a case record and the property module; every word comes from the vocabulary and
// every figure from the formatting module, so no machine word reaches the customer.
import type { CaseDto } from '#shared/types/cases'
import type { Reading, Stage, StageDerived } from '#shared/types/diagnosis'
import type { ReportRow, ReportSection, ServiceReport } from '#shared/types/reports'
import { formatDateTime, formatPercent, formatPressure, formatQuantity, formatReading } from '#shared/utils/format'
import { findRefrigerant, isDesignation, saturationTemperature, toKpaAbs } from '#shared/utils/properties'
import {
  causeOnStage, directionLabel, outcomeLabel, readingName, stageLabel, symptomLabel, testLabel, unitKindLabel, type KnowledgeBaseTitles,
} from '#shared/utils/vocabulary'
import { latestReadings } from '../cases/case-record'

export type { ReportRow, ReportSection, ServiceReport }

/** What the report needs besides the case: whose it is, where times are written, how gauges read. */
export interface ReportSetting {
  organisation: string
  timeZone: string
  /** The site's atmosphere, kPa absolute, for gauge readings. */
  atmosphericKpa: number
  titles: KnowledgeBaseTitles
}

/** For a stage pressure: absolute value and the refrigerant's saturation temperature at it. */
export function pressureNote(r: Reading, refrigerant: string | undefined, atmosphericKpa: number): string | undefined {
  if (typeof r.value !== 'number' || !refrigerant || !isDesignation(refrigerant) || !r.quantity.endsWith('Pressure')) return undefined
  try {
    const kpa = toKpaAbs(r.value, r.unit, atmosphericKpa)
    const sat = saturationTemperature(refrigerant, kpa)
    const satText = Math.abs(sat.dewC - sat.bubbleC) > 0.05
      ? `dew ${formatQuantity(sat.dewC, 'C')}, bubble ${formatQuantity(sat.bubbleC, 'C')}`
      : formatQuantity(sat.dewC, 'C')
    return `${formatPressure(kpa, { decimals: 0 })}; ${refrigerant} saturation ${satText}`
  } catch {
    return `${refrigerant}: outside the saturation range`
  }
}

function derivedRows(stage: Stage, d: StageDerived): ReportRow[] {
  const rows: ReportRow[] = []
  const add = (label: string, text: string | undefined) => {
    if (text) rows.push({ label: `${stageLabel(stage)}: ${label}`, value: text })
  }
  const figure = (v: number | undefined, unit: string, decimals = 1) => (v !== undefined && Number.isFinite(v) ? formatQuantity(v, unit, decimals) : undefined)
  add('saturated suction', figure(d.saturatedSuctionC, 'C'))
  add('saturated condensing', figure(d.saturatedCondensingC, 'C'))
  add('superheat', figure(d.superheatK, 'K', 1))
  add('subcooling', figure(d.subcoolingK, 'K', 1))
  add('compression ratio', figure(d.compressionRatio, ': 1'))
  add('expected standing pressure', d.expectedStandingPressureKpa !== undefined ? formatPressure(d.expectedStandingPressureKpa, { decimals: 0 }) : undefined)
  add('standing pressure as % of expected', figure(d.standingPercentOfExpected, '%', 0))
  add('charge remaining (from standing pressure)', figure(d.standingChargePercent, '% of nameplate', 0))
  add('compressor current', figure(d.currentPercentOfRated, '% of rated load', 0))
  return rows
}

function unitRows(c: CaseDto): ReportRow[] {
  return [
    { label: 'Unit', value: `${c.unit.name} (${unitKindLabel(c.unit.kind, 'long')})` },
    { label: 'Customer and site', value: `${c.unit.customer}, ${c.unit.site}` },
    { label: 'Model and serial', value: `${c.unit.model}, serial ${c.unit.serial}` },
    { label: 'Location', value: c.unit.location || 'not recorded' },
    ...c.unit.stages.map((s) => {
      const info = findRefrigerant(s.refrigerant)
      const charge = s.chargeG !== null ? `${formatQuantity(s.chargeG, 'g')} nameplate` : 'charge not recorded'
      const volume = s.volumeL !== null ? `, ${formatQuantity(s.volumeL, 'L', 1)}` : ''
      return { label: stageLabel(s.stage), value: `${s.refrigerant} (safety class ${info?.safetyClass ?? 'unknown'}), ${charge}${volume}` }
    }),
  ]
}

function findingRows(c: CaseDto, titles: KnowledgeBaseTitles): ReportRow[] {
  if (!c.closure) {
    return (c.ranking?.causes ?? []).slice(0, 3).map((k) => ({
      label: 'Likely cause (open case)', value: causeOnStage(k, { ...titles, causes: { ...titles.causes, [k.cause]: k.title } }), note: formatPercent(k.probability),
    }))
  }
  return [
    ...c.closure.confirmedCauses.map((k) => ({ label: 'Confirmed cause', value: causeOnStage(k, titles) })),
    { label: 'Work done', value: c.closure.workDone },
    ...(c.closure.parts.length ? [{ label: 'Parts', value: c.closure.parts.join(', ') }] : []),
    { label: 'Unit at departure', value: c.closure.unitStateAtDeparture || 'not recorded' },
    ...(c.closure.followUp ? [{ label: 'Follow-up', value: c.closure.followUp }] : []),
  ]
}

/** Builds the report of a case in the organisation's words and time zone. */
export function buildServiceReport(c: CaseDto, setting: ReportSetting): ServiceReport {
  const { titles, timeZone } = setting
  const refrigerantOf = (stage?: Stage) => c.unit.stages.find((s) => s.stage === stage)?.refrigerant
  const readings = latestReadings(c.readings).map((r) => ({
    label: readingName(r), value: formatReading(r), note: pressureNote(r, refrigerantOf(r.stage), setting.atmosphericKpa),
  }))
  const derived = Object.entries(c.ranking?.derived ?? {}).flatMap(([stage, d]) => derivedRows(stage as Stage, d as StageDerived))
  const tests = c.testResults.map((t) => ({
    label: `${testLabel(t.test, { title: titles.tests[t.test] })}${t.stage ? `, ${stageLabel(t.stage)}` : ''}`,
    value: outcomeLabel(t.test, t.outcome, { label: titles.outcomes[t.test]?.[t.outcome] }),
    note: formatDateTime(t.at, timeZone),
  }))
  const transactions = c.transactions.map((t) => ({
    label: `${stageLabel(t.stage)}: ${t.refrigerant} ${directionLabel(t.direction).toLowerCase()}`,
    value: formatQuantity(t.grams, 'g', 0),
    note: t.cylinder ? `cylinder ${t.cylinder}` : undefined,
  }))
  const safetyNotes = [
    ...new Set(c.unit.stages.flatMap((s) => findRefrigerant(s.refrigerant)?.cautions ?? [])),
    'Work was carried out by a trained technician under local codes; this report supports, and does not replace, their judgement.',
  ]
  const opened = `opened ${formatDateTime(c.openedAt, timeZone)}`
  return {
    title: `Service report: ${c.unit.name}`,
    reference: `Case ${c.id}`,
    organisation: setting.organisation,
    technician: c.technician ?? 'not recorded',
    openedAt: c.openedAt,
    closedAt: c.closedAt,
    timeZone,
    when: c.closedAt ? `${opened} · closed ${formatDateTime(c.closedAt, timeZone)}` : `${opened} · still open`,
    sections: [
      { title: 'Unit', rows: unitRows(c) },
      { title: 'Complaint', rows: [{ label: 'Reported', value: c.complaint }, ...(c.symptoms.length ? [{ label: 'Symptoms', value: c.symptoms.map((s) => symptomLabel(s)).join(', ') }] : [])] },
      { title: 'Readings', rows: readings.length ? readings : [{ label: 'Readings', value: 'none recorded' }] },
      { title: 'Derived values', rows: derived.length ? derived : [{ label: 'Derived values', value: 'not enough readings' }] },
      { title: 'Tests and outcomes', rows: tests.length ? tests : [{ label: 'Tests', value: 'none recorded' }] },
      { title: 'Findings', rows: findingRows(c, titles) },
      { title: 'Refrigerant transactions', rows: transactions.length ? transactions : [{ label: 'Refrigerant', value: 'none added or recovered' }] },
    ],
    safetyNotes,
  }
}

/** The plain-text body of the report e-mail: the same sections, line by line. */
export function reportEmailText(report: ServiceReport): string {
  const lines = report.sections.flatMap((s) => ['', s.title.toUpperCase(), ...s.rows.map((r) => `${r.label}: ${r.value}${r.note ? ` (${r.note})` : ''}`)])
  return [
    `${report.title} (${report.reference})`, `${report.organisation} · technician ${report.technician}`, report.when[0]!.toUpperCase() + report.when.slice(1),
    ...lines, '', 'SAFETY NOTES', ...report.safetyNotes.map((n) => `- ${n}`), '', 'The full report is attached as a PDF.',
  ].join('\n')
}
