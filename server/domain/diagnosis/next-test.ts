/**
 * Next-test proposal by decision-theoretic troubleshooting (sequential diagnosis in the sense of
 * Heckerman, Breese & Rommelse 1995, "Decision-theoretic troubleshooting", CACM): pick the test
 * whose expected information gain per minute is highest, given the current posterior.
 *
 *   EIG(t) = H(P) − Σ_o P(o) · H(P | o),   P(o) = Σ_h P(h) · P(o | h)
 *
 * Tests that open the system or need hot work carry a penalty factor so that an equally
 * informative non-invasive check is always tried first (less refrigerant vented, less risk).
 */
import type { HypothesisRef, ProposedTest, Stage, UnitKind } from '#shared/types/diagnosis'
import { STAGES_OF_KIND } from '#shared/schemas/diagnosis'
import type { KnowledgeBase, TestDef } from './knowledge-base'
import { normalise, testLikelihood, type Hypothesis, type ResolvedTestResult } from './ranking'

/** Score multiplier per invasive property (opens the system, hot work). */
export const INVASIVE_PENALTY = 0.5
/** Proposals gaining less than this many bits are noise and left out. */
const MIN_GAIN_BITS = 0.005
const SEPARATES_MAX = 3

export function entropyBits(p: number[]): number {
  return p.reduce((h, x) => (x > 0 ? h - x * Math.log2(x) : h), 0)
}

/** Readings that already answer a test, so proposing it would waste the technician's time. */
const ANSWERED_BY_READING: Partial<Record<TestDef['slug'], string>> = {
  'standing-pressure-check': 'standingPressure',
  'compressor-current-check': 'compressorCurrent',
}

interface Gain {
  gain: number
  outcomeProbs: number[]
  likelihoods: number[][]
}

// likelihoods[o][h] depend only on the knowledge base, the test, its stage and the hypothesis list
// (fixed per unit kind), so they are built once per published version and reused by every request.
const matrices = new WeakMap<object, Map<string, number[][]>>()

function likelihoodMatrix(test: TestDef, stage: Stage, hyps: Hypothesis[], kind: UnitKind): number[][] {
  let perTest = matrices.get(test)
  if (!perTest) matrices.set(test, (perTest = new Map()))
  const key = `${kind}|${stage}|${hyps.length}|${hyps[0]?.cause}${hyps[0]?.stage}|${hyps.at(-1)?.cause}${hyps.at(-1)?.stage}`
  let m = perTest.get(key)
  if (!m) perTest.set(key, (m = test.outcomes.map((o) => hyps.map((h) => testLikelihood(o, stage, h)))))
  return m
}

/** likelihoods[o][h] for test t on stage s. */
function expectedGain(test: TestDef, stage: Stage, hyps: Hypothesis[], p: number[], hNow: number, kind: UnitKind): Gain {
  const likelihoods = likelihoodMatrix(test, stage, hyps, kind)
  const joint = likelihoods.map((row) => row.map((l, i) => l * (p[i] ?? 0)))
  const outcomeProbs = normalise(joint.map((row) => row.reduce((a, b) => a + b, 0)))
  const after = joint.reduce((acc, row, o) => acc + (outcomeProbs[o] ?? 0) * entropyBits(normalise(row)), 0)
  return { gain: Math.max(0, hNow - after), outcomeProbs, likelihoods }
}

/**
 * The hypotheses a test tells apart: weighted by current probability, those whose outcome
 * distribution lies farthest (total variation) from the test's overall outcome distribution.
 */
function separates(g: Gain, hyps: Hypothesis[], p: number[]): HypothesisRef[] {
  const scored = hyps.map((h, i) => {
    const col = normalise(g.likelihoods.map((row) => row[i] ?? 0))
    const tv = 0.5 * col.reduce((acc, x, o) => acc + Math.abs(x - (g.outcomeProbs[o] ?? 0)), 0)
    return { h, score: tv * Math.sqrt(p[i] ?? 0) }
  })
  return scored
    .filter((s) => s.score > 0.01)
    .sort((a, b) => b.score - a.score)
    .slice(0, SEPARATES_MAX)
    .map(({ h }) => (h.stage ? { cause: h.cause, stage: h.stage } : { cause: h.cause }))
}

export interface NextTestInput {
  kb: Pick<KnowledgeBase, 'tests'>
  kind: UnitKind
  hypotheses: Hypothesis[]
  posterior: number[]
  done: ResolvedTestResult[]
  /** Reading keys present (`stage:quantity`). */
  readingsPresent: Set<string>
}

export function proposeTests({ kb, kind, hypotheses, posterior, done, readingsPresent }: NextTestInput): ProposedTest[] {
  const hNow = entropyBits(posterior)
  const doneKeys = new Set(done.map((d) => `${d.test.slug}@${d.stage}`))
  const out: ProposedTest[] = []
  for (const test of kb.tests) {
    for (const stage of test.stages.filter((s) => STAGES_OF_KIND[kind].includes(s))) {
      const answeredBy = ANSWERED_BY_READING[test.slug]
      if (doneKeys.has(`${test.slug}@${stage}`) || (answeredBy && readingsPresent.has(`${stage}:${answeredBy}`))) continue
      const g = expectedGain(test, stage, hypotheses, posterior, hNow, kind)
      if (g.gain < MIN_GAIN_BITS) continue
      const penalty = (test.opensSystem ? INVASIVE_PENALTY : 1) * (test.hotWork ? INVASIVE_PENALTY : 1)
      out.push({
        test: test.slug,
        stage,
        expectedGain: Math.round(g.gain * 1000) / 1000,
        minutes: test.minutes,
        title: test.title,
        score: (g.gain / test.minutes) * penalty,
        opensSystem: test.opensSystem,
        hotWork: test.hotWork,
        safetyNotes: test.safetyNotes,
        separates: separates(g, hypotheses, posterior),
      })
    }
  }
  return out.sort((a, b) => b.score - a.score || a.test.localeCompare(b.test) || a.stage.localeCompare(b.stage))
}
