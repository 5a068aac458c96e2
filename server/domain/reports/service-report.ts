// The service report as data: the same model feeds the printable page, the PDF and the e-mail.
// Pure: it reads a case record and the property module; every word comes from the vocabulary and
// every figure from the formatting module, so no machine word reaches the customer.
import type { CaseDto, CaseReading } from '#shared/types/cases'
import { CASE_PHASES, type CasePhase, type Reading, type Stage, type StageDerived } from '#shared/types/diagnosis'
import type { ReportRecipient, ReportRow, ReportSection, ServiceReport } from '#shared/types/reports'
import { formatDateTime, formatPercent, formatPressure, formatQuantity, formatReading } from '#shared/utils/format'
import { findRefrigerant, isDesignation, saturationTemperature, toKpaAbs } from '#shared/utils/properties'
import {
  CONFIRMATION_BASIS_WORDS, READING_PHASE_WORDS, STEP_VERDICT_WORDS, causeOnStage, directionLabel, outcomeLabel, readingName, repairStepLabel, stageLabel,
  symptomLabel, testLabel, unitKindLabel, type KnowledgeBaseTitles,
} from '#shared/utils/vocabulary'

export type { ReportRow, ReportSection, ServiceReport }

/** What the report needs besides the case: whose it is, where times are written, how gauges read. */
export interface ReportSetting {
  organisation: string
  timeZone: string
  /** The site's atmosphere, kPa absolute, for gauge readings. */
  atmosphericKpa: number
  titles: KnowledgeBaseTitles
  /** The site's contacts who may receive the report. */
  recipients?: ReportRecipient[]
}

/** The words under which the customer signs for the report. */
export const ACKNOWLEDGEMENT = 'Received and understood on behalf of the customer. Name, signature and date:'

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

const STANDING_FIGURES = new Set(['expected standing pressure', 'standing pressure as % of expected', 'charge remaining (from standing pressure)'])

function derivedRows(stage: Stage, d: StageDerived, conditions: { ambient?: string; atmosphere: string }): ReportRow[] {
  const rows: ReportRow[] = []
  const add = (label: string, text: string | undefined) => {
    if (!text) return
    const room = STANDING_FIGURES.has(label) ? (conditions.ambient ? `at a room temperature of ${conditions.ambient}; ` : 'no room temperature recorded; ') : ''
    rows.push({ label: `${stageLabel(stage)}: ${label}`, value: text, figure: true, note: `${room}gauges read against ${conditions.atmosphere}` })
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
    ...c.closure.confirmedCauses.map((k) => ({ label: 'Confirmed cause', value: causeOnStage(k, titles), ...(k.basis ? { note: CONFIRMATION_BASIS_WORDS[k.basis] } : {}) })),
    { label: 'Work done', value: c.closure.workDone },
    ...(c.closure.parts.length ? [{ label: 'Parts', value: c.closure.parts.join(', ') }] : []),
    { label: 'Unit at departure', value: c.closure.unitStateAtDeparture || 'not recorded' },
    ...(c.closure.followUp ? [{ label: 'Follow-up', value: c.closure.followUp }] : []),
  ]
}

/** Names of the people of a case, from its timeline (the record keeps user ids on readings). */
function namesOf(c: CaseDto): Map<number, string> {
  const names = new Map<number, string>()
  for (const e of c.events) if (e.byUserId !== null && e.by) names.set(e.byUserId, e.by)
  return names
}

const STAGE_ORDER: Record<string, number> = { high: 0, low: 1, single: 2 }

