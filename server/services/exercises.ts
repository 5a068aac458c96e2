// Exercises made from closed cases, assignments, and trainees' attempts with their scores. Every
// response is built from allow-listed fields of the exercise's own material, which was itself
// copied field by field from the case: nothing personal can pass through.
import { findCase } from '#server/db/repositories/case-records'
import {
  activePeopleOf, appendRequest, caseSecrets, findAttempt, findExercise, finishAttempt, insertAttempt, insertExercise, listAttempts, listExercises,
  setAssignees, updateExercise, type AttemptRecord, type ExerciseRecord,
} from '#server/db/repositories/training'
import { ConflictError, ForbiddenError, InvalidStateError, NotFoundError } from '#server/domain/errors'
import {
  answerRequest, checkStart, enginePath, exerciseUnit, exerciseView, rankableUnit, recordedFacts, scrubText, type ExerciseMaterial,
} from '#server/domain/training/exercise'
import { scoreAttempt } from '#server/domain/training/scoring'
import type { AttemptAnswerInput, AttemptRequestInput, NewExerciseInput, UpdateExerciseInput } from '#shared/schemas/training'
import type { Stage } from '#shared/types/diagnosis'
import type { AttemptDto, ExerciseDto, ExerciseStart, ExerciseSummaryDto } from '#shared/types/training'
import { findRefrigerant } from '#shared/utils/properties'
import { can } from '#shared/utils/permissions'
import { causeLabel } from '#shared/utils/vocabulary'
import { publishedKnowledgeBase, stampsFor } from './diagnosis'
import { knowledgeBaseVersion } from './replay'
import { rankKnownFacts } from './training'
import type { Actor } from './types'

const EXERCISE_NOT_FOUND = 'Exercise not found'
const ATTEMPT_NOT_FOUND = 'Attempt not found'
const DEFAULT_START: ExerciseStart = { complaint: true, symptoms: true, readings: [] }

const isTrainer = (actor: Actor) => can(actor.role, 'training:run')

async function exerciseOf(actor: Actor, id: number): Promise<ExerciseRecord> {
  const found = await findExercise(actor.organisationId, id)
  if (!found) throw new NotFoundError(EXERCISE_NOT_FOUND)
  return found
}

/** The engine's path for a start, ranked with the exercise's own knowledge-base version. */
async function withEnginePath(actor: Actor, material: Omit<ExerciseMaterial, 'engine'>, start: ExerciseStart): Promise<ExerciseMaterial> {
  const kb = await knowledgeBaseVersion(actor.organisationId, Number(material.knowledgeBaseVersionId)).catch(() => publishedKnowledgeBase(actor.organisationId))
  const unit = rankableUnit(material.unit)
  const engine = await enginePath(material, start, (known) => rankKnownFacts(kb, unit, { ...known, readings: known.readings.map((r) => ({ ...r, at: '', by: null })), testResults: known.testResults.map((t) => ({ ...t, at: '', by: null })) }))
  return { ...material, engine }
}

/** `POST /api/exercises`: an exercise from a closed case of the organisation. */
export async function createExercise(actor: Actor, input: NewExerciseInput, now: Date): Promise<{ id: number }> {
  const found = await findCase(actor.organisationId, input.caseId)
  if (!found) throw new NotFoundError('Case not found')
  if (found.status !== 'closed') throw new InvalidStateError('Exercises are made from closed cases; close this case first')
  const [secrets, kb] = await Promise.all([caseSecrets(actor.organisationId, found.id), publishedKnowledgeBase(actor.organisationId, await stampsFor(actor))])
  const start = input.start ?? DEFAULT_START
  const material = await withEnginePath(actor, {
    unit: exerciseUnit(found.unit),
    complaint: scrubText(found.complaint, secrets),
    symptoms: [...found.symptoms],
    ...recordedFacts(found.readings, found.testResults),
    confirmedCauses: (found.closure?.confirmedCauses ?? []).map((c) => ({ cause: c.cause, ...(c.stage ? { stage: c.stage } : {}) })),
    tests: kb.tests.map((t) => ({
      test: t.slug, title: t.title, minutes: t.minutes, opensSystem: t.opensSystem, hotWork: t.hotWork, stages: [...t.stages] as Stage[],
      safetyNotes: [...t.safetyNotes], outcomes: t.outcomes.map((o) => ({ outcome: o.slug, label: o.label })),
    })),
    causes: kb.causes.map((c) => ({ cause: c.slug, title: c.title || causeLabel(c.slug) })),
    knowledgeBaseVersionId: kb.version.id,
  }, start)
  checkStart(material, start)
  // A title is free text too: a trainer may well name the customer in it.
  const id = await insertExercise(actor.organisationId, { caseId: found.id, title: scrubText(input.title, secrets), start, material, createdBy: actor.id }, now)
  if (input.assignees) await assign(actor, id, input.assignees, now)
  return { id }
}

