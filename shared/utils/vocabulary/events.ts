// Timeline events in words. The same sentences appear on the case page, in replays and wherever a
// case's history is shown; the event types and payloads stay the API's.
import type { CaseEventDto, CaseEventType } from '#shared/types/cases'
import type { Quantity, ReadingUnit, Stage } from '#shared/types/diagnosis'
import { formatPercent, formatQuantity, formatReading } from '../format/figures'
import { formatDuration } from '../format/dates'
import { causeLabel, hypothesisLabel } from './causes'
import { readingName } from './quantities'
import { stageLabel } from './stages'
import { symptomLabel } from './symptoms'
import { outcomeLabel, testLabel } from './tests'
import { inPlainWords } from './text'
import { READING_PHASE_WORDS, STEP_VERDICT_WORDS, repairStepLabel } from './repair-steps'
import type { RepairStepKind, StepVerdict } from '#shared/types/repair-steps'
import { NO_TITLES, type KnowledgeBaseTitles } from './titles'
import type { WordForm, WordLabel } from './words'

/** What happened, as a timeline heading. */
export const EVENT_WORDS: Readonly<Record<CaseEventType, WordLabel>> = {
  'case-opened': { short: 'Opened', long: 'Case opened' },
  'symptoms-set': { short: 'Symptoms', long: 'Symptoms set' },
  'reading-entered': { short: 'Reading', long: 'Reading entered' },
  'test-proposed': { short: 'Proposed', long: 'Test proposed' },
  'outcome-recorded': { short: 'Outcome', long: 'Outcome recorded' },
  note: { short: 'Note', long: 'Note' },
  photo: { short: 'File', long: 'Photo or document added' },
  'ranking-snapshot': { short: 'Ranking', long: 'Likely causes updated' },
  'case-closed': { short: 'Closed', long: 'Case closed' },
  addendum: { short: 'Addendum', long: 'Addendum' },
  'report-queued': { short: 'Report queued', long: 'Report queued for e-mail' },
  'report-sent': { short: 'Report sent', long: 'Report e-mailed' },
  'report-failed': { short: 'Report not sent', long: 'Report e-mail failed' },
  'reading-struck': { short: 'Struck out', long: 'Reading struck out' },
  'reading-corrected': { short: 'Corrected', long: 'Reading corrected' },
  'outcome-struck': { short: 'Struck out', long: 'Test outcome struck out' },
  'outcome-corrected': { short: 'Corrected', long: 'Test outcome corrected' },
  'step-recorded': { short: 'Step', long: 'Repair step recorded' },
  'step-struck': { short: 'Struck out', long: 'Repair step struck out' },
  'report-photos-set': { short: 'Report photos', long: 'Photos chosen for the report' },
  'nameplate-changed': { short: 'Refilled', long: 'Stage refilled: nameplate record changed' },
}

/** "Case opened". */
export function eventLabel(type: CaseEventType, form: WordForm = 'long'): string {
  return EVENT_WORDS[type]?.[form] ?? inPlainWords(String(type))
}

type Payload = Record<string, unknown>
const str = (v: unknown) => (typeof v === 'string' ? v : '')
const onStage = (stage: unknown) => (typeof stage === 'string' && stage ? ` on the ${stageLabel(stage as Stage)}` : '')

