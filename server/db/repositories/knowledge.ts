import { QueryTypes, type Transaction } from 'sequelize'
import type { KnowledgeBase, KnowledgeBaseSource, CauseDef, RuleDef, TestDef } from '#server/domain/diagnosis/knowledge-base'
import type { FindingExample } from '#server/domain/knowledge/examples-schema'
import type { CaseReading, CaseTestResult } from '#shared/types/cases'
import type { Symptom } from '#shared/types/diagnosis'
import { KbAuditEvent, KbCause, KbRule, KbTest, KbVersion, ServiceCase } from '../models'

export type KbVersionStatus = 'draft' | 'in-review' | 'published' | 'retired'

export interface KbVersionRecord {
  id: number
  organisationId: number
  label: string
  status: KbVersionStatus
  publishedAt: Date | null
  createdAt: Date
  createdBy: number | null
  revision: number
  basedOnId: number | null
  submittedBy: number | null
  submittedAt: Date | null
  reviewedBy: number | null
  reviewedAt: Date | null
  reviewComment: string | null
  publishedBy: number | null
  notes: string
}
const plainVersion = (v: KbVersion): KbVersionRecord => ({
  id: v.id, organisationId: v.organisationId, label: v.label, status: v.status, publishedAt: v.publishedAt, createdAt: v.createdAt,
  createdBy: v.createdBy, revision: v.revision ?? 0, basedOnId: v.basedOnId ?? null, submittedBy: v.submittedBy ?? null,
  submittedAt: v.submittedAt ?? null, reviewedBy: v.reviewedBy ?? null, reviewedAt: v.reviewedAt ?? null,
  reviewComment: v.reviewComment ?? null, publishedBy: v.publishedBy ?? null, notes: v.notes ?? '',
})

/** Stores a validated knowledge base as a new version of the organisation (draft or published). */
export async function insertKnowledgeBaseVersion(
  organisationId: number,
  source: KnowledgeBaseSource,
  meta: { label: string; status: 'draft' | 'published'; createdBy?: number | null; notes?: string; basedOnId?: number | null; examples?: Record<string, FindingExample[]> },
  transaction: Transaction,
): Promise<KbVersionRecord> {
  if (meta.status === 'published') {
    await KbVersion.update({ status: 'retired' }, { where: { organisationId, status: 'published' }, transaction })
  }
  const version = await KbVersion.create(
    {
      organisationId, label: meta.label, status: meta.status, notes: meta.notes ?? '',
      publishedAt: meta.status === 'published' ? new Date() : null, createdBy: meta.createdBy ?? null, basedOnId: meta.basedOnId ?? null,
      publishedBy: meta.status === 'published' ? (meta.createdBy ?? null) : null,
    },
    { transaction },
  )
  const versionId = version.id
  await KbCause.bulkCreate(source.causes.map((c) => ({ versionId, ...c })), { transaction })
  await KbTest.bulkCreate(source.tests.map((t) => ({ versionId, meteringDevices: null, answeredBy: null, sameMeasurementAs: null, ...t })), { transaction })
  await KbRule.bulkCreate(
    source.rules.map((r) => ({ versionId, name: r.name, subject: r.subject ?? 'general', definition: r, examples: meta.examples?.[r.name] ?? [] })),
    { transaction },
  )
  return plainVersion(version)
}

/** The organisation's published version, or null. */
export async function findPublishedVersion(organisationId: number): Promise<KbVersionRecord | null> {
  const v = await KbVersion.findOne({ where: { organisationId, status: 'published' } })
  return v ? plainVersion(v) : null
}

/** One version of the organisation by id, or null. */
export async function findVersion(organisationId: number, id: number): Promise<KbVersionRecord | null> {
  const v = await KbVersion.findOne({ where: { id, organisationId } })
  return v ? plainVersion(v) : null
}

/** True when the organisation has any knowledge-base version. */
export async function hasAnyVersion(organisationId: number, transaction?: Transaction): Promise<boolean> {
  return (await KbVersion.count({ where: { organisationId }, transaction })) > 0
}

