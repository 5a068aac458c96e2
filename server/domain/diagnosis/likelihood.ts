/**
 * Likelihood tables and graded likelihoods.
 *
 * A table states P(finding | hypothesis) under a single-fault assumption. Keys, for a finding about
 * stage s (or about the unit when it has no stage):
 *   `healthy`        stage s healthy: the no-fault hypothesis and, for a stage finding, every fault on another stage;
 *   `<cause>`        that cause on stage s (on any stage for a unit finding);
 *   `<cause>@high|low|single`, `<cause>@cabinet|ambient`  that cause on the named stage or stage role
 *                    (for a stage finding, only when that is the finding's own stage);
 *   `<cause>@other`  that cause on the other stage of a cascade, where physics couples the stages;
 *   `default`        causes on stage s that the table does not name;
 *   `other`          what the knowledge base does not cover.
 *
 * A graded finding predicts bands of a measured residual instead of a probability. The likelihood of
 * a band [a, b] is the uniform density on it convolved with the measurement's normal uncertainty σ:
 *   L = (Φ((b − r)/σ) − Φ((a − r)/σ)) / (b − a)
 * so a value on a band edge weighs half for each side and never flips an answer on noise; the two
 * outermost bands are open-ended (their density stays flat beyond the edge). This is the band form of
 * the statistical rule-based fault detection of Rossi & Braun 1997 (HVAC&R Research 3(1)), where each
 * fault predicts the direction of each residual and the residual's distribution gives the probability.
 */
import { CAUSES, STAGES, isStagelessCause, type Cause, type Stage, type UnitKind } from '#shared/types/diagnosis'

export type BandPrediction = string | Record<string, number>
export type LikelihoodTable = Record<string, number | BandPrediction>

export const REQUIRED_KEYS = ['healthy', 'default', 'other'] as const
const ROLE_SUFFIXES = ['other', 'cabinet', 'ambient'] as const

/** Keys that name no cause or stage, and required keys that are missing: `[path, message]` pairs. */
export function tableKeyProblems(table: LikelihoodTable): [string[], string][] {
  const out: [string[], string][] = []
  for (const key of REQUIRED_KEYS) if (table[key] === undefined) out.push([[key], `is required (${REQUIRED_MEANING[key]})`])
  for (const key of Object.keys(table)) {
    if ((REQUIRED_KEYS as readonly string[]).includes(key)) continue
    const [cause, suffix, extra] = key.split('@')
    if (extra !== undefined || !(CAUSES as readonly string[]).includes(cause ?? '') || isStagelessCause(cause as Cause)) {
      out.push([[key], `unknown key "${key}"; use healthy, default, other, a cause (${CAUSES.filter((c) => !isStagelessCause(c)).join(', ')}) or cause@stage`])
    } else if (suffix !== undefined && ![...STAGES, ...ROLE_SUFFIXES].includes(suffix as Stage)) {
      out.push([[key], `unknown stage "${suffix}" in "${key}"; use high, low, single, cabinet, ambient or other`])
    }
  }
  return out
}

const REQUIRED_MEANING: Record<(typeof REQUIRED_KEYS)[number], string> = {
  healthy: 'the likelihood when this stage has no fault',
  default: 'the likelihood for causes on this stage that are not listed',
  other: 'the likelihood for causes outside the knowledge base',
}

export interface HypothesisLike {
  cause: Cause
  stage?: Stage
}

export function cabinetStageOf(kind: UnitKind): Stage {
  return kind === 'cascade' ? 'low' : 'single'
}
export function ambientStageOf(kind: UnitKind): Stage {
  return kind === 'cascade' ? 'high' : 'single'
}

/** The table entry that applies to a hypothesis; `about` is the finding's stage (undefined: the unit). */
export function resolveEntry<T>(table: Record<string, T>, h: HypothesisLike, about: Stage | undefined, kind: UnitKind): T {
  if (h.cause === 'other') return table.other as T
  if (isStagelessCause(h.cause) || !h.stage) return table.healthy as T
  const { cause, stage } = h
  if (about !== undefined && about !== stage) return table[`${cause}@other`] ?? (table.healthy as T)
  const direct = table[`${cause}@${stage}`]
  if (direct !== undefined) return direct
  if (stage === cabinetStageOf(kind) && table[`${cause}@cabinet`] !== undefined) return table[`${cause}@cabinet`] as T
  if (stage === ambientStageOf(kind) && table[`${cause}@ambient`] !== undefined) return table[`${cause}@ambient`] as T
  return table[cause] ?? (table.default as T)
}

const KINDS: { kind: UnitKind; stages: Stage[] }[] = [
  { kind: 'cascade', stages: ['high', 'low'] },
  { kind: 'single-stage', stages: ['single'] },
]

