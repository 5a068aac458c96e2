import { DataTypes, type QueryInterface } from 'sequelize'
import PgBoss from 'pg-boss'

// Background work runs on pg-boss in this same database, so every app process (on any machine)
// takes jobs from one queue. pg-boss keeps its own tables in the "pgboss" schema; they are created
// here, like every other table, rather than by the app at start-up. Moving to a newer pg-boss
// takes a new migration with PgBoss.getMigrationPlans.
//
// background_jobs is Rimecase's own record of each job: whose organisation started it, its state
// and progress as people see them, and its result.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.sequelize.query(PgBoss.getConstructionPlans('pgboss'))
  await qi.createTable('background_jobs', {
    id: { type: DataTypes.UUID, primaryKey: true },
    organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.STRING(60), allowNull: false },
    state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'queued' },
    progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    result: { type: DataTypes.JSONB, allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
  })
  await qi.addIndex('background_jobs', ['organisation_id', 'created_at'])
  // A report e-mail remembers the job that delivers it, so the report page can follow it.
  await qi.addColumn('outbound_emails', 'job_id', { type: DataTypes.UUID, allowNull: true })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('outbound_emails', 'job_id')
  await qi.dropTable('background_jobs')
  await qi.sequelize.query('DROP SCHEMA IF EXISTS pgboss CASCADE')
}
