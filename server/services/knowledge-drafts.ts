// Editing the knowledge base in the app: drafts copied from a version, edits of causes, tests and
// findings under lock versions (two engineers changing one item: the second gets a 409), review by
// someone other than the author, publishing in one transaction, rollback, the diff against the
// published version and the audit log. Each change and its audit entry commit together.
import type { Transaction } from 'sequelize'
import {
  copyVersionAsDraft, deleteFindingRow, insertFindingRow, loadVersionItems, lockVersionRow, publishVersionRow, touchVersion, updateCauseRow,
  updateFindingRow, updateTestRow, type VersionItems,
} from '#server/db/repositories/knowledge-drafts'
import { findVersion, insertAudit, listAudit, loadVersionContent, loadVersionExamples, type KbAuditEntry } from '#server/db/repositories/knowledge'
import { readCacheStamps } from '#server/db/repositories/cache-stamps'
import { formatPath } from '#server/domain/diagnosis/content-loader'
import { knowledgeBaseSourceSchema, type RuleDef } from '#server/domain/diagnosis/knowledge-base'
import { diffKnowledgeBases, type DiffItem } from '#server/domain/knowledge/diff'
import type { CauseEdit, FindingCreate, FindingEdit, ReviewInput, TestEdit } from '#server/domain/knowledge/inputs'
import { assertEditable, assertPublishable, assertRevision, planReview, planSubmit, type VersionState } from '#server/domain/knowledge/workflow'
import { BadInputError, ConflictError, NotFoundError } from '#server/domain/errors'
import type { FieldErrors } from '#shared/utils/input-errors'
import type { KbVersionDto, VersionCheckDto } from '#shared/types/knowledge'
import { runExamples } from '#server/domain/knowledge/examples'
import { HELD_OUT_SCENARIOS, TUNING_SCENARIOS, scoreSuite } from '#server/domain/diagnosis/scenarios/suite'
import { getKnowledgeBaseVersion } from './knowledge'
import { knowledgeBaseVersion, publishedVersionId } from './replay'
import type { Actor } from './types'

const VERSION_NOT_FOUND = 'Knowledge-base version not found'
const CHANGED_BY_OTHERS = 'Someone else changed this item since you opened it. Reload it, check their change and make yours again.'

async function lockedVersion(actor: Actor, versionId: number, transaction: Transaction) {
  const v = await lockVersionRow(actor.organisationId, versionId, transaction)
  if (!v) throw new NotFoundError(VERSION_NOT_FOUND)
  return v
}

/** Runs a change of a draft under its row lock and writes its audit entry in the same transaction. */
async function changeDraft<T>(
  actor: Actor, versionId: number, now: Date, revision: number | undefined,
  work: (transaction: Transaction, v: VersionState) => Promise<{ audit: Omit<KbAuditEntry, 'versionId'>; result: T }>,
): Promise<T> {
  return useDb().transaction(async (transaction) => {
    const v = await lockedVersion(actor, versionId, transaction)
    assertEditable(v)
    assertRevision(v, revision)
    const { audit, result } = await work(transaction, v)
    await touchVersion(versionId, {}, transaction)
    await insertAudit(actor.organisationId, actor.id, now, { ...audit, versionId }, transaction)
    return result
  })
}

/**
 * The whole draft must still pass every check after an edit (rule names unique, likelihood keys
 * naming a cause's real stage, every cause and test present). Problems of the edited finding come
 * back under `finding.…`, others under their place in the version.
 */
function checkWhole(items: VersionItems, editedFinding?: string): void {
  const source = { causes: items.causes.map(({ lockVersion: _l, ...c }) => c), tests: items.tests.map(({ lockVersion: _l, ...t }) => t), rules: items.findings.map((f) => f.finding) }
  const parsed = knowledgeBaseSourceSchema.safeParse(source)
  if (parsed.success) return
  const fieldErrors: FieldErrors = {}
  for (const issue of parsed.error.issues) {
    const [list, index, ...rest] = issue.path
    const isEdited = list === 'rules' && typeof index === 'number' && source.rules[index]?.name === editedFinding
    const key = isEdited ? ['finding', ...rest].map(String).join('.') : formatPath(issue.path) || '_'
    ;(fieldErrors[key] ??= []).push(issue.message)
  }
  const [first] = Object.entries(fieldErrors)
  throw new BadInputError(first ? `${first[0]}: ${first[1][0]}` : 'The draft does not pass the checks', fieldErrors)
}

