/**
 * Test results of a rank request: checked against each test's own outcome words and stages, split by
 * phase (repair and verification results are kept out of the diagnosis), and reduced to the latest
 * outcome per test and stage, since a repeated test replaces the earlier answer rather than adding to it.
 *
 * Results come in the order they were recorded. Where no phase is given, it follows from that order:
 * once an outcome has settled a cause by itself (a leak found), a test that opens the system is part of
 * the repair, and a test repeated on the same stage verifies the repair; neither moves the diagnosis.
 */
import type { Cause, Stage, TestResult, UnitKind } from '#shared/types/diagnosis'
import { STAGES_OF_KIND } from '#shared/schemas/diagnosis'
import { STAGE_PHRASE } from './fact-sheet'
import type { KnowledgeBase, TestDef, TestOutcomeDef } from './knowledge-base'
import { resolveEntry } from './likelihood'

export interface ResolvedTestResult {
  test: TestDef
  stage: Stage
  outcome: TestOutcomeDef
}

export class RankInputError extends Error {
  constructor(readonly issues: string[]) {
    super(issues.join('; '))
    this.name = 'RankInputError'
  }
}

function resolveStage(test: TestDef, given: Stage | undefined, kind: UnitKind): Stage | string {
  const possible = test.stages.filter((s) => STAGES_OF_KIND[kind].includes(s))
  if (given) return possible.includes(given) ? given : `${test.slug} does not apply to the ${given} stage; allowed: ${possible.join(', ')}`
  if (possible.length === 1 && possible[0]) return possible[0]
  return `${test.slug} needs a stage on a ${kind} unit; allowed: ${possible.join(', ')}`
}

export interface SortedTestResults {
  diagnosis: ResolvedTestResult[]
  /** Results kept in the record but left out of the ranking, in words. */
  setAside: string[]
}

const PHASE_WORDS = { repair: 'during the repair', verification: 'to verify the repair' } as const

/** Checks outcome words against each test's own list; problems are returned together for one 400. */
export function resolveTestResults(kb: Pick<KnowledgeBase, 'tests'>, kind: UnitKind, results: TestResult[] = []): SortedTestResults {
  const issues: string[] = []
  const latest = new Map<string, ResolvedTestResult>()
  const setAside: string[] = []
  let settledBy: string | undefined
  results.forEach((r, i) => {
    const test = kb.tests.find((t) => t.slug === r.test)
    if (!test) return void issues.push(`testResults[${i}]: test "${r.test}" is not in this knowledge base`)
    const outcome = test.outcomes.find((o) => o.slug === r.outcome)
    if (!outcome) {
      return void issues.push(`testResults[${i}]: Unknown outcome "${r.outcome}" for ${r.test}; allowed: ${test.outcomes.map((o) => o.slug).join(', ')}`)
    }
    const stage = resolveStage(test, r.stage, kind)
    if (!STAGES_OF_KIND[kind].includes(stage as Stage)) return void issues.push(`testResults[${i}]: ${stage}`)
    const key = `${test.slug}@${stage}`
    const what = `${test.title} on the ${STAGE_PHRASE[stage as Stage]} ("${outcome.label}")`
    if (r.phase && r.phase !== 'diagnosis') {
      setAside.push(`${what}, done ${PHASE_WORDS[r.phase]}, is kept in the record but does not move the diagnosis.`)
      return
    }
    if (!r.phase && settledBy && (test.opensSystem || latest.has(key))) {
      const role = test.opensSystem ? 'part of the repair' : 'a check of the repair'
      setAside.push(`${what}, recorded after "${settledBy}", is taken as ${role}; it is kept in the record but does not move the diagnosis.`)
      return
    }
    latest.set(key, { test, stage: stage as Stage, outcome })
    if (outcome.definitive && !settledBy) settledBy = outcome.label
  })
  if (issues.length) throw new RankInputError(issues)
  return { diagnosis: [...latest.values()], setAside }
}

/** Smallest chance a definitive outcome must give the confirmed cause to count as proving it. */
const PROVES_FROM = 0.5

/**
 * Whether a cause confirmed at closing rests on a definitive test: an outcome marked definitive, on the
 * confirmed stage, that the cause makes likely (a leak found for a leak, a probe found off for a probe
 * fault). The case layer uses it to decide which confirmations may teach the starting odds; a repair
 * that by itself proves the cause (a part replaced and the fault gone) is the case record's to mark.
 */
export function confirmationIsDefinitive(kb: Pick<KnowledgeBase, 'tests'>, kind: UnitKind, confirmed: { cause: Cause; stage?: Stage }, results: TestResult[]): boolean {
  return results.some((r) => {
    const test = kb.tests.find((t) => t.slug === r.test)
    const outcome = test?.outcomes.find((o) => o.slug === r.outcome)
    if (!test || !outcome?.definitive) return false
    const stage = r.stage ?? (test.stages.filter((s) => STAGES_OF_KIND[kind].includes(s)).length === 1 ? test.stages.find((s) => STAGES_OF_KIND[kind].includes(s)) : undefined)
    if (confirmed.stage && stage !== confirmed.stage) return false
    return resolveEntry(outcome.likelihoods, confirmed, stage, kind) >= PROVES_FROM
  })
}
