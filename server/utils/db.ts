import type { Sequelize } from 'sequelize'
import { createSequelize } from '#server/db/connection'

let instance: Sequelize | undefined

/** The database URL from runtime config (NUXT_DATABASE_URL) or DATABASE_URL. */
export function databaseUrl(): string {
  const url = useRuntimeConfig().databaseUrl || process.env.DATABASE_URL
  if (!url) throw new Error('No database configured: set NUXT_DATABASE_URL')
  return url
}

/** The server's single Sequelize instance, opened on first use. */
export function useDb(): Sequelize {
  instance ??= createSequelize(databaseUrl())
  return instance
}
