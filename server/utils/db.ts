import type { Sequelize } from 'sequelize'
import { createSequelize } from '#server/db/connection'

let instance: Sequelize | undefined

/** The server's single Sequelize instance, opened on first use from NUXT_DATABASE_URL. */
export function useDb(): Sequelize {
  if (!instance) {
    const url = useRuntimeConfig().databaseUrl || process.env.DATABASE_URL
    if (!url) throw new Error('No database configured: set NUXT_DATABASE_URL')
    instance = createSequelize(url)
  }
  return instance
}