/** `GET /api/exercises/{id}`: what a trainee sees at the start; any person of the organisation. */
export async function getExercise(actor: Actor, input: { exerciseId: number }): Promise<ExerciseDto> {
  const x = await exerciseOf(actor, input.exerciseId)
  return exerciseView(x.id, x.title, x.createdAt, x.material, x.start)
}

/** `PATCH /api/exercises/{id}`: a new title, or a new choice of what the trainee sees at the start. */
export async function changeExercise(actor: Actor, input: UpdateExerciseInput & { exerciseId: number }): Promise<ExerciseDto> {
  const x = await exerciseOf(actor, input.exerciseId)
  let material: ExerciseMaterial | undefined
  if (input.start) {
    checkStart(x.material, input.start)
    const { engine: _old, ...rest } = x.material
    material = await withEnginePath(actor, rest, input.start)
  }
  const title = input.title === undefined ? undefined : scrubText(input.title, await caseSecrets(actor.organisationId, x.caseId))
  await updateExercise(actor.organisationId, x.id, { title, start: input.start, material })
  return getExercise(actor, { exerciseId: x.id })
}

async function assign(actor: Actor, exerciseId: number, userIds: number[], now: Date) {
  const unique = [...new Set(userIds)]
  const known = await activePeopleOf(actor.organisationId, unique)
  const unknown = unique.filter((id) => !known.includes(id))
  if (unknown.length) throw new NotFoundError(`No active person of your organisation has the id ${unknown.join(', ')}`)
  await setAssignees(exerciseId, known, now)
}

/** `PUT /api/exercises/{id}/assignees`: who the exercise is assigned to. */
export async function assignExercise(actor: Actor, input: { exerciseId: number; userIds: number[] }, now: Date): Promise<ExerciseSummaryDto> {
  await exerciseOf(actor, input.exerciseId)
  await assign(actor, input.exerciseId, input.userIds, now)
  const row = (await listExercises(actor.organisationId, actor.id, false)).find((r) => r.id === input.exerciseId)
  if (!row) throw new NotFoundError(EXERCISE_NOT_FOUND)
  return summaryOf(actor, row)
}

function summaryOf(actor: Actor, r: Awaited<ReturnType<typeof listExercises>>[number]): ExerciseSummaryDto {
  const trainer = isTrainer(actor)
  return {
    id: r.id, title: r.title, createdAt: r.createdAt.toISOString(), unitKind: r.unitKind as ExerciseSummaryDto['unitKind'],
    equipmentClass: r.equipmentClass as ExerciseSummaryDto['equipmentClass'], assignedToMe: r.assignedToMe, myAttempts: r.myAttempts,
    attempts: trainer ? r.attempts : r.myAttempts, caseId: trainer ? r.caseId : null, start: trainer ? r.start : null,
    assignees: trainer ? r.assignees.map((a) => ({ id: a.id, name: a.name })) : null,
  }
}

/** `GET /api/exercises`: trainers see all of the organisation's; others those assigned to them or tried by them. */
export async function listExercisesFor(actor: Actor): Promise<ExerciseSummaryDto[]> {
  return (await listExercises(actor.organisationId, actor.id, !isTrainer(actor))).map((r) => summaryOf(actor, r))
}

function attemptView(a: AttemptRecord, material: ExerciseMaterial): AttemptDto {
  const finished = a.finishedAt !== null
  return {
    id: a.id, exerciseId: a.exerciseId, exerciseTitle: a.exerciseTitle, userId: a.userId, person: a.person, startedAt: a.startedAt.toISOString(),
    finishedAt: finished ? a.finishedAt!.toISOString() : null,
    requests: a.requests.map((r) => ({ ...r })),
    minutesSpent: a.requests.reduce((s, r) => s + r.minutes, 0),
    answer: (a.answer as AttemptDto['answer']) ?? null,
    score: a.score,
    enginePath: finished ? material.engine.steps.map((s) => ({ ...s })) : null,
  }
}

