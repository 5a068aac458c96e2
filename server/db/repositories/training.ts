// Exercises, their assignments and trainees' attempts. Every query is scoped by organisation.
import { QueryTypes, type Transaction } from 'sequelize'
import type { CaseSecrets, ExerciseMaterial } from '#server/domain/training/exercise'
import type { AttemptRequestDto, ExerciseScore, ExerciseStart } from '#shared/types/training'
import { Organisation } from '../models'

const db = () => Organisation.sequelize!
const select = <T extends object>(sql: string, replacements: Record<string, unknown>, transaction?: Transaction) =>
  db().query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction })

/** The personal details attached to a case of the organisation: customer, site, contacts, the unit's serial and names. */
export async function caseSecrets(organisationId: number, caseId: number): Promise<CaseSecrets> {
  const [row] = await select<{ customer: string; site: string; address: string; serial: string; unit: string; location: string; contacts: { name: string; email: string; phone: string }[] }>(
    `SELECT cu.name AS customer, s.name AS site, s.address, u.serial, u.name AS unit, u.location,
            (SELECT coalesce(json_agg(json_build_object('name', k.name, 'email', k.email, 'phone', k.phone)), '[]') FROM contacts k WHERE k.site_id = s.id) AS contacts
       FROM cases c JOIN units u ON u.id = c.unit_id JOIN sites s ON s.id = u.site_id JOIN customers cu ON cu.id = s.customer_id
      WHERE c.id = :caseId AND c.organisation_id = :organisationId`,
    { caseId, organisationId },
  )
  if (!row) return { names: [], addresses: [], emails: [], phones: [], serials: [] }
  return {
    names: [row.customer, row.site, row.unit, row.location, ...row.contacts.map((k) => k.name)],
    addresses: [row.address],
    emails: row.contacts.map((k) => k.email),
    phones: row.contacts.map((k) => k.phone),
    serials: [row.serial],
  }
}

export interface ExerciseRecord {
  id: number
  caseId: number
  title: string
  start: ExerciseStart
  material: ExerciseMaterial
  createdBy: number | null
  createdAt: Date
}

/** Stores a new exercise; returns its id. */
export async function insertExercise(organisationId: number, input: Omit<ExerciseRecord, 'id' | 'createdAt'>, at: Date): Promise<number> {
  const [row] = await select<{ id: number }>(
    `INSERT INTO exercises (organisation_id, case_id, title, created_by, start, material, created_at, updated_at)
     VALUES (:organisationId, :caseId, :title, :createdBy, CAST(:start AS jsonb), CAST(:material AS jsonb), :at, :at) RETURNING id`,
    { organisationId, caseId: input.caseId, title: input.title, createdBy: input.createdBy, start: JSON.stringify(input.start), material: JSON.stringify(input.material), at },
  )
  return row!.id
}

/** An exercise of the organisation, or null. */
export async function findExercise(organisationId: number, id: number): Promise<ExerciseRecord | null> {
  const [row] = await select<{ id: number; case_id: number; title: string; start: ExerciseStart; material: ExerciseMaterial; created_by: number | null; created_at: Date }>(
    'SELECT id, case_id, title, start, material, created_by, created_at FROM exercises WHERE id = :id AND organisation_id = :organisationId',
    { id, organisationId },
  )
  return row ? { id: row.id, caseId: row.case_id, title: row.title, start: row.start, material: row.material, createdBy: row.created_by, createdAt: row.created_at } : null
}

/** Changes the title or start of an exercise of the organisation; false when there is none. */
export async function updateExercise(organisationId: number, id: number, changes: { title?: string; start?: ExerciseStart; material?: ExerciseMaterial }): Promise<boolean> {
  const [, count] = await db().query(
    `UPDATE exercises SET title = coalesce(:title, title), start = coalesce(CAST(:start AS jsonb), start), material = coalesce(CAST(:material AS jsonb), material), updated_at = now()
      WHERE id = :id AND organisation_id = :organisationId`,
    {
      replacements: {
        id, organisationId, title: changes.title ?? null,
        start: changes.start ? JSON.stringify(changes.start) : null, material: changes.material ? JSON.stringify(changes.material) : null,
      },
      type: QueryTypes.UPDATE,
    },
  )
  return Number(count) > 0
}

