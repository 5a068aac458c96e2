import { QueryTypes } from 'sequelize'
import { Organisation } from '../models'

/**
 * What an organisation's cached data is at now. The database moves these on by itself (triggers of
 * the create-cache-stamps migration) whenever a version is published, a case is closed or the
 * equipment register changes, whoever writes; caches put them in their keys.
 */
export interface CacheStamps {
  organisationId: number
  /** The published knowledge-base version, or null when none is published. */
  knowledgeBaseVersionId: number | null
  /** Moves on when confirmed causes on closed cases change (the learned priors). */
  learnedGeneration: number
  /** Moves on when a unit, its stages, its site or its customer changes. */
  equipmentGeneration: number
}

/** The stamp columns as queries select them (`kb`, `learned`, `equipment`); a missing row is all zero. */
export interface CacheStampColumns {
  kb: number | null
  learned: string | number | null
  equipment: string | number | null
}

/** SQL select list of the stamp columns of `organisation_cache_stamps s`, for a query that joins them. */
export const CACHE_STAMP_COLUMNS = 's.published_kb_version_id AS kb, s.learned_generation AS learned, s.equipment_generation AS equipment'

/** The stamps of an organisation from the columns a query selected. */
export function cacheStampsFrom(organisationId: number, row: Partial<CacheStampColumns> | undefined): CacheStamps {
  return {
    organisationId,
    knowledgeBaseVersionId: row?.kb ?? null,
    learnedGeneration: Number(row?.learned ?? 0),
    equipmentGeneration: Number(row?.equipment ?? 0),
  }
}

/** The organisation's cache stamps in one indexed read. */
export async function readCacheStamps(organisationId: number): Promise<CacheStamps> {
  const [row] = await Organisation.sequelize!.query<CacheStampColumns>(
    `SELECT ${CACHE_STAMP_COLUMNS} FROM organisation_cache_stamps s WHERE s.organisation_id = $1`,
    { bind: [organisationId], type: QueryTypes.SELECT },
  )
  return cacheStampsFrom(organisationId, row)
}
