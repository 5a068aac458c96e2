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
import type { HypothesisRef, MeteringDevice, ProposedTest, Stage, UnitKind } from '#shared/types/diagnosis'
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
/**
 * A test that opens the system (recovery, evacuation, refrigerant lost, risk) is proposed only when it
 * can settle something material: at least this many bits (common practice, no source).
 */
const MIN_GAIN_OPENING_BITS = 0.1
/** Hypotheses below this probability are not named in a test's value as one of a pair it settles. */
const NAMED_FROM = 0.03
/** Nor as the one cause it rules in or out, below this. */
const MENTIONED_FROM = 0.002
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

/** Each hypothesis's outcome distribution under a test, normalised (floors make the sums differ from 1 by a hair). */
function outcomeColumns(g: Gain, indices: number[]): Map<number, Float64Array> {
  const columns = new Map<number, Float64Array>()
  const outcomes = g.likelihoods.length
  for (const i of indices) {
    const col = new Float64Array(outcomes)
    let sum = 0
    for (let o = 0; o < outcomes; o++) sum += (col[o] = (g.likelihoods[o] as Float64Array)[i] ?? 0)
    if (sum > 0) for (let o = 0; o < outcomes; o++) col[o] = (col[o] as number) / sum
    columns.set(i, col)
  }
  return columns
}

/** Total-variation distance between two outcome distributions. */
function totalVariation(a: Float64Array, b: Float64Array): number {
  let tv = 0
  for (let o = 0; o < a.length; o++) tv += Math.abs((a[o] as number) - (b[o] as number))
  return tv / 2
}

/** Total-variation distance between the outcome distributions of two hypotheses. */
function separation(columns: Map<number, Float64Array>, i: number, j: number): number {
  return totalVariation(columns.get(i) as Float64Array, columns.get(j) as Float64Array)
}

const STAGE_WORDS: Record<Stage, string> = { high: ' on the high stage', low: ' on the low stage', single: '' }

function nameOf(h: Hypothesis, shortNames: Map<string, string>, withStage: boolean): string {
  const name = shortNames.get(h.cause) ?? h.cause
  return withStage && h.stage ? `${name}${STAGE_WORDS[h.stage]}` : name
}

interface Leading {
  h: Hypothesis
  i: number
  p: number
}

/** Below this total-variation distance from the rest, a test says nothing about a cause worth naming. */
const SPEAKS_TO_FROM = 0.15

/** The hypothesis whose outcome distribution differs most from the mixture of all (weighted by √p), if any differs enough. */
function mostInformed(g: Gain, everyone: Leading[]): Leading | undefined {
  if (!everyone.length) return undefined
  const columns = outcomeColumns(g, everyone.map((x) => x.i))
  const outcomes = g.likelihoods.length
  const mixture = new Float64Array(outcomes)
  let mass = 0
  for (const x of everyone) {
    const col = columns.get(x.i) as Float64Array
    for (let o = 0; o < outcomes; o++) mixture[o] = (mixture[o] as number) + x.p * (col[o] as number)
    mass += x.p
  }
  if (mass <= 0) return undefined
  for (let o = 0; o < outcomes; o++) mixture[o] = (mixture[o] as number) / mass
  let best: { x: Leading; tv: number; score: number } | undefined
  for (const x of everyone) {
    const tv = totalVariation(columns.get(x.i) as Float64Array, mixture)
    const score = Math.sqrt(x.p) * tv
    if (!best || score > best.score) best = { x, tv, score }
  }
  return best && best.tv >= SPEAKS_TO_FROM ? best.x : undefined
}

/**
 * "Settles a leak against a blockage on the low stage." from the best-separated pair of leading
 * hypotheses; failing a pair, the one cause the test rules in or out.
 */