export interface ExerciseListRow {
  id: number
  caseId: number
  title: string
  createdAt: Date
  start: ExerciseStart
  unitKind: string
  equipmentClass: string
  assignedToMe: boolean
  myAttempts: number
  attempts: number
  assignees: { id: number; name: string }[]
}

/** The organisation's exercises, newest first; `onlyFor` keeps those assigned to that person or attempted by them. */
export async function listExercises(organisationId: number, userId: number, onlyFor: boolean): Promise<ExerciseListRow[]> {
  const rows = await select<{ id: number; case_id: number; title: string; created_at: Date; start: ExerciseStart; unit_kind: string; equipment_class: string; assigned: boolean; mine: number; attempts: number; assignees: { id: number; name: string }[] }>(
    `SELECT x.id, x.case_id, x.title, x.created_at, x.start, x.material->'unit'->>'kind' AS unit_kind, x.material->'unit'->>'equipmentClass' AS equipment_class,
            EXISTS (SELECT 1 FROM exercise_assignments a WHERE a.exercise_id = x.id AND a.user_id = :userId) AS assigned,
            (SELECT count(*)::int FROM exercise_attempts t WHERE t.exercise_id = x.id AND t.user_id = :userId) AS mine,
            (SELECT count(*)::int FROM exercise_attempts t WHERE t.exercise_id = x.id) AS attempts,
            (SELECT coalesce(json_agg(json_build_object('id', u.id, 'name', u.name) ORDER BY u.name), '[]')
               FROM exercise_assignments a JOIN users u ON u.id = a.user_id WHERE a.exercise_id = x.id) AS assignees
       FROM exercises x
      WHERE x.organisation_id = :organisationId
        ${onlyFor ? 'AND (EXISTS (SELECT 1 FROM exercise_assignments a WHERE a.exercise_id = x.id AND a.user_id = :userId) OR EXISTS (SELECT 1 FROM exercise_attempts t WHERE t.exercise_id = x.id AND t.user_id = :userId))' : ''}
      ORDER BY x.created_at DESC, x.id DESC LIMIT 200`,
    { organisationId, userId },
  )
  return rows.map((r) => ({
    id: r.id, caseId: r.case_id, title: r.title, createdAt: r.created_at, start: r.start, unitKind: r.unit_kind, equipmentClass: r.equipment_class,
    assignedToMe: r.assigned, myAttempts: r.mine, attempts: r.attempts, assignees: r.assignees,
  }))
}

/** The ids among `userIds` that are active people of the organisation. */
export async function activePeopleOf(organisationId: number, userIds: number[]): Promise<number[]> {
  if (!userIds.length) return []
  const rows = await select<{ id: number }>('SELECT id FROM users WHERE organisation_id = :organisationId AND active AND id IN (:userIds)', { organisationId, userIds })
  return rows.map((r) => r.id)
}

/** Replaces who an exercise is assigned to. */
export async function setAssignees(exerciseId: number, userIds: number[], at: Date): Promise<void> {
  await db().transaction(async (transaction) => {
    await db().query('DELETE FROM exercise_assignments WHERE exercise_id = :exerciseId', { replacements: { exerciseId }, transaction })
    if (userIds.length) {
      await db().query(
        `INSERT INTO exercise_assignments (exercise_id, user_id, assigned_at) SELECT :exerciseId, unnest(ARRAY[:userIds]::int[]), :at`,
        { replacements: { exerciseId, userIds, at }, transaction },
      )
    }
  })
}

export interface AttemptRecord {
  id: number
  exerciseId: number
  exerciseTitle: string
  userId: number
  person: string
  requests: AttemptRequestDto[]
  answer: { stage: string; cause: string }[] | null
  score: ExerciseScore | null
  startedAt: Date
  finishedAt: Date | null
}

const ATTEMPT_COLUMNS = `t.id, t.exercise_id, x.title AS exercise_title, t.user_id, u.name AS person, t.requests, t.answer, t.score, t.started_at, t.finished_at
  FROM exercise_attempts t JOIN exercises x ON x.id = t.exercise_id JOIN users u ON u.id = t.user_id`
