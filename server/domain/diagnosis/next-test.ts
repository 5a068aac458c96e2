/**
 * Next test by decision-theoretic troubleshooting (Heckerman, Breese & Rommelse 1995,
 * "Decision-theoretic troubleshooting", Communications of the ACM 38(3)): the test with the highest
 * expected information gain per unit of cost, given the current posterior,
 *
 *   EIG(t) = H(P) − Σ_o P(o) · H(P | o),   P(o) = Σ_h P(h) · P(o | h)
 *
 * Cost is the test's minutes plus a surcharge for opening the system (recovery, evacuation, charge and
 * refrigerant lost, and the risks of working on an open circuit) or hot work, so a non-invasive check
 * that settles the same question always comes first. People read the value in words, from the pair of
 * leading hypotheses the test tells apart best ("Settles a leak against a blockage on the low stage").
 */
import type { HypothesisRef, ProposedTest, Stage, UnitKind } from '#shared/types/diagnosis'
import { STAGES_OF_KIND } from '#shared/schemas/diagnosis'
import type { KindModel } from './evidence'
import { testLikelihoods } from './evidence'
import type { Hypothesis } from './hypotheses'
import type { CauseDef, KnowledgeBase, TestDef } from './knowledge-base'
import type { ResolvedTestResult } from './test-results'

/** Minutes added to a test that opens the system, and to one that needs hot work (common practice, no source). */
export const OPEN_SYSTEM_MINUTES = 120
export const HOT_WORK_MINUTES = 60
/** Proposals gaining less than this many bits are noise and left out. */
const MIN_GAIN_BITS = 0.01
/** Hypotheses below this probability are not named in a test's value. */
const NAMED_FROM = 0.03
const SEPARATES_MAX = 3

export function entropyBits(p: ArrayLike<number>): number {
  let h = 0
  for (let i = 0; i < p.length; i++) {
    const x = p[i] as number
    if (x > 0) h -= x * Math.log2(x)
  }
  return h
}

export function testCostMinutes(test: Pick<TestDef, 'minutes' | 'opensSystem' | 'hotWork'>): number {
  return test.minutes + (test.opensSystem ? OPEN_SYSTEM_MINUTES : 0) + (test.hotWork ? HOT_WORK_MINUTES : 0)
}

interface Gain {
  gain: number
  /** P(o | h), rows = outcomes. */
  likelihoods: Float64Array[]
}

function expectedGain(likelihoods: Float64Array[], p: number[], hNow: number): Gain {
  const H = p.length
  const outcomeMass = new Float64Array(likelihoods.length)
  likelihoods.forEach((row, o) => {
    let m = 0
    for (let i = 0; i < H; i++) m += (row[i] as number) * (p[i] as number)
    outcomeMass[o] = m
  })
  // Floors make Σ_o P(o | h) differ from 1 by a hair, so P(o) is normalised over the outcomes.
  const total = outcomeMass.reduce((a, b) => a + b, 0) || 1
  let after = 0
  likelihoods.forEach((row, o) => {
    const mass = outcomeMass[o] as number
    if (mass <= 0) return
    let h = 0
    for (let i = 0; i < H; i++) {
      const q = ((row[i] as number) * (p[i] as number)) / mass
      if (q > 0) h -= q * Math.log2(q)
    }
    after += (mass / total) * h
  })
  return { gain: Math.max(0, hNow - after), likelihoods }
}

/** Total-variation distance between the outcome distributions of two hypotheses. */
function separation(g: Gain, i: number, j: number): number {
  let tv = 0
  let si = 0
  let sj = 0
  for (const row of g.likelihoods) {
    si += row[i] ?? 0
    sj += row[j] ?? 0
  }
  for (const row of g.likelihoods) tv += Math.abs((row[i] ?? 0) / (si || 1) - (row[j] ?? 0) / (sj || 1))
  return tv / 2
}

const STAGE_WORDS: Record<Stage, string> = { high: ' on the high stage', low: ' on the low stage', single: '' }

function nameOf(h: Hypothesis, shortNames: Map<string, string>, withStage: boolean): string {
  const name = shortNames.get(h.cause) ?? h.cause
  return withStage && h.stage ? `${name}${STAGE_WORDS[h.stage]}` : name
}

