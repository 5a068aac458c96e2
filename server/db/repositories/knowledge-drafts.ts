// Writing knowledge-base versions from the app: copying a version into a new draft, editing its
// causes, tests and findings under their lock versions, moving its status, and publishing it.
import { QueryTypes, type Transaction } from 'sequelize'
import type { CauseDef, RuleDef, TestDef } from '#server/domain/diagnosis/knowledge-base'
import type { FindingExample } from '#server/domain/knowledge/examples-schema'
import type { StatusChange, VersionState } from '#server/domain/knowledge/workflow'
import { KbCause, KbRule, KbTest, KbVersion } from '../models'
import { testDefFromRow } from './knowledge'

/** A version row locked until the transaction ends, as the workflow reads it; null when not the organisation's. */
export async function lockVersionRow(organisationId: number, id: number, transaction: Transaction): Promise<(VersionState & { label: string }) | null> {
  const v = await KbVersion.findOne({ where: { id, organisationId }, transaction, lock: transaction.LOCK.UPDATE })
  if (!v) return null
  return { id: v.id, status: v.status, createdBy: v.createdBy, submittedBy: v.submittedBy ?? null, reviewedBy: v.reviewedBy ?? null, publishedAt: v.publishedAt, revision: v.revision ?? 0, label: v.label }
}

/** Copies a version's causes, tests and findings (with examples) into a new draft; returns its id. */
export async function copyVersionAsDraft(organisationId: number, fromId: number, meta: { label: string; createdBy: number | null }, transaction: Transaction): Promise<number> {
  const draft = await KbVersion.create(
    { organisationId, label: meta.label, status: 'draft', notes: `Copied from version ${fromId}`, publishedAt: null, createdBy: meta.createdBy, basedOnId: fromId },
    { transaction },
  )
  const q = (sql: string) => KbVersion.sequelize!.query(sql, { replacements: { from: fromId, to: draft.id }, transaction, type: QueryTypes.INSERT })
  await q(`INSERT INTO kb_causes (version_id, slug, title, short, description, stages, priors, created_at, updated_at)
           SELECT :to, slug, title, short, description, stages, priors, now(), now() FROM kb_causes WHERE version_id = :from ORDER BY id`)
  await q(`INSERT INTO kb_tests (version_id, slug, title, procedure, minutes, opens_system, hot_work, stages, metering_devices, answered_by, same_measurement_as, safety_notes, outcomes, created_at, updated_at)
           SELECT :to, slug, title, procedure, minutes, opens_system, hot_work, stages, metering_devices, answered_by, same_measurement_as, safety_notes, outcomes, now(), now() FROM kb_tests WHERE version_id = :from ORDER BY id`)
  await q(`INSERT INTO kb_rules (version_id, name, subject, definition, examples, created_at, updated_at)
           SELECT :to, name, subject, definition, examples, now(), now() FROM kb_rules WHERE version_id = :from ORDER BY id`)
  return draft.id
}

/** Items of a version with the lock version each edit must send back. */
export interface VersionItems {
  causes: (CauseDef & { lockVersion: number })[]
  tests: (TestDef & { lockVersion: number })[]
  findings: { finding: RuleDef; examples: FindingExample[]; lockVersion: number }[]
}

/** Every cause, test and finding of a version with their lock versions, in authoring order. */
export async function loadVersionItems(versionId: number, transaction?: Transaction): Promise<VersionItems> {
  const where = { versionId }
  const [causes, tests, rules] = await Promise.all([
    KbCause.findAll({ where, order: [['id', 'ASC']], transaction }),
    KbTest.findAll({ where, order: [['id', 'ASC']], transaction }),
    KbRule.findAll({ where, order: [['id', 'ASC']], transaction }),
  ])
  return {
    causes: causes.map((c) => ({ slug: c.slug, title: c.title, ...(c.short !== null ? { short: c.short } : {}), stages: c.stages, priors: c.priors, description: c.description, lockVersion: c.lockVersion }) as CauseDef & { lockVersion: number }),
    tests: tests.map((t) => ({ ...testDefFromRow(t), lockVersion: t.lockVersion })),
    findings: rules.map((r) => ({ finding: r.definition as RuleDef, examples: (r.examples ?? []) as FindingExample[], lockVersion: r.lockVersion })),
  }
}

