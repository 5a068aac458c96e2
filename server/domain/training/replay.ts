// Replaying a case: which timeline events changed what was known, and what was known after each.
// The service ranks every step with the knowledge-base version the case recorded for it. No I/O here.
import type { CaseEventDto, CaseReading, CaseTestResult } from '#shared/types/cases'
import type { Symptom } from '#shared/types/diagnosis'

/** Event types that change what is known about the unit: the facts a ranking reads, and the closing findings. */
export const KNOWLEDGE_EVENTS = ['case-opened', 'symptoms-set', 'reading-entered', 'outcome-recorded', 'case-closed'] as const

/** What was known after one event, and the version of the knowledge base the case ranked it with (null when none was recorded). */
export interface ReplayPoint {
  event: CaseEventDto
  symptoms: Symptom[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
  versionId: number | null
  /** The ranking the case recorded after this event (its top causes), if any. */
  recorded: { cause: string; stage?: string; probability: number }[] | null
}

/** The stored record a replay reads. */
export interface ReplaySource {
  events: CaseEventDto[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
}

const isKnowledgeEvent = (e: CaseEventDto) => (KNOWLEDGE_EVENTS as readonly string[]).includes(e.type)

function versionOf(event: CaseEventDto): number | null {
  const version = event.knowledgeBaseVersion as { id?: unknown } | undefined
  const id = Number(version?.id)
  return Number.isInteger(id) && id > 0 ? id : null
}

// The case keeps each reading and outcome (with its phase) in order; the i-th reading event is the
// i-th stored reading. Should the two ever disagree, the event's own payload is what was entered.
function readingOf(event: CaseEventDto, stored: CaseReading | undefined): CaseReading {
  const p = event as unknown as CaseReading
  if (stored && stored.quantity === p.quantity && (stored.stage ?? null) === (p.stage ?? null) && stored.value === p.value) return stored
  return { quantity: p.quantity, ...(p.stage ? { stage: p.stage } : {}), value: p.value, unit: p.unit, ...(p.phase ? { phase: p.phase } : {}), at: event.at, by: event.byUserId }
}

function resultOf(event: CaseEventDto, stored: CaseTestResult | undefined): CaseTestResult {
  const p = event as unknown as CaseTestResult
  if (stored && stored.test === p.test && (stored.stage ?? null) === (p.stage ?? null) && stored.outcome === p.outcome) return stored
  return { test: p.test, ...(p.stage ? { stage: p.stage } : {}), outcome: p.outcome, ...(p.phase ? { phase: p.phase } : {}), at: event.at, by: event.byUserId }
}

/**
 * One point per event that changed what was known, in timeline order. Each takes the knowledge-base
 * version of the first ranking recorded after it and before the next such event (the ranking that
 * event led to); events the case never ranked after (closing, a note-free repair reading) take the
 * version of the ranking before them, and none at all when the case recorded no ranking.
 */
export function replayPoints(source: ReplaySource): ReplayPoint[] {
  const events = [...source.events].sort((a, b) => a.id - b.id)
  const points: ReplayPoint[] = []
  let symptoms: Symptom[] = []
  const readings: CaseReading[] = []
  const testResults: CaseTestResult[] = []
  let lastVersion: number | null = null
  let open: ReplayPoint[] = []
  for (const event of events) {
    if (event.type === 'ranking-snapshot') {
      const version = versionOf(event)
      if (version !== null) {
        for (const p of open) {
          p.versionId = version
          p.recorded = (event.top as ReplayPoint['recorded']) ?? null
        }
        lastVersion = version
        open = []
      }
      continue
    }
    if (!isKnowledgeEvent(event)) continue
    if (event.type === 'symptoms-set') symptoms = [...new Set((event.symptoms as Symptom[] | undefined) ?? [])]
    if (event.type === 'reading-entered') readings.push(readingOf(event, source.readings[readings.length]))
    if (event.type === 'outcome-recorded') testResults.push(resultOf(event, source.testResults[testResults.length]))
    const point: ReplayPoint = { event, symptoms, readings: [...readings], testResults: [...testResults], versionId: lastVersion, recorded: null }
    points.push(point)
    open.push(point)
  }
  return points
}