/** `POST /api/knowledge-base/versions`: a new draft copied from a version of the organisation (the published one by default). */
export async function createDraft(actor: Actor, input: { from?: number; label?: string }, now: Date): Promise<KbVersionDto> {
  const fromId = input.from ?? (await readCacheStamps(actor.organisationId)).knowledgeBaseVersionId
  if (fromId === null) throw new NotFoundError('No version is published to start a draft from')
  const id = await useDb().transaction(async (transaction) => {
    const from = await lockedVersion(actor, fromId, transaction)
    const label = input.label ?? `Draft from version ${from.id} (${from.label})`.slice(0, 120)
    const draftId = await copyVersionAsDraft(actor.organisationId, from.id, { label, createdBy: actor.id }, transaction)
    await insertAudit(actor.organisationId, actor.id, now, { versionId: draftId, action: 'draft-created', details: { from: from.id, label } }, transaction)
    return draftId
  })
  return getKnowledgeBaseVersion(actor, { versionId: id })
}

/** Everything of a version an editor needs: its status, and each item with its lock version. */
export async function versionItems(actor: Actor, input: { versionId: number }): Promise<{ version: KbVersionDto } & VersionItems> {
  const version = await getKnowledgeBaseVersion(actor, input)
  return { version, ...(await loadVersionItems(input.versionId)) }
}

/** `PUT …/findings/{name}`: replaces a finding and its examples. */
export function updateFinding(actor: Actor, input: FindingEdit & { versionId: number; name: string }, now: Date): Promise<{ lockVersion: number }> {
  return changeDraft(actor, input.versionId, now, input.revision, async (transaction) => {
    const items = await loadVersionItems(input.versionId, transaction)
    const at = items.findings.findIndex((f) => f.finding.name === input.name)
    if (at < 0) throw new NotFoundError(`No finding named "${input.name}" in this draft`)
    if (items.findings[at]!.lockVersion !== input.lockVersion) throw new ConflictError(CHANGED_BY_OTHERS)
    const finding: RuleDef = { ...input.finding, subject: input.finding.subject ?? items.findings[at]!.finding.subject }
    items.findings[at] = { finding, examples: input.examples, lockVersion: input.lockVersion + 1 }
    checkWhole(items, finding.name)
    if (!(await updateFindingRow(input.versionId, input.name, input.lockVersion, finding, input.examples, transaction))) throw new ConflictError(CHANGED_BY_OTHERS)
    const renamed = finding.name !== input.name ? { renamedFrom: input.name } : {}
    return { audit: { action: 'finding-changed', itemKind: 'finding', itemKey: finding.name, details: renamed }, result: { lockVersion: input.lockVersion + 1 } }
  })
}

/** `POST …/findings`: adds a finding. */
export function addFinding(actor: Actor, input: FindingCreate & { versionId: number }, now: Date): Promise<{ lockVersion: number }> {
  return changeDraft(actor, input.versionId, now, input.revision, async (transaction) => {
    const items = await loadVersionItems(input.versionId, transaction)
    items.findings.push({ finding: input.finding, examples: input.examples, lockVersion: 0 })
    checkWhole(items, input.finding.name)
    await insertFindingRow(input.versionId, input.finding, input.examples, transaction)
    return { audit: { action: 'finding-added', itemKind: 'finding', itemKey: input.finding.name }, result: { lockVersion: 0 } }
  })
}

/** `DELETE …/findings/{name}`: removes a finding. */
export function removeFinding(actor: Actor, input: { versionId: number; name: string; lockVersion: number }, now: Date): Promise<void> {
  return changeDraft(actor, input.versionId, now, undefined, async (transaction) => {
    if (!(await deleteFindingRow(input.versionId, input.name, input.lockVersion, transaction))) {
      const exists = (await loadVersionItems(input.versionId, transaction)).findings.some((f) => f.finding.name === input.name)
      throw exists ? new ConflictError(CHANGED_BY_OTHERS) : new NotFoundError(`No finding named "${input.name}" in this draft`)
    }
    return { audit: { action: 'finding-removed', itemKind: 'finding', itemKey: input.name }, result: undefined }
  })
}