/** Loads the full content of one version as plain data (not yet validated). */
export async function loadVersionContent(version: KbVersionRecord): Promise<KnowledgeBase> {
  const where = { versionId: version.id }
  const [causes, tests, rules] = await Promise.all([
    KbCause.findAll({ where, order: [['id', 'ASC']] }),
    KbTest.findAll({ where, order: [['id', 'ASC']] }),
    KbRule.findAll({ where, order: [['id', 'ASC']] }),
  ])
  return {
    version: { id: version.id, label: version.label, status: version.status === 'published' ? 'published' : 'draft' },
    causes: causes.map((c) => ({ slug: c.slug, title: c.title, ...(c.short !== null ? { short: c.short } : {}), stages: c.stages, priors: c.priors, description: c.description }) as CauseDef),
    tests: tests.map(testDefFromRow),
    rules: rules.map((r) => r.definition as RuleDef),
  }
}

/** A version of the organisation with the names of the people who made, submitted, reviewed and published it. */
export interface KbVersionListRow extends KbVersionRecord {
  createdByName: string | null
  submittedByName: string | null
  reviewedByName: string | null
  publishedByName: string | null
}

/** Every version of the organisation, newest first, with the names of the people involved. */
export async function listVersions(organisationId: number, id?: number): Promise<KbVersionListRow[]> {
  const rows = await KbVersion.sequelize!.query<{ id: number; c: string | null; s: string | null; r: string | null; p: string | null }>(
    `SELECT v.id, c.name AS c, s.name AS s, r.name AS r, p.name AS p
       FROM kb_versions v
       LEFT JOIN users c ON c.id = v.created_by LEFT JOIN users s ON s.id = v.submitted_by
       LEFT JOIN users r ON r.id = v.reviewed_by LEFT JOIN users p ON p.id = v.published_by
      WHERE v.organisation_id = :organisationId ${id !== undefined ? 'AND v.id = :id' : ''}`,
    { replacements: { organisationId, id: id ?? null }, type: QueryTypes.SELECT },
  )
  const names = new Map(rows.map((r) => [r.id, r]))
  const versions = await KbVersion.findAll({ where: { organisationId, ...(id !== undefined ? { id } : {}) }, order: [['id', 'DESC']] })
  return versions.map((v) => {
    const n = names.get(v.id)
    return { ...plainVersion(v), createdByName: n?.c ?? null, submittedByName: n?.s ?? null, reviewedByName: n?.r ?? null, publishedByName: n?.p ?? null }
  })
}

/** Worked examples of every finding of a version that has any, by finding name. */
export async function loadVersionExamples(versionId: number): Promise<Record<string, FindingExample[]>> {
  const rows = await KbRule.findAll({ where: { versionId }, attributes: ['name', 'examples'], order: [['id', 'ASC']] })
  return Object.fromEntries(rows.filter((r) => Array.isArray(r.examples) && r.examples.length).map((r) => [r.name, r.examples as FindingExample[]]))
}

