// The one place that creates a Sequelize instance and registers every model and association.
// Used by the Nitro server (server/utils/db.ts) and by the migration/seed CLI (scripts/db.ts).
import pg from 'pg'
import { Sequelize, type QueryOptions } from 'sequelize'
import { initModels } from './models'
import { retryTransient, type RetryOptions } from './transient'

/**
 * True for a statement that only reads and runs on its own (not in a transaction): repeating it
 * after a dropped connection or a restart of the server can change nothing. Writes and statements
 * of a transaction are retried, where that is safe, by the code that owns them.
 */
export function isStandaloneRead(sql: unknown, options?: QueryOptions & { transaction?: unknown }): boolean {
  // A statement that asks Sequelize for a single try (retry.max 1), e.g. a health probe, gets one.
  if (options?.transaction || options?.retry?.max === 1) return false
  if (options?.type === 'SELECT') return true
  const text = typeof sql === 'string' ? sql : typeof (sql as { query?: unknown })?.query === 'string' ? (sql as { query: string }).query : ''
  return /^\s*SELECT\b/i.test(text)
}

/** Opens a Sequelize instance on `url` with every model registered; standalone reads retry passing failures. */
export function createSequelize(url: string, retry: RetryOptions = {}): Sequelize {
  // dialectModule: without it Nitro's tracer leaves `pg` out of the built server.
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: 20, min: 0, idle: 10_000, acquire: 10_000 },
  })
  const query = sequelize.query.bind(sequelize) as (sql: unknown, options?: QueryOptions) => Promise<unknown>
  // Every model finder and raw query passes here.
  ;(sequelize as unknown as { query: typeof query }).query = (sql, options) =>
    isStandaloneRead(sql, options) ? retryTransient(() => query(sql, options), retry) : query(sql, options)
  initModels(sequelize)
  return sequelize
}