/** `PUT …/causes/{slug}`: replaces a cause's words, stages and starting weights. */
export function updateCause(actor: Actor, input: CauseEdit & { versionId: number; slug: string }, now: Date): Promise<{ lockVersion: number }> {
  return changeDraft(actor, input.versionId, now, input.revision, async (transaction) => {
    if (input.cause.slug !== input.slug) throw new BadInputError('A cause keeps its word', { 'cause.slug': [`must stay "${input.slug}"`] })
    const items = await loadVersionItems(input.versionId, transaction)
    const at = items.causes.findIndex((c) => c.slug === input.slug)
    if (at < 0) throw new NotFoundError(`No cause "${input.slug}" in this draft`)
    if (items.causes[at]!.lockVersion !== input.lockVersion) throw new ConflictError(CHANGED_BY_OTHERS)
    items.causes[at] = { ...input.cause, lockVersion: input.lockVersion + 1 }
    checkWhole(items)
    if (!(await updateCauseRow(input.versionId, input.slug, input.lockVersion, input.cause, transaction))) throw new ConflictError(CHANGED_BY_OTHERS)
    return { audit: { action: 'cause-changed', itemKind: 'cause', itemKey: input.slug }, result: { lockVersion: input.lockVersion + 1 } }
  })
}

/** `PUT …/tests/{slug}`: replaces a test's procedure, cautions, cost and outcomes. */
export function updateTest(actor: Actor, input: TestEdit & { versionId: number; slug: string }, now: Date): Promise<{ lockVersion: number }> {
  return changeDraft(actor, input.versionId, now, input.revision, async (transaction) => {
    if (input.test.slug !== input.slug) throw new BadInputError('A test keeps its word', { 'test.slug': [`must stay "${input.slug}"`] })
    const items = await loadVersionItems(input.versionId, transaction)
    const at = items.tests.findIndex((t) => t.slug === input.slug)
    if (at < 0) throw new NotFoundError(`No test "${input.slug}" in this draft`)
    if (items.tests[at]!.lockVersion !== input.lockVersion) throw new ConflictError(CHANGED_BY_OTHERS)
    items.tests[at] = { ...input.test, lockVersion: input.lockVersion + 1 }
    checkWhole(items)
    if (!(await updateTestRow(input.versionId, input.slug, input.lockVersion, input.test, transaction))) throw new ConflictError(CHANGED_BY_OTHERS)
    return { audit: { action: 'test-changed', itemKind: 'test', itemKey: input.slug }, result: { lockVersion: input.lockVersion + 1 } }
  })
}

/** `POST …/submit`: a draft goes to review (it must pass every check). */
export async function submitForReview(actor: Actor, input: { versionId: number; revision?: number }, now: Date): Promise<KbVersionDto> {
  await useDb().transaction(async (transaction) => {
    const v = await lockedVersion(actor, input.versionId, transaction)
    const change = planSubmit(v, actor.id, now, input.revision)
    checkWhole(await loadVersionItems(v.id, transaction))
    await touchVersion(v.id, change, transaction)
    await insertAudit(actor.organisationId, actor.id, now, { versionId: v.id, action: 'submitted' }, transaction)
  })
  return getKnowledgeBaseVersion(actor, input)
}

/** `POST …/review`: approves a version in review or returns it to draft with comments; never by its author. */
export async function reviewVersion(actor: Actor, input: ReviewInput & { versionId: number }, now: Date): Promise<KbVersionDto> {
  await useDb().transaction(async (transaction) => {
    const v = await lockedVersion(actor, input.versionId, transaction)
    const change = planReview(v, actor.id, input.decision, input.comment, now)
    await touchVersion(v.id, change, transaction)
    await insertAudit(actor.organisationId, actor.id, now, {
      versionId: v.id, action: input.decision === 'approve' ? 'approved' : 'returned', details: input.comment ? { comment: input.comment } : {},
    }, transaction)
  })
  return getKnowledgeBaseVersion(actor, input)
}