/**
 * Outcome tables of one test must give every hypothesis a distribution: Σ_o P(o | h) = 1 for each
 * hypothesis a unit can hold, whichever stage the test is done on. Returns messages for the failures.
 */
export function checkTable(outcomes: Record<string, number>[], tolerance: number): string[] {
  const problems = new Set<string>()
  const sumFor = (h: HypothesisLike, about: Stage | undefined, kind: UnitKind) =>
    outcomes.reduce((acc, t) => acc + (resolveEntry(t, h, about, kind) ?? 0), 0)
  const check = (label: string, sum: number) => {
    if (Math.abs(sum - 1) > tolerance) problems.add(`likelihoods of ${label} sum to ${sum.toFixed(3)} over the outcomes; they must sum to 1`)
  }
  check('other', sumFor({ cause: 'other' }, undefined, 'single-stage'))
  check('healthy', sumFor({ cause: 'no-refrigeration-fault' }, undefined, 'single-stage'))
  for (const { kind, stages } of KINDS) {
    for (const about of stages) {
      for (const stage of stages) {
        for (const cause of CAUSES) {
          if (isStagelessCause(cause)) continue
          const where = stage === about ? `on the tested stage` : `on the other stage`
          check(`${cause} ${where} (${kind}, ${stage})`, sumFor({ cause, stage }, about, kind))
        }
      }
    }
  }
  return [...problems]
}

// ------------------------------------------------------------------ graded likelihoods

/** Bands in ascending order with their edges; the first and last are open towards ±∞. */
export interface Bands {
  names: string[]
  lo: number[]
  hi: number[]
}

export function orderBands(bands: Record<string, [number, number]>): Bands {
  const entries = Object.entries(bands).sort((a, b) => a[1][0] - b[1][0])
  return { names: entries.map((e) => e[0]), lo: entries.map((e) => e[1][0]), hi: entries.map((e) => e[1][1]) }
}

/**
 * Complementary error function, Chebyshev fit with fractional error below 1.2e-7 everywhere
 * (Press et al., Numerical Recipes, 2nd ed., §6.2, "erfcc"); its accuracy holds in the far tails,
 * where likelihood ratios are decided.
 */
export function erfc(x: number): number {
  const z = Math.abs(x)
  const t = 1 / (1 + 0.5 * z)
  const r =
    t *
    Math.exp(
      -z * z -
        1.26551223 +
        t * (1.00002368 + t * (0.37409196 + t * (0.09678418 + t * (-0.18628806 + t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    )
  return x >= 0 ? r : 2 - r
}

const SQRT1_2 = Math.SQRT1_2
/** P(a < X < b) for X ~ N(0, 1), computed on the tail that keeps precision. */
export function normalInterval(a: number, b: number): number {
  if (a >= 0) return 0.5 * (erfc(a * SQRT1_2) - erfc(b * SQRT1_2))
  if (b <= 0) return 0.5 * (erfc(-b * SQRT1_2) - erfc(-a * SQRT1_2))
  return 1 - 0.5 * erfc(-a * SQRT1_2) - 0.5 * erfc(b * SQRT1_2)
}

/** Smallest density a band may take, relative to its flat value: a reading is never called impossible. */
const DENSITY_FLOOR = 1e-9

/** Likelihood of each band for a residual r measured with standard uncertainty σ. */
export function bandLikelihoods(bands: Bands, r: number, sigma: number): number[] {
  const last = bands.names.length - 1
  return bands.names.map((_, i) => {
    const lo = bands.lo[i] as number
    const hi = bands.hi[i] as number
    const a = i === 0 ? -Infinity : (lo - r) / sigma
    const b = i === last ? Infinity : (hi - r) / sigma
    const width = hi - lo
    return Math.max(normalInterval(a, b), DENSITY_FLOOR) / width
  })
}

/** Density of `any`: flat over the declared range of all bands. */
export function anyDensity(bands: Bands): number {
  return 1 / ((bands.hi.at(-1) as number) - (bands.lo[0] as number))
}

/** Band weights of a prediction as a vector aligned with `bands`, plus the weight of `any`. */
export function predictionWeights(prediction: BandPrediction, bands: Bands): { weights: number[]; any: number } {
  const mixture: Record<string, number> = typeof prediction === 'string' ? { [prediction]: 1 } : prediction
  return { weights: bands.names.map((n) => mixture[n] ?? 0), any: mixture.any ?? 0 }
}

/** The band a value falls in (edges go to the upper band). */
export function bandOf(bands: Bands, r: number): string {
  for (let i = bands.names.length - 1; i >= 0; i--) if (r >= (bands.lo[i] as number)) return bands.names[i] as string
  return bands.names[0] as string
}
