// The one place that creates a Sequelize instance and registers every model and association.
// Used by the Nitro server (server/utils/db.ts) and by the migration/seed CLI (scripts/db.ts).
import pg from 'pg'
import { Sequelize } from 'sequelize'
import { initModels } from './models'

/** Opens a Sequelize instance on `url` with every model registered. */
export function createSequelize(url: string): Sequelize {
  // dialectModule: without it Nitro's tracer leaves `pg` out of the built server.
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: 20, min: 0, idle: 10_000, acquire: 10_000 },
  })
  initModels(sequelize)
  return sequelize
}