/** Reads an attempt the actor may see: their own, or anyone's for trainers. */
async function attemptFor(actor: Actor, attemptId: number, mustOwn = false): Promise<{ attempt: AttemptRecord; exercise: ExerciseRecord }> {
  const attempt = await findAttempt(actor.organisationId, attemptId)
  if (!attempt) throw new NotFoundError(ATTEMPT_NOT_FOUND)
  if (attempt.userId !== actor.id && (mustOwn || !isTrainer(actor))) {
    if (mustOwn && isTrainer(actor)) throw new ForbiddenError('Only the trainee working this attempt may add to it')
    throw new NotFoundError(ATTEMPT_NOT_FOUND)
  }
  return { attempt, exercise: await exerciseOf(actor, attempt.exerciseId) }
}

/** `POST /api/exercises/{id}/attempts`: starts working an exercise. */
export async function startAttempt(actor: Actor, input: { exerciseId: number }, now: Date): Promise<AttemptDto> {
  const x = await exerciseOf(actor, input.exerciseId)
  const id = await insertAttempt(actor.organisationId, x.id, actor.id, now)
  return getAttempt(actor, { attemptId: id })
}

/** `GET /api/exercise-attempts/{id}`. */
export async function getAttempt(actor: Actor, input: { attemptId: number }): Promise<AttemptDto> {
  const { attempt, exercise } = await attemptFor(actor, input.attemptId)
  return attemptView(attempt, exercise.material)
}

/** `POST /api/exercise-attempts/{id}/requests`: asks for a reading or a test and gets what the case recorded. */
export async function requestInAttempt(actor: Actor, input: AttemptRequestInput & { attemptId: number }, now: Date): Promise<AttemptDto> {
  const { attemptId, ...request } = input
  for (let i = 0; i < 5; i++) {
    const { attempt, exercise } = await attemptFor(actor, attemptId, true)
    if (attempt.finishedAt) throw new ConflictError('This attempt is finished; start a new one to try again')
    const answer = answerRequest(exercise.material, exercise.start, attempt.requests, request, now)
    if (!answer || (await appendRequest(attempt.id, attempt.requests.length, answer))) return getAttempt(actor, { attemptId })
  }
  throw new ConflictError('This attempt is being changed from elsewhere; reload it')
}

/** `POST /api/exercise-attempts/{id}/answer`: names the cause per stage and scores the attempt. */
export async function answerAttempt(actor: Actor, input: AttemptAnswerInput & { attemptId: number }, now: Date): Promise<AttemptDto> {
  const { attempt, exercise } = await attemptFor(actor, input.attemptId, true)
  if (attempt.finishedAt) throw new ConflictError('This attempt is already finished')
  const m = exercise.material
  const stages = m.unit.stages.map((s) => s.stage)
  const missing = stages.filter((s) => !input.causes.some((c) => c.stage === s))
  const extra = input.causes.filter((c) => !stages.includes(c.stage))
  if (missing.length || extra.length) throw new InvalidStateError(`Name one cause for each stage of the unit (${stages.join(', ')})`)
  const score = scoreAttempt({
    stages: m.unit.stages.map((s) => ({ stage: s.stage, flammable: !!findRefrigerant(s.refrigerant)?.flammable })),
    confirmed: m.confirmedCauses,
    answer: input.causes,
    requests: attempt.requests.map((r) => ({ kind: r.kind, ...(r.test ? { test: r.test } : {}), ...(r.stage ? { stage: r.stage } : {}), minutes: r.minutes, invasive: r.invasive })),
    engineMinutes: m.engine.minutes,
    engineTests: m.engine.steps.filter((s) => s.kind === 'test').map((s) => `${s.test}|${s.stage ?? ''}`),
  })
  if (!(await finishAttempt(attempt.id, input.causes, score, now))) throw new ConflictError('This attempt is already finished')
  return getAttempt(actor, { attemptId: attempt.id })
}

/** Attempts: trainers see everyone's (of one exercise, or the latest of all); others their own. */
export async function listAttemptsFor(actor: Actor, input: { exerciseId?: number }): Promise<AttemptDto[]> {
  const exercises = new Map<number, ExerciseRecord>()
  if (input.exerciseId) exercises.set(input.exerciseId, await exerciseOf(actor, input.exerciseId))
  const rows = await listAttempts(actor.organisationId, { exerciseId: input.exerciseId, userId: isTrainer(actor) ? undefined : actor.id, limit: 200 })
  const out: AttemptDto[] = []
  for (const a of rows) {
    if (!exercises.has(a.exerciseId)) exercises.set(a.exerciseId, await exerciseOf(actor, a.exerciseId))
    out.push(attemptView(a, exercises.get(a.exerciseId)!.material))
  }
  return out
}