/** What a replay reads of a closed case of the organisation. */
export interface ClosedCaseFacts {
  id: number
  unitId: number
  symptoms: Symptom[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
  confirmedCauses: { cause: string; stage?: string }[]
}

const CLOSED_CONFIRMED = `organisation_id = :organisationId AND status = 'closed' AND jsonb_array_length(confirmed_causes) > 0`

/** How many closed cases of the organisation have at least one confirmed cause. */
export async function countClosedCasesWithConfirmedCauses(organisationId: number): Promise<number> {
  const [row] = await ServiceCase.sequelize!.query<{ n: string }>(`SELECT count(*) AS n FROM cases WHERE ${CLOSED_CONFIRMED}`, {
    replacements: { organisationId }, type: QueryTypes.SELECT,
  })
  return Number(row?.n ?? 0)
}

/**
 * One batch of the organisation's closed cases that have at least one confirmed cause, in id order:
 * the first `limit` after `afterId` (a replay reads them batch by batch, never all at once).
 */
export async function closedCasesWithConfirmedCauses(organisationId: number, batch: { afterId: number; limit: number }): Promise<ClosedCaseFacts[]> {
  const rows = await ServiceCase.sequelize!.query<{ id: number; unit_id: number; symptoms: Symptom[]; readings: CaseReading[]; test_results: CaseTestResult[]; confirmed_causes: ClosedCaseFacts['confirmedCauses'] }>(
    `SELECT id, unit_id, symptoms, readings, test_results, confirmed_causes FROM cases
      WHERE ${CLOSED_CONFIRMED} AND id > :afterId
      ORDER BY id LIMIT :limit`,
    { replacements: { organisationId, afterId: batch.afterId, limit: batch.limit }, type: QueryTypes.SELECT },
  )
  return rows.map((r) => ({ id: r.id, unitId: r.unit_id, symptoms: r.symptoms, readings: r.readings, testResults: r.test_results, confirmedCauses: r.confirmed_causes }))
}

/** One entry of the knowledge-base audit log. */
export interface KbAuditEntry {
  versionId: number | null
  action: string
  itemKind?: string | null
  itemKey?: string | null
  details?: Record<string, unknown>
}

/** Writes an audit entry in the caller's transaction. */
export async function insertAudit(organisationId: number, userId: number | null, at: Date, entry: KbAuditEntry, transaction?: Transaction): Promise<void> {
  await KbAuditEvent.create(
    { organisationId, userId, at, versionId: entry.versionId, action: entry.action, itemKind: entry.itemKind ?? null, itemKey: entry.itemKey ?? null, details: entry.details ?? {} },
    { transaction },
  )
}

/** The organisation's audit log, newest first, with the names of the people (optionally of one version). */
export async function listAudit(organisationId: number, options: { versionId?: number; limit: number; offset: number }) {
  const rows = await KbAuditEvent.sequelize!.query<{ id: number; version_id: number | null; at: Date; action: string; item_kind: string | null; item_key: string | null; details: Record<string, unknown>; by: string | null; by_id: number | null; total: string }>(
    `SELECT a.id, a.version_id, a.at, a.action, a.item_kind, a.item_key, a.details, u.name AS by, a.user_id AS by_id, count(*) OVER () AS total
       FROM kb_audit_events a LEFT JOIN users u ON u.id = a.user_id
      WHERE a.organisation_id = :organisationId ${options.versionId !== undefined ? 'AND a.version_id = :versionId' : ''}
      ORDER BY a.at DESC, a.id DESC LIMIT :limit OFFSET :offset`,
    { replacements: { organisationId, versionId: options.versionId ?? null, limit: options.limit, offset: options.offset }, type: QueryTypes.SELECT },
  )
  return {
    total: Number(rows[0]?.total ?? 0),
    items: rows.map((r) => ({
      id: r.id, versionId: r.version_id, at: new Date(r.at).toISOString(), action: r.action, itemKind: r.item_kind, itemKey: r.item_key,
      details: r.details, by: r.by, byUserId: r.by_id,
    })),
  }
}

/**
 * The latest finished measurement of a version's accuracy in the organisation: an impact replay that
 * ranked with it (as candidate or as published) or an accuracy report made with it; null when none.
 */
export async function latestAccuracyJob(organisationId: number, versionId: number): Promise<{ kind: string; result: unknown; finishedAt: Date } | null> {
  const [row] = await ServiceCase.sequelize!.query<{ kind: string; result: unknown; finished_at: Date }>(
    `SELECT kind, result, finished_at FROM background_jobs
      WHERE organisation_id = :organisationId AND state = 'done' AND result IS NOT NULL AND (
        (kind = 'kb-impact' AND (result->>'publishedVersionId' = :version OR result->>'candidateVersionId' = :version))
        OR (kind = 'kb-accuracy' AND result->'knowledgeBaseVersion'->>'id' = :version))
      ORDER BY finished_at DESC NULLS LAST LIMIT 1`,
    { replacements: { organisationId, version: String(versionId) }, type: QueryTypes.SELECT },
  )
  return row ? { kind: row.kind, result: row.result, finishedAt: new Date(row.finished_at) } : null
}

/** A stored test as the knowledge base reads it: the optional fields only when set. */
export function testDefFromRow(t: KbTest): TestDef {
  return {
    slug: t.slug, title: t.title, minutes: t.minutes, opensSystem: t.opensSystem, hotWork: t.hotWork, stages: t.stages,
    ...(t.meteringDevices != null ? { meteringDevices: t.meteringDevices } : {}),
    ...(t.answeredBy !== null ? { answeredBy: t.answeredBy } : {}),
    ...(t.sameMeasurementAs !== null ? { sameMeasurementAs: t.sameMeasurementAs } : {}),
    safetyNotes: t.safetyNotes, outcomes: t.outcomes, procedure: t.procedure,
  } as TestDef
}