function readingRows(c: CaseDto, readings: CaseReading[], setting: ReportSetting, names: Map<number, string>): ReportRow[] {
  const refrigerantOf = (stage?: Stage) => c.unit.stages.find((s) => s.stage === stage)?.refrigerant
  const sorted = [...readings].sort((a, b) => (STAGE_ORDER[a.stage ?? ''] ?? 3) - (STAGE_ORDER[b.stage ?? ''] ?? 3) || a.at.localeCompare(b.at))
  return sorted.map((r) => {
    const notes: string[] = []
    if (r.struck) notes.push(`struck out: ${r.struck.reason}`)
    else {
      const p = pressureNote(r, refrigerantOf(r.stage), setting.atmosphericKpa)
      if (p) notes.push(p)
    }
    if (r.corrected) notes.push(`corrected from ${formatReading(r.corrected.from)}: ${r.corrected.reason}`)
    if (r.confirmedOutside) notes.push(`outside the unit's design range, confirmed: ${r.confirmedOutside.reason}`)
    return {
      label: readingName(r), value: formatReading(r), figure: true, time: formatDateTime(r.at, setting.timeZone),
      by: r.by !== null ? (names.get(r.by) ?? 'not recorded') : 'data logger',
      ...(notes.length ? { note: notes.join('; ') } : {}), ...(r.struck ? { struck: true } : {}),
    }
  })
}

/** The room temperature the diagnosis read its standing figures at: the latest one taken while diagnosing. */
function diagnosisAmbient(c: CaseDto, timeZone: string): string | undefined {
  const ambient = c.readings.filter((r) => r.quantity === 'ambientTemperature' && !r.struck && (!r.phase || r.phase === 'diagnosis')).at(-1)
  return ambient ? `${formatReading(ambient)} (read ${formatDateTime(ambient.at, timeZone)})` : undefined
}

function stepRows(c: CaseDto, setting: ReportSetting, names: Map<number, string>): ReportRow[] {
  return c.steps.flatMap((step) => {
    const head: ReportRow = {
      label: `${repairStepLabel(step.kind)}, ${stageLabel(step.stage)}`,
      value: STEP_VERDICT_WORDS[step.result.verdict],
      note: step.struck ? `struck out: ${step.struck.reason}` : step.result.summary,
      time: formatDateTime(step.at, setting.timeZone),
      by: step.by !== null ? (names.get(step.by) ?? 'not recorded') : 'not recorded',
      ...(step.struck ? { struck: true } : {}),
    }
    if (step.struck) return [head]
    const figures = step.result.figures.map((f): ReportRow => ({ label: f.label, value: f.value, figure: /^[−-]?\d/.test(f.value), detail: true }))
    const warnings = step.result.warnings.map((w): ReportRow => ({ label: 'Note', value: w, detail: true }))
    return [head, ...figures, ...warnings]
  })
}

/** Cautions for the stages worked on (steps or refrigerant handled), each named with its stage; all stages when none was. */
function safetyNotesOf(c: CaseDto): string[] {
  const worked = new Set<Stage>([...c.steps.filter((s) => !s.struck).map((s) => s.stage), ...c.transactions.map((t) => t.stage)])
  const stages = c.unit.stages.filter((s) => !worked.size || worked.has(s.stage))
  return [
    ...stages.flatMap((s) => (findRefrigerant(s.refrigerant)?.cautions ?? []).map((n) => `${stageLabel(s.stage)} (${s.refrigerant}): ${n}`)),
    'Work was carried out by a trained technician under local codes; this report supports, and does not replace, their judgement.',
  ]
}

