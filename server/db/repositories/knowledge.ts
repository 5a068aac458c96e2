import type { Transaction } from 'sequelize'
import type { KnowledgeBase, KnowledgeBaseSource, CauseDef, RuleDef, TestDef } from '#server/domain/diagnosis/knowledge-base'
import { KbCause, KbRule, KbTest, KbVersion } from '../models'

export interface KbVersionRecord {
  id: number
  organisationId: number
  label: string
  status: 'draft' | 'published' | 'retired'
  publishedAt: Date | null
  createdAt: Date
}
const plainVersion = (v: KbVersion): KbVersionRecord => ({
  id: v.id, organisationId: v.organisationId, label: v.label, status: v.status, publishedAt: v.publishedAt, createdAt: v.createdAt,
})

/** Stores a validated knowledge base as a new version of the organisation (draft or published). */
export async function insertKnowledgeBaseVersion(
  organisationId: number,
  source: KnowledgeBaseSource,
  meta: { label: string; status: 'draft' | 'published'; createdBy?: number | null; notes?: string },
  transaction: Transaction,
): Promise<KbVersionRecord> {
  if (meta.status === 'published') {
    await KbVersion.update({ status: 'retired' }, { where: { organisationId, status: 'published' }, transaction })
  }
  const version = await KbVersion.create(
    {
      organisationId, label: meta.label, status: meta.status, notes: meta.notes ?? '',
      publishedAt: meta.status === 'published' ? new Date() : null, createdBy: meta.createdBy ?? null,
    },
    { transaction },
  )
  const versionId = version.id
  await KbCause.bulkCreate(source.causes.map((c) => ({ versionId, ...c })), { transaction })
  await KbTest.bulkCreate(source.tests.map((t) => ({ versionId, answeredBy: null, sameMeasurementAs: null, ...t })), { transaction })
  await KbRule.bulkCreate(
    source.rules.map((r) => ({ versionId, name: r.name, subject: r.subject ?? 'general', definition: r })),
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
    tests: tests.map(
      (t) =>
        ({
          slug: t.slug, title: t.title, minutes: t.minutes, opensSystem: t.opensSystem, hotWork: t.hotWork,
          stages: t.stages, ...(t.answeredBy !== null ? { answeredBy: t.answeredBy } : {}), ...(t.sameMeasurementAs !== null ? { sameMeasurementAs: t.sameMeasurementAs } : {}),
          safetyNotes: t.safetyNotes, outcomes: t.outcomes, procedure: t.procedure,
        }) as TestDef,
    ),
    rules: rules.map((r) => r.definition as RuleDef),
  }
}
