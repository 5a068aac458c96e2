// What the published knowledge base offers, as `GET /api/diagnosis/tests` and
// `GET /api/diagnosis/vocabulary` return it.
import type { QuantityDimension, ReadingUnit, Stage } from './diagnosis'

/** A diagnostic test with its procedure, cautions and outcome words. */
export interface DiagnosticTestDto {
  test: string
  title: string
  minutes: number
  opensSystem: boolean
  hotWork: boolean
  stages: Stage[]
  safetyNotes: string[]
  procedure: string
  outcomes: { outcome: string; label: string }[]
}

/** The words of the rank request and the rules, with the measurement units each quantity accepts. */
export interface DiagnosisVocabularyDto {
  unitKinds: readonly string[]
  stages: readonly Stage[]
  quantities: { quantity: string; perStage: boolean; dimension: QuantityDimension; units: readonly ReadingUnit[] }[]
  symptoms: readonly string[]
  causes: { cause: string; title: string }[]
  tests: readonly string[]
  units: Record<QuantityDimension, readonly ReadingUnit[]>
  facts: { name: string; type: string; unit: string; meaning: string }[]
}