function valueInWords(g: Gain, leading: Leading[], everyone: Leading[], shortNames: Map<string, string>): { text: string; separates: HypothesisRef[] } {
  const columns = outcomeColumns(g, leading.map((x) => x.i))
  let best: { a: Leading; b: Leading; score: number } | undefined
  for (let x = 0; x < leading.length; x++) {
    for (let y = x + 1; y < leading.length; y++) {
      const a = leading[x] as Leading
      const b = leading[y] as Leading
      const score = Math.sqrt(a.p * b.p) * separation(columns, a.i, b.i)
      if (!best || score > best.score) best = { a, b, score }
    }
  }
  const ref = (h: Hypothesis): HypothesisRef => (h.stage ? { cause: h.cause, stage: h.stage } : { cause: h.cause })
  if (!best || best.score < 0.02) {
    // No two likely causes are told apart: name the cause whose outcomes stand out most from the
    // rest, which may be an unlikely one the test rules in or out; never one the test cannot show.
    const spoken = mostInformed(g, everyone)
    if (!spoken) return { text: 'Narrows down the causes still open.', separates: [] }
    const text = spoken === leading[0] ? `Tells whether it is ${nameOf(spoken.h, shortNames, true)}.` : `Rules ${nameOf(spoken.h, shortNames, true)} in or out.`
    return { text, separates: [ref(spoken.h)] }
  }
  // `leading` is sorted by probability, so `best.a` is the likelier of the pair.
  const { a, b } = best
  const sameStage = a.h.stage !== undefined && a.h.stage === b.h.stage
  const text = sameStage
    ? `Settles ${nameOf(a.h, shortNames, false)} against ${nameOf(b.h, shortNames, false)}${STAGE_WORDS[a.h.stage as Stage]}.`
    : `Settles ${nameOf(a.h, shortNames, true)} against ${nameOf(b.h, shortNames, true)}.`
  const third = leading
    .filter((x) => x !== a && x !== b)
    .map((x) => ({ h: x.h, s: Math.sqrt(x.p) * Math.max(separation(columns, x.i, a.i), separation(columns, x.i, b.i)) }))
    .sort((x, y) => y.s - x.s)
    .slice(0, SEPARATES_MAX - 2)
    .filter((x) => x.s > 0.05)
    .map((x) => ref(x.h))
  return { text, separates: [ref(a.h), ref(b.h), ...third] }
}

export interface NextTestInput {
  kb: Pick<KnowledgeBase, 'tests'> & { causes: Pick<CauseDef, 'slug' | 'short'>[] }
  model: KindModel
  kind: UnitKind
  posterior: number[]
  done: ResolvedTestResult[]
  /** Reading keys present (`stage:quantity`). */
  readingsPresent: Set<string>
  /** The metering device of each stage the unit record names; a test for another device is not proposed there. */
  meteringDevices?: Partial<Record<Stage, MeteringDevice>>
  /** Only the best `limit` proposals are put in words and returned (all of them when absent). */
  limit?: number
}

export function proposeTests({ kb, model, kind, posterior, done, readingsPresent, meteringDevices, limit }: NextTestInput): ProposedTest[] {
  const hNow = entropyBits(posterior)
  const doneKeys = new Set(done.map((d) => `${d.test.slug}@${d.stage}`))
  const candidates: { test: TestDef; stage: Stage; g: Gain; score: number }[] = []
  for (const test of kb.tests) {
    for (const stage of test.stages) {
      if (!STAGES_OF_KIND[kind].includes(stage)) continue
      const device = meteringDevices?.[stage]
      if (device && test.meteringDevices && !test.meteringDevices.includes(device)) continue
      if (doneKeys.has(`${test.slug}@${stage}`) || (test.answeredBy && readingsPresent.has(`${stage}:${test.answeredBy}`))) continue
      const g = expectedGain(testLikelihoods(model, test, stage).probs, posterior, hNow)
      if (g.gain < (test.opensSystem || test.hotWork ? MIN_GAIN_OPENING_BITS : MIN_GAIN_BITS)) continue
      candidates.push({ test, stage, g, score: g.gain / testCostMinutes(test) })
    }
  }
  candidates.sort((a, b) => b.score - a.score || a.test.slug.localeCompare(b.test.slug) || a.stage.localeCompare(b.stage))
  // Putting a test's value in words compares the leading hypotheses pair by pair; only the tests
  // that will be shown need it.
  const shortNames = new Map(kb.causes.map((c) => [c.slug, c.short]))
  // Hypotheses worth naming, likeliest first (ties in model order, as the pair search expects).
  const everyone = model.hypotheses
    .map((h, i) => ({ h, i, p: posterior[i] ?? 0 }))
    .filter((x) => x.p >= MENTIONED_FROM)
    .sort((x, y) => y.p - x.p || x.i - y.i)
  const leading = everyone.filter((x) => x.p >= NAMED_FROM)
  return candidates.slice(0, limit ?? candidates.length).map(({ test, stage, g, score }): ProposedTest => {
    const value = valueInWords(g, leading, everyone, shortNames)
    return {
      test: test.slug,
      stage,
      expectedGain: Math.round(g.gain * 1000) / 1000,
      value: value.text,
      minutes: test.minutes,
      title: test.title,
      score,
      opensSystem: test.opensSystem,
      hotWork: test.hotWork,
      safetyNotes: test.safetyNotes,
      separates: value.separates,
    }
  })
}