/**
 * `POST …/publish`: publishes an approved version, or an earlier published one again (rollback), in
 * one transaction: the version in use is retired, this one published with who and when, and the
 * audit entry written; any failure leaves the previous version published.
 */
export async function publishVersion(actor: Actor, input: { versionId: number }, now: Date): Promise<KbVersionDto> {
  await useDb().transaction(async (transaction) => {
    const v = await lockedVersion(actor, input.versionId, transaction)
    assertPublishable(v)
    checkWhole(await loadVersionItems(v.id, transaction))
    const rollback = v.status === 'retired'
    const { retired } = await publishVersionRow(actor.organisationId, v.id, actor.id, now, transaction)
    await insertAudit(actor.organisationId, actor.id, now, { versionId: v.id, action: rollback ? 'republished' : 'published', details: { retired } }, transaction)
  })
  return getKnowledgeBaseVersion(actor, input)
}

/** `GET …/diff`: what a version changes against the published one (or another version). */
export async function versionDiff(actor: Actor, input: { versionId: number; against?: number }): Promise<{ against: number | null; items: DiffItem[] }> {
  const version = await findVersion(actor.organisationId, input.versionId)
  if (!version) throw new NotFoundError(VERSION_NOT_FOUND)
  const againstId = input.against ?? version.basedOnId ?? (await readCacheStamps(actor.organisationId)).knowledgeBaseVersionId
  const base = againstId === null ? null : await findVersion(actor.organisationId, againstId)
  if (againstId !== null && !base) throw new NotFoundError(VERSION_NOT_FOUND)
  const load = async (v: NonNullable<typeof base>) => ({ ...(await loadVersionContent(v)), examples: await loadVersionExamples(v.id) })
  const next = await load(version)
  const before = base ? await load(base) : { causes: [], tests: [], rules: [], examples: {} }
  return { against: base?.id ?? null, items: diffKnowledgeBases(before, next) }
}

/** `GET /api/knowledge-base/audit`: the organisation's knowledge-base changes, newest first. */
export async function auditLog(actor: Actor, query: { versionId?: number; page: number; pageSize: number }) {
  const { items, total } = await listAudit(actor.organisationId, { versionId: query.versionId, limit: query.pageSize, offset: (query.page - 1) * query.pageSize })
  return { items, total, page: query.page, pageSize: query.pageSize }
}

// ------------------------------------------------------------------ check

const refOf = (c: { cause: string; stage?: string }) => (c.stage ? { cause: c.cause, stage: c.stage } : { cause: c.cause })

/**
 * `POST …/check`: runs every worked example of the version and the repository's scenario suite
 * (its tuning and held-out parts, with default starting odds) and lists what fails; a scenario
 * the published version ranks first and this one does not is marked as a new failure.
 */
export async function checkVersion(actor: Actor, input: { versionId: number }): Promise<VersionCheckDto> {
  const kb = await knowledgeBaseVersion(actor.organisationId, input.versionId)
  const examples = runExamples(kb, await loadVersionExamples(input.versionId))
  const scenarios = [...TUNING_SCENARIOS, ...HELD_OUT_SCENARIOS]
  const score = await scoreSuite(kb, scenarios)
  const publishedId = await publishedVersionId(actor.organisationId)
  const published = publishedId === null ? null : publishedId === input.versionId ? score : await scoreSuite(await knowledgeBaseVersion(actor.organisationId, publishedId), scenarios)
  const publishedFirst = new Set(published?.results.filter((r) => r.rank === 1).map((r) => r.scenario.id) ?? [])
  const failures = score.results
    .filter((r) => r.rank !== 1)
    .map((r) => ({
      id: r.scenario.id, title: r.scenario.title, source: r.scenario.source, expected: refOf(r.scenario.expected), rank: Math.max(r.rank, 0),
      firstThree: r.ranked.slice(0, 3).map((label) => refOf({ cause: label.split('@')[0]!, stage: label.split('@')[1] })), newFailure: publishedFirst.has(r.scenario.id),
    }))
  const failed = examples.filter((e) => !e.passed)
  return {
    examples: { total: examples.length, failed },
    scenarios: { total: score.total, top1: score.top1, top2: score.top2, publishedTop1: published?.top1 ?? null, failures },
    passed: failed.length === 0 && failures.every((f) => !f.newFailure),
  }
}