/** The detail line of a timeline event: what was read, proposed, found or sent, in words. */
export function eventDetail(event: Pick<CaseEventDto, 'type'> & Payload, titles: KnowledgeBaseTitles = NO_TITLES): string {
  const p = event as Payload
  const test = (slug: unknown) => testLabel(str(slug), { title: titles.tests[str(slug)] })
  switch (event.type) {
    case 'case-opened':
      return str(p.complaint)
    case 'symptoms-set':
      return ((p.symptoms as string[] | undefined) ?? []).map((s) => symptomLabel(s)).join(', ') || 'none'
    case 'reading-entered': {
      const reading = { quantity: p.quantity as Quantity, stage: (p.stage as Stage | undefined) ?? undefined }
      const phase = p.phase && p.phase !== 'diagnosis' ? ` (${READING_PHASE_WORDS[p.phase as keyof typeof READING_PHASE_WORDS]?.toLowerCase() ?? ''})` : ''
      const outside = (p.confirmedOutside as { reason?: string } | undefined)?.reason
      return `${readingName(reading)}: ${formatReading({ value: p.value as number | boolean, unit: p.unit as ReadingUnit })}${phase}${outside ? `; confirmed outside the design range: ${outside}` : ''}`
    }
    case 'reading-struck': {
      const reading = { quantity: p.quantity as Quantity, stage: (p.stage as Stage | undefined) ?? undefined }
      return `${readingName(reading)}: ${formatReading({ value: p.value as number | boolean, unit: p.unit as ReadingUnit })} struck out (${str(p.reason)})`
    }
    case 'reading-corrected': {
      const reading = { quantity: p.quantity as Quantity, stage: (p.stage as Stage | undefined) ?? undefined }
      const from = p.from as { value: number | boolean; unit: ReadingUnit } | undefined
      return `${readingName(reading)}: ${from ? formatReading(from) : '?'} corrected to ${formatReading({ value: p.value as number | boolean, unit: p.unit as ReadingUnit })} (${str(p.reason)})`
    }
    case 'outcome-struck':
      return `${test(p.test)}${onStage(p.stage)}: ${outcomeLabel(str(p.test), str(p.outcome), { label: titles.outcomes[str(p.test)]?.[str(p.outcome)] })} struck out (${str(p.reason)})`
    case 'outcome-corrected': {
      const label = (o: string) => outcomeLabel(str(p.test), o, { label: titles.outcomes[str(p.test)]?.[o] })
      return `${test(p.test)}${onStage(p.stage)}: ${label(str(p.from))} corrected to ${label(str(p.outcome))} (${str(p.reason)})`
    }
    case 'step-recorded':
      return `${repairStepLabel(p.kind as RepairStepKind)}${onStage(p.stage)}: ${STEP_VERDICT_WORDS[p.verdict as StepVerdict] ?? ''}. ${str(p.summary)}`
    case 'step-struck':
      return `${repairStepLabel(p.kind as RepairStepKind)}${onStage(p.stage)} struck out (${str(p.reason)})`
    case 'nameplate-changed':
      return `${stageLabel(str(p.stage) as Stage)}: ${str(p.previousRefrigerant)} replaced by ${str(p.refrigerant)}${typeof p.chargeG === 'number' ? `, ${formatQuantity(p.chargeG, 'g', 0)}` : ''}`
        + `${typeof p.standingPressureKpa === 'number' && typeof p.ambientC === 'number' ? `, standing at ${formatQuantity(p.standingPressureKpa, 'kPa', 0)} at ${formatQuantity(p.ambientC, 'C', 1)}` : ''}${p.note ? `. ${str(p.note)}` : ''}`
    case 'report-photos-set':
      return `${((p.uploadIds as number[] | undefined) ?? []).length} photo(s) in the report`
    case 'test-proposed':
      return `${test(p.test)}${onStage(p.stage)}${typeof p.minutes === 'number' ? ` (${formatDuration(p.minutes)})` : ''}`
    case 'outcome-recorded': {
      const outcome = outcomeLabel(str(p.test), str(p.outcome), { label: titles.outcomes[str(p.test)]?.[str(p.outcome)] })
      return `${test(p.test)}${onStage(p.stage)}: ${outcome}${p.note ? ` (${str(p.note)})` : ''}`
    }
    case 'note':
    case 'addendum':
      return str(p.text)
    case 'photo':
      return str(p.name)
    case 'ranking-snapshot':
      return ((p.top as { cause: string; stage?: Stage; probability: number }[] | undefined) ?? [])
        .map((t) => `${hypothesisLabel(t, { title: titles.causes[t.cause] })} ${formatPercent(t.probability)}`)
        .join(' · ')
    case 'case-closed': {
      const confirmed = (p.confirmedCauses as { cause: string; stage?: Stage }[] | undefined) ?? []
      const causes = confirmed.map((c) => causeOnStage(c, titles)).join('; ')
      return causes ? `Confirmed: ${causes}` : ''
    }
    case 'report-queued':
      return `to ${((p.to as string[] | undefined) ?? []).join(', ')}`
    case 'report-sent':
      return `to ${str(p.to)}`
    case 'report-failed':
      return `${str(p.to)}: ${str(p.error)}${p.willRetry ? ' (will retry)' : ''}`
    default:
      return ''
  }
}

/** A confirmed or likely cause in words for lists and reports ("Refrigerant leak (undercharge), Low stage"). */
export function causeOnStage(c: { cause: string; stage?: Stage | null }, titles: KnowledgeBaseTitles = NO_TITLES): string {
  const cause = causeLabel(c.cause, { title: titles.causes[c.cause] })
  return c.stage ? `${cause}, ${stageLabel(c.stage)}` : cause
}