/** "Settles a leak against a blockage on the low stage." from the best-separated pair of leading hypotheses. */
function valueInWords(g: Gain, hyps: Hypothesis[], p: number[], shortNames: Map<string, string>): { text: string; separates: HypothesisRef[] } {
  const leading = hyps.map((h, i) => ({ h, i })).filter(({ i }) => (p[i] ?? 0) >= NAMED_FROM)
  let best: { a: number; b: number; score: number } | undefined
  for (const x of leading) {
    for (const y of leading) {
      if (y.i <= x.i) continue
      const score = Math.sqrt((p[x.i] ?? 0) * (p[y.i] ?? 0)) * separation(g, x.i, y.i)
      if (!best || score > best.score) best = { a: x.i, b: y.i, score }
    }
  }
  const ref = (h: Hypothesis): HypothesisRef => (h.stage ? { cause: h.cause, stage: h.stage } : { cause: h.cause })
  if (!best || best.score < 0.02) {
    const top = leading.sort((x, y) => (p[y.i] ?? 0) - (p[x.i] ?? 0))[0]
    if (!top) return { text: 'Narrows down the causes still open.', separates: [] }
    return { text: `Tells whether it is ${nameOf(top.h, shortNames, true)}.`, separates: [ref(top.h)] }
  }
  const [first, second] = [(p[best.a] ?? 0) >= (p[best.b] ?? 0) ? best.a : best.b, (p[best.a] ?? 0) >= (p[best.b] ?? 0) ? best.b : best.a]
  const a = hyps[first] as Hypothesis
  const b = hyps[second] as Hypothesis
  const sameStage = a.stage !== undefined && a.stage === b.stage
  const text = sameStage
    ? `Settles ${nameOf(a, shortNames, false)} against ${nameOf(b, shortNames, false)}${STAGE_WORDS[a.stage as Stage]}.`
    : `Settles ${nameOf(a, shortNames, true)} against ${nameOf(b, shortNames, true)}.`
  const third = leading
    .filter(({ i }) => i !== first && i !== second)
    .map(({ h, i }) => ({ h, s: Math.sqrt(p[i] ?? 0) * Math.max(separation(g, i, first), separation(g, i, second)) }))
    .sort((x, y) => y.s - x.s)
    .slice(0, SEPARATES_MAX - 2)
    .filter((x) => x.s > 0.05)
    .map((x) => ref(x.h))
  return { text, separates: [ref(a), ref(b), ...third] }
}

export interface NextTestInput {
  kb: Pick<KnowledgeBase, 'tests'> & { causes: Pick<CauseDef, 'slug' | 'short'>[] }
  model: KindModel
  kind: UnitKind
  posterior: number[]
  done: ResolvedTestResult[]
  /** Reading keys present (`stage:quantity`). */
  readingsPresent: Set<string>
}

export function proposeTests({ kb, model, kind, posterior, done, readingsPresent }: NextTestInput): ProposedTest[] {
  const hNow = entropyBits(posterior)
  const doneKeys = new Set(done.map((d) => `${d.test.slug}@${d.stage}`))
  const shortNames = new Map(kb.causes.map((c) => [c.slug, c.short]))
  const out: ProposedTest[] = []
  for (const test of kb.tests) {
    for (const stage of test.stages.filter((s) => STAGES_OF_KIND[kind].includes(s))) {
      if (doneKeys.has(`${test.slug}@${stage}`) || (test.answeredBy && readingsPresent.has(`${stage}:${test.answeredBy}`))) continue
      const g = expectedGain(testLikelihoods(model, test, stage).probs, posterior, hNow)
      if (g.gain < MIN_GAIN_BITS) continue
      const value = valueInWords(g, model.hypotheses, posterior, shortNames)
      out.push({
        test: test.slug,
        stage,
        expectedGain: Math.round(g.gain * 1000) / 1000,
        value: value.text,
        minutes: test.minutes,
        title: test.title,
        score: g.gain / testCostMinutes(test),
        opensSystem: test.opensSystem,
        hotWork: test.hotWork,
        safetyNotes: test.safetyNotes,
        separates: value.separates,
      })
    }
  }
  return out.sort((a, b) => b.score - a.score || a.test.localeCompare(b.test) || a.stage.localeCompare(b.stage))
}