/** Replaces a finding if its lock version is still `lockVersion`; false when someone changed it first (or it is gone). */
export async function updateFindingRow(versionId: number, name: string, lockVersion: number, finding: RuleDef, examples: FindingExample[], transaction: Transaction): Promise<boolean> {
  const [n] = await KbRule.update(
    { name: finding.name, subject: finding.subject ?? 'general', definition: finding, examples, lockVersion: lockVersion + 1 },
    { where: { versionId, name, lockVersion }, transaction },
  )
  return n === 1
}

/** Adds a finding to a version. */
export async function insertFindingRow(versionId: number, finding: RuleDef, examples: FindingExample[], transaction: Transaction): Promise<void> {
  await KbRule.create({ versionId, name: finding.name, subject: finding.subject ?? 'general', definition: finding, examples }, { transaction })
}

/** Removes a finding if its lock version is still `lockVersion`. */
export async function deleteFindingRow(versionId: number, name: string, lockVersion: number, transaction: Transaction): Promise<boolean> {
  return (await KbRule.destroy({ where: { versionId, name, lockVersion }, transaction })) === 1
}

/** Replaces a cause under its lock version. */
export async function updateCauseRow(versionId: number, slug: string, lockVersion: number, cause: CauseDef, transaction: Transaction): Promise<boolean> {
  const [n] = await KbCause.update(
    { title: cause.title, short: cause.short ?? null, description: cause.description, stages: cause.stages, priors: cause.priors, lockVersion: lockVersion + 1 },
    { where: { versionId, slug, lockVersion }, transaction },
  )
  return n === 1
}

/** Replaces a test under its lock version. */
export async function updateTestRow(versionId: number, slug: string, lockVersion: number, test: TestDef, transaction: Transaction): Promise<boolean> {
  const [n] = await KbTest.update(
    {
      title: test.title, procedure: test.procedure, minutes: test.minutes, opensSystem: test.opensSystem, hotWork: test.hotWork, stages: test.stages,
      meteringDevices: test.meteringDevices ?? null, answeredBy: test.answeredBy ?? null, sameMeasurementAs: test.sameMeasurementAs ?? null, safetyNotes: test.safetyNotes, outcomes: test.outcomes,
      lockVersion: lockVersion + 1,
    },
    { where: { versionId, slug, lockVersion }, transaction },
  )
  return n === 1
}

/** Moves a version's revision on (every content change does), with a status change if given. */
export async function touchVersion(versionId: number, change: Partial<StatusChange> & { label?: string }, transaction: Transaction): Promise<void> {
  await KbVersion.update({ ...change, revision: KbVersion.sequelize!.literal('revision + 1') as unknown as number }, { where: { id: versionId }, transaction })
}

/**
 * Publishes a version of the organisation in the caller's transaction: the version in use is
 * retired and this one published, recording who and when. Both updates commit together or not at all.
 */
export async function publishVersionRow(organisationId: number, versionId: number, by: number | null, at: Date, transaction: Transaction): Promise<{ retired: number[] }> {
  const retired = await KbVersion.findAll({ where: { organisationId, status: 'published' }, attributes: ['id'], transaction })
  await KbVersion.update({ status: 'retired', revision: KbVersion.sequelize!.literal('revision + 1') as unknown as number }, { where: { organisationId, status: 'published' }, transaction })
  await KbVersion.update(
    { status: 'published', publishedAt: at, publishedBy: by, revision: KbVersion.sequelize!.literal('revision + 1') as unknown as number },
    { where: { id: versionId, organisationId }, transaction },
  )
  return { retired: retired.map((v) => v.id).filter((id) => id !== versionId) }
}
