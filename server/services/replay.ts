// Ranking stored cases again with a chosen knowledge-base version: the version loader (validated,
// cached by version and revision, so an edited draft is read again and a published one is read
// once), and the replay of one case's facts. The impact of a draft on past cases and the training
// replays both rank through here.
import { findUnit } from '#server/db/repositories/equipment'
import { findVersion, loadVersionContent } from '#server/db/repositories/knowledge'
import { readCacheStamps } from '#server/db/repositories/cache-stamps'
import { formatPath } from '#server/domain/diagnosis/content-loader'
import { knowledgeBaseSourceSchema, type KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import type { RankOptions } from '#server/domain/diagnosis/rank'
import { rankStoredCase, type StoredCaseFacts } from '#server/domain/knowledge/replay'
import { InvalidStateError, NotFoundError, UnavailableError } from '#server/domain/errors'
import type { RankResponse } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import { inPlainWords } from '#shared/utils/vocabulary'

const versions = createCache<KnowledgeBase>('knowledge-base versions by revision', { max: 24 })

/**
 * One version of the organisation's knowledge base, checked whole (404 for another organisation's
 * or a missing version; 422 when its content does not pass the checks).
 */
export async function knowledgeBaseVersion(organisationId: number, versionId: number): Promise<KnowledgeBase> {
  const version = await findVersion(organisationId, versionId)
  if (!version) throw new NotFoundError('Knowledge-base version not found')
  return versions.load(`${version.id}|${version.revision}|${version.status}`, async () => {
    const content = await loadVersionContent(version)
    const checked = knowledgeBaseSourceSchema.safeParse({ causes: content.causes, tests: content.tests, rules: content.rules })
    if (!checked.success) {
      const first = checked.error.issues[0]
      throw new InvalidStateError(`Version ${version.id} does not pass the knowledge-base checks: ${first ? `${formatPath(first.path)} ${first.message}` : 'invalid'}`)
    }
    return { ...checked.data, version: content.version }
  })
}

/** The organisation's published version's id, or null. */
export async function publishedVersionId(organisationId: number): Promise<number | null> {
  return (await readCacheStamps(organisationId)).knowledgeBaseVersionId
}

/**
 * Ranks a case's facts (as they stand, or as they stood at a step of its timeline) with a version of
 * the organisation's knowledge base, the published one when `versionId` is absent. Warnings come in
 * people's words, as on the case page.
 */
export async function rankCaseFacts(
  organisationId: number,
  input: { unit: UnitDto; facts: StoredCaseFacts; versionId?: number | null },
  options: RankOptions = {},
): Promise<RankResponse> {
  const versionId = input.versionId ?? (await publishedVersionId(organisationId))
  if (versionId === null) throw new UnavailableError('No knowledge base is published for your organisation yet')
  const kb = await knowledgeBaseVersion(organisationId, versionId)
  const ranked = await rankStoredCase(kb, input.unit, input.facts, options)
  return { ...ranked, warnings: ranked.warnings.map(inPlainWords), priorNote: inPlainWords(ranked.priorNote) }
}

/** The unit of the organisation a stored case belongs to, for a replay (404 when gone). */
export async function unitForReplay(organisationId: number, unitId: number): Promise<UnitDto> {
  const unit = await findUnit(organisationId, unitId)
  if (!unit) throw new NotFoundError('Unit not found')
  return unit
}