type AttemptRow = { id: number; exercise_id: number; exercise_title: string; user_id: number; person: string; requests: AttemptRequestDto[]; answer: AttemptRecord['answer']; score: ExerciseScore | null; started_at: Date; finished_at: Date | null }
const attemptOf = (r: AttemptRow): AttemptRecord => ({
  id: r.id, exerciseId: r.exercise_id, exerciseTitle: r.exercise_title, userId: r.user_id, person: r.person, requests: r.requests, answer: r.answer,
  score: r.score, startedAt: r.started_at, finishedAt: r.finished_at,
})

/** Starts an attempt; returns its id. */
export async function insertAttempt(organisationId: number, exerciseId: number, userId: number, at: Date): Promise<number> {
  const [row] = await select<{ id: number }>(
    'INSERT INTO exercise_attempts (organisation_id, exercise_id, user_id, requests, started_at) VALUES (:organisationId, :exerciseId, :userId, \'[]\'::jsonb, :at) RETURNING id',
    { organisationId, exerciseId, userId, at },
  )
  return row!.id
}

/** An attempt of the organisation, or null. */
export async function findAttempt(organisationId: number, id: number): Promise<AttemptRecord | null> {
  const [row] = await select<AttemptRow>(`SELECT ${ATTEMPT_COLUMNS} WHERE t.id = :id AND t.organisation_id = :organisationId`, { id, organisationId })
  return row ? attemptOf(row) : null
}

/** Attempts of the organisation, newest first, optionally of one exercise or one person. */
export async function listAttempts(organisationId: number, filter: { exerciseId?: number; userId?: number; limit?: number }): Promise<AttemptRecord[]> {
  const rows = await select<AttemptRow>(
    `SELECT ${ATTEMPT_COLUMNS} WHERE t.organisation_id = :organisationId
       ${filter.exerciseId ? 'AND t.exercise_id = :exerciseId' : ''} ${filter.userId ? 'AND t.user_id = :userId' : ''}
      ORDER BY t.started_at DESC, t.id DESC LIMIT :limit`,
    { organisationId, exerciseId: filter.exerciseId ?? null, userId: filter.userId ?? null, limit: filter.limit ?? 200 },
  )
  return rows.map(attemptOf)
}

/** Appends a request to an unfinished attempt, only if it still has `count` requests; false otherwise. */
export async function appendRequest(id: number, count: number, request: AttemptRequestDto): Promise<boolean> {
  const [, affected] = await db().query(
    `UPDATE exercise_attempts SET requests = requests || CAST(:request AS jsonb)
      WHERE id = :id AND finished_at IS NULL AND jsonb_array_length(requests) = :count`,
    { replacements: { id, count, request: JSON.stringify([request]) }, type: QueryTypes.UPDATE },
  )
  return Number(affected) > 0
}

/** Finishes an attempt with its answer and score; false when it was already finished. */
export async function finishAttempt(id: number, answer: { stage: string; cause: string }[], score: ExerciseScore, at: Date): Promise<boolean> {
  const [, affected] = await db().query(
    `UPDATE exercise_attempts SET answer = CAST(:answer AS jsonb), score = CAST(:score AS jsonb), finished_at = :at WHERE id = :id AND finished_at IS NULL`,
    { replacements: { id, answer: JSON.stringify(answer), score: JSON.stringify(score), at }, type: QueryTypes.UPDATE },
  )
  return Number(affected) > 0
}

/** The organisation's latest closed cases with a confirmed cause: what the accuracy of a knowledge base is measured on. */
export async function confirmedCases(organisationId: number, limit: number) {
  return select<{ id: number; unit_id: number; symptoms: string[]; readings: unknown[]; test_results: unknown[]; confirmed_causes: { cause: string; stage?: string }[]; closed_at: Date }>(
    `SELECT id, unit_id, symptoms, readings, test_results, confirmed_causes, closed_at FROM cases
      WHERE organisation_id = :organisationId AND status = 'closed' AND jsonb_array_length(confirmed_causes) > 0
      ORDER BY closed_at DESC LIMIT :limit`,
    { organisationId, limit },
  )
}