/** Builds the report of a case in the organisation's words and time zone. */
export function buildServiceReport(c: CaseDto, setting: ReportSetting): ServiceReport {
  const { titles, timeZone } = setting
  const names = namesOf(c)
  const phaseOf = (r: { phase?: CasePhase }) => r.phase ?? 'diagnosis'
  const readingSections: ReportSection[] = CASE_PHASES.flatMap((phase) => {
    const rows = readingRows(c, c.readings.filter((r) => phaseOf(r) === phase), setting, names)
    return rows.length ? [{ title: `Readings ${READING_PHASE_WORDS[phase].toLowerCase()}`, rows, layout: 'table' as const }] : []
  })
  const site = `the atmosphere at the site, ${formatPressure(setting.atmosphericKpa, { decimals: 1 })} (${formatQuantity(c.unit.siteAltitudeM, 'm', 0)} above sea level)`
  const derived = Object.entries(c.ranking?.derived ?? {}).flatMap(([stage, d]) => derivedRows(stage as Stage, d as StageDerived, { ambient: diagnosisAmbient(c, timeZone), atmosphere: site }))
  const tests = c.testResults.map((t): ReportRow => {
    const label = (o: string) => outcomeLabel(t.test, o, { label: titles.outcomes[t.test]?.[o] })
    const notes = [
      ...(t.phase && t.phase !== 'diagnosis' ? [READING_PHASE_WORDS[t.phase].toLowerCase()] : []),
      ...(t.struck ? [`struck out: ${t.struck.reason}`] : []),
      ...(t.corrected ? [`corrected from "${label(t.corrected.from.outcome)}": ${t.corrected.reason}`] : []),
    ]
    return {
      label: `${testLabel(t.test, { title: titles.tests[t.test] })}${t.stage ? `, ${stageLabel(t.stage)}` : ''}`,
      value: label(t.outcome),
      time: formatDateTime(t.at, timeZone),
      by: t.by !== null ? (names.get(t.by) ?? 'not recorded') : 'not recorded',
      ...(notes.length ? { note: notes.join('; ') } : {}),
      ...(t.struck ? { struck: true } : {}),
    }
  })
  const steps = stepRows(c, setting, names)
  const transactions = c.transactions.map((t) => ({
    label: `${stageLabel(t.stage)}: ${t.refrigerant} ${directionLabel(t.direction).toLowerCase()}`,
    value: formatQuantity(t.grams, 'g', 0),
    figure: true,
    note: t.cylinder ? `cylinder ${t.cylinder}` : undefined,
  }))
  const photos = c.reportPhotoIds.flatMap((id) => {
    const u = c.uploads.find((x) => x.id === id && x.mime.startsWith('image/'))
    return u ? [{ id: u.id, caption: `${u.originalName}, added ${formatDateTime(u.createdAt, timeZone)}`, url: u.url, thumbUrl: u.thumbUrl }] : []
  })
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
      ...(readingSections.length ? readingSections : [{ title: 'Readings as found', rows: [{ label: 'Readings', value: 'none recorded' }] }]),
      { title: 'Derived values', rows: derived.length ? derived : [{ label: 'Derived values', value: 'not enough readings' }] },
      { title: 'Tests and outcomes', rows: tests.length ? tests : [{ label: 'Tests', value: 'none recorded' }], layout: tests.length ? 'table' : 'list' },
      { title: 'Repair and verification', rows: steps.length ? steps : [{ label: 'Steps', value: 'none recorded' }] },
      { title: 'Findings', rows: findingRows(c, titles) },
      { title: 'Refrigerant transactions', rows: transactions.length ? transactions : [{ label: 'Refrigerant', value: 'none added or recovered' }] },
    ],
    safetyNotes: safetyNotesOf(c),
    photos,
    acknowledgement: ACKNOWLEDGEMENT,
    recipients: setting.recipients ?? [],
  }
}

/** The plain-text body of the report e-mail: the same sections, line by line. */
export function reportEmailText(report: ServiceReport): string {
  const line = (r: ReportRow) => {
    const when = r.time ? ` [${r.time}${r.by ? `, ${r.by}` : ''}]` : ''
    return `${r.detail ? '  ' : ''}${r.label}: ${r.struck ? `(struck out) ${r.value}` : r.value}${r.note ? ` (${r.note})` : ''}${when}`
  }
  const lines = report.sections.flatMap((s) => ['', s.title.toUpperCase(), ...s.rows.map(line)])
  return [
    `${report.title} (${report.reference})`, `${report.organisation} · technician ${report.technician}`, report.when[0]!.toUpperCase() + report.when.slice(1),
    ...lines, '', 'SAFETY NOTES', ...report.safetyNotes.map((n) => `- ${n}`), '', 'The full report is attached as a PDF.',
  ].join('\n')
}
