// Scoring an exercise attempt: the cause named for each stage against what the case confirmed,
// the minutes the trainee's requests cost against the path the engine would have taken, and
// invasive tests asked for without need. No I/O here.
import type { Cause, Stage, TestSlug } from '#shared/types/diagnosis'
import type { ExerciseScore } from '#shared/types/training'

export type { ExerciseScore, StageVerdict } from '#shared/types/training'

/** Minutes a reading request costs: fitting gauges or a probe and letting it settle (common practice, no source). */
export const READING_MINUTES = 2

/** Points for the causes; the rest is for time. A wrong answer cannot be made up for by speed. */
export const CAUSE_POINTS = 70
export const TIME_POINTS = 30
/** Points taken off for each invasive test asked for without need, and again when it opened a flammable stage. */
export const NEEDLESS_INVASIVE_PENALTY = 10
export const UNSAFE_PENALTY = 20

/** The cause a stage is expected to be named with: its confirmed cause, or "no fault on this stage". */
export const NO_FAULT: Cause = 'no-refrigeration-fault'

export interface ScoredRequest {
  kind: 'reading' | 'test'
  test?: TestSlug
  stage?: Stage
  minutes: number
  /** The test opens the refrigerant circuit or needs hot work. */
  invasive: boolean
}

export interface ScoreInput {
  stages: { stage: Stage; flammable: boolean }[]
  confirmed: { cause: Cause; stage?: Stage }[]
  answer: { stage: Stage; cause: Cause }[]
  requests: ScoredRequest[]
  /** Minutes of the engine's own path through the same case. */
  engineMinutes: number
  /** `test|stage` keys of the tests on the engine's path. */
  engineTests: string[]
}

/** The expected cause of each stage: a confirmed cause on it, else a confirmed cause tied to no circuit, else no fault. */
export function expectedCauses(stages: Stage[], confirmed: ScoreInput['confirmed']): { stage: Stage; cause: Cause }[] {
  const unitWide = confirmed.find((c) => !c.stage)
  return stages.map((stage) => ({ stage, cause: confirmed.find((c) => c.stage === stage)?.cause ?? unitWide?.cause ?? NO_FAULT }))
}

/** Minutes a list of requests costs; asking for the same thing twice costs once. */
export function minutesOf(requests: ScoredRequest[]): number {
  return requests.reduce((sum, r) => sum + r.minutes, 0)
}

const round1 = (x: number) => Math.round(x * 10) / 10

/**
 * Scores one finished attempt. Causes: CAUSE_POINTS shared equally among the stages. Time: full
 * TIME_POINTS at or under the engine's minutes, then in proportion (engine minutes / minutes spent).
 * Each invasive test off the engine's path costs NEEDLESS_INVASIVE_PENALTY, and UNSAFE_PENALTY more
 * when its stage holds a flammable refrigerant. The total stays within 0..100.
 */
export function scoreAttempt(input: ScoreInput): ExerciseScore {
  const expected = expectedCauses(input.stages.map((s) => s.stage), input.confirmed)
  const verdicts = expected.map(({ stage, cause }) => {
    const named = input.answer.find((a) => a.stage === stage)?.cause ?? null
    return { stage, expected: cause, named, right: named === cause }
  })
  const rightStages = verdicts.filter((v) => v.right).length
  const minutesSpent = minutesOf(input.requests)
  const engine = Math.max(1, input.engineMinutes)
  const timeShare = minutesSpent <= engine ? 1 : engine / minutesSpent
  const onPath = new Set(input.engineTests)
  const needless = input.requests.filter((r) => r.kind === 'test' && r.invasive && !onPath.has(`${r.test}|${r.stage ?? ''}`))
  const flammable = new Set(input.stages.filter((s) => s.flammable).map((s) => s.stage))
  const unsafe = needless.filter((r) => r.stage && flammable.has(r.stage))
  const causePoints = round1((CAUSE_POINTS * rightStages) / Math.max(1, verdicts.length))
  const timePoints = round1(TIME_POINTS * timeShare)
  const penalty = needless.length * NEEDLESS_INVASIVE_PENALTY + unsafe.length * UNSAFE_PENALTY
  const strip = (r: ScoredRequest) => ({ test: r.test!, ...(r.stage ? { stage: r.stage } : {}) })
  return {
    stages: verdicts,
    rightStages,
    minutesSpent,
    engineMinutes: input.engineMinutes,
    needlessInvasive: needless.map(strip),
    unsafe: unsafe.map(strip),
    causePoints,
    timePoints,
    penalty,
    points: Math.min(100, Math.max(0, round1(causePoints + timePoints - penalty))),
  }
}
