import { DataTypes, type QueryInterface } from 'sequelize'

// Server-side sessions: the session cookie names a row here, and a session ends (sign-out,
// deactivation, password change) by marking the row, whatever copies of the cookie exist.
// Rate-limit counters shared by every app process (rate-limiter-flexible's PostgreSQL layout).
// E-mail addresses are unique within an organisation, so creating a user tells an admin nothing
// about the accounts of other organisations.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('user_sessions', {
    id: { type: DataTypes.UUID, primaryKey: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    ended_at: { type: DataTypes.DATE, allowNull: true },
    ended_because: { type: DataTypes.STRING(30), allowNull: true },
    user_agent: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
  })
  await qi.addIndex('user_sessions', ['user_id'], { where: { ended_at: null }, name: 'user_sessions_open_by_user' })
  await qi.sequelize.query(`CREATE TABLE rate_limits (key varchar(255) PRIMARY KEY, points integer NOT NULL DEFAULT 0, expire bigint)`)
  await qi.sequelize.query('ALTER TABLE users DROP CONSTRAINT IF EXISTS users_email_key')
  await qi.sequelize.query('CREATE UNIQUE INDEX users_organisation_email ON users (organisation_id, lower(email))')
  await qi.addIndex('users', ['email'], { name: 'users_email' })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('users', 'users_email')
  await qi.sequelize.query('DROP INDEX users_organisation_email')
  await qi.sequelize.query('ALTER TABLE users ADD CONSTRAINT users_email_key UNIQUE (email)')
  await qi.dropTable('rate_limits')
  await qi.dropTable('user_sessions')
}
