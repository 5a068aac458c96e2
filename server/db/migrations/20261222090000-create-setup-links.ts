import { DataTypes, type QueryInterface } from 'sequelize'

// One-time set-up links: a deployment without an administrator gets a link (printed by `npm start`)
// through which the first administrator chooses their name, e-mail and password. Only a hash of the
// link's secret is kept; a link expires, and works once.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('setup_links', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
  })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('setup_links')
}
