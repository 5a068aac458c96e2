// A generated service history for benchmarks: `count` closed cases with confirmed causes spread over
// the given units, each built by the demo's fault scenarios (readings from the operating-state model,
// with the case number as noise seed and room temperature), so no two cases read alike.
import { planClose } from '#server/domain/cases/case-changes'
import { historyFor } from '#server/db/seeders/demo-cases'
import type { CaseClosure, CaseReading, CaseTestResult } from '#shared/types/cases'
import type { Symptom } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'

export interface GeneratedCase {
  unitId: number
  complaint: string
  symptoms: Symptom[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
  closure: CaseClosure
  confirmedCauses: { cause: string; stage?: string }[]
  openedAt: Date
  closedAt: Date
}

const MINUTE = 60_000

/** `count` closed cases, case i on unit i mod units.length, opened one hour apart before `end`. */
export function* generatedHistory(units: readonly UnitDto[], count: number, end: Date, technicianId: number | null = null): Generator<GeneratedCase> {
  if (!units.length) throw new Error('A generated history needs at least one unit')
  for (let i = 0; i < count; i++) {
    const unit = units[i % units.length]!
    const demo = historyFor(unit, 1, i)[0]!
    if (!demo.close) continue
    const openedAt = new Date(end.getTime() - (count - i) * 60 * MINUTE)
    const at = (m: number) => new Date(openedAt.getTime() + m * MINUTE).toISOString()
    const closure = planClose(unit, demo.close, technicianId)
    yield {
      unitId: unit.id,
      complaint: demo.complaint,
      symptoms: demo.symptoms,
      readings: demo.readings.map((r) => ({ ...r, at: at(12), by: technicianId })),
      testResults: demo.tests.map((t, k) => ({ ...t, at: at(37 + 25 * k), by: technicianId })),
      closure,
      confirmedCauses: closure.confirmedCauses,
      openedAt,
      closedAt: new Date(openedAt.getTime() + 55 * MINUTE),
    }
  }
}
