/**
 * Running a finding's worked examples against a version: does the finding apply to the example's
 * facts as expected, and when it applies, does it move each named cause up or down as expected.
 * "Up" means the finding is likelier under that cause than under the field of causes weighted by
 * their starting odds (the same yardstick the case page's evidence factors use).
 */
import { compileScreen, missingFacts, prepareKnowledgeBase } from '#server/domain/diagnosis/engine'
import { findingLogLikelihoods, modelFor } from '#server/domain/diagnosis/evidence'
import type { KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import { defaultPriors } from '#server/domain/diagnosis/priors'
import type { Facts } from '#server/domain/diagnosis/fact-sheet'
import type { PreparedFinding } from '#server/domain/diagnosis/rule-expansion'
import type { UnitKind } from '#shared/types/diagnosis'
import type { FindingExample } from './examples-schema'

export interface ExampleOutcome {
  finding: string
  index: number
  title: string
  passed: boolean
  /** What went wrong, in words; empty when passed. */
  problems: string[]
}

function kindOf(example: FindingExample): UnitKind {
  return example.unitKind ?? (example.stage === 'single' ? 'single-stage' : 'cascade')
}

function copyFor(kb: KnowledgeBase, name: string, example: FindingExample): PreparedFinding | string {
  const copies = prepareKnowledgeBase(kb).findings.filter((f) => f.name === name)
  if (!copies.length) return `no finding is named "${name}"`
  if (copies.length === 1 && copies[0]!.stage === undefined) return copies[0]!
  if (example.stage) return copies.find((f) => f.stage === example.stage) ?? `"${name}" has no copy for the ${example.stage} stage`
  if (copies.length > 1) return `"${name}" is written for several stages (${copies.map((c) => c.stage).join(', ')}); say which stage the example is about`
  return copies[0]!
}

/** Log of the prior-weighted mean likelihood of a finding over all hypotheses. */
function fieldLog(logL: Float64Array, priors: number[]): number {
  let max = -Infinity
  for (const l of logL) if (l > max) max = l
  let sum = 0
  logL.forEach((l, i) => (sum += (priors[i] ?? 0) * Math.exp(l - max)))
  return max + Math.log(sum)
}

/** Runs one example of finding `name` against `kb`. */
export function runExample(kb: KnowledgeBase, name: string, example: FindingExample, index = 0): ExampleOutcome {
  const out: ExampleOutcome = { finding: name, index, title: example.title, passed: false, problems: [] }
  const finding = copyFor(kb, name, example)
  if (typeof finding === 'string') {
    out.problems.push(finding)
    return out
  }
  const kind = kindOf(example)
  // Copies of a finding for a cabinet or room stage carry the unit kind they apply to.
  const facts = { 'unit.kind': kind, ...example.facts } as Facts
  const missing = missingFacts(finding, facts)
  const fires = missing.length === 0 && compileScreen(finding.conditions)(facts)
  if (example.expect === 'fires' && !fires) {
    out.problems.push(missing.length ? `does not apply: the example lacks ${missing.join(', ')}` : 'does not apply: its conditions are false for these facts')
  }
  if (example.expect === 'does-not-fire' && fires) out.problems.push('applies, but the example says it should not')
  if (fires && example.moves?.length) {
    const model = modelFor(prepareKnowledgeBase(kb), kb.causes, kind)
    const logL = findingLogLikelihoods(model, finding, facts)
    if (!logL) out.problems.push('its measured value is missing, so it moves nothing')
    else {
      const priors = defaultPriors(kb.causes, model.hypotheses, kind)
      const yardstick = fieldLog(logL, priors)
      for (const move of example.moves) {
        const stage = move.stage ?? example.stage
        const indices = model.hypotheses.map((h, i) => (h.cause === move.cause && (!stage || !h.stage || h.stage === stage) ? i : -1)).filter((i) => i >= 0)
        if (!indices.length) {
          out.problems.push(`${move.cause}${stage ? ` on the ${stage} stage` : ''} is not a hypothesis of a ${kind} unit`)
          continue
        }
        const best = Math.max(...indices.map((i) => logL[i] as number))
        const factor = Math.exp(best - yardstick)
        const up = factor > 1
        if ((move.direction === 'up') !== up) {
          out.problems.push(`moves ${move.cause} ${up ? 'up' : 'down'} (×${factor.toPrecision(2)} against the field), expected ${move.direction}`)
        }
      }
    }
  }
  out.passed = out.problems.length === 0
  return out
}

/** Runs every example of every finding. */
export function runExamples(kb: KnowledgeBase, examples: Record<string, FindingExample[]>): ExampleOutcome[] {
  return Object.entries(examples).flatMap(([name, list]) => list.map((example, i) => runExample(kb, name, example, i)))
}
