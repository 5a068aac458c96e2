import { DataTypes, type QueryInterface } from 'sequelize'

// Authoring of the knowledge base in the app: versions go draft → in review → published and keep
// who submitted, reviewed and published them; every cause, test and finding of a draft carries a
// lock version so that two engineers' edits of one item never overwrite each other; findings carry
// their worked examples; every change is written to an audit log.
export async function up({ context: qi }: { context: QueryInterface }) {
  const user = { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' }
  await qi.addColumn('kb_versions', 'revision', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 })
  await qi.addColumn('kb_versions', 'based_on_id', { type: DataTypes.INTEGER, allowNull: true, references: { model: 'kb_versions', key: 'id' }, onDelete: 'SET NULL' })
  await qi.addColumn('kb_versions', 'submitted_by', user)
  await qi.addColumn('kb_versions', 'submitted_at', { type: DataTypes.DATE, allowNull: true })
  await qi.addColumn('kb_versions', 'reviewed_by', user)
  await qi.addColumn('kb_versions', 'reviewed_at', { type: DataTypes.DATE, allowNull: true })
  await qi.addColumn('kb_versions', 'review_comment', { type: DataTypes.TEXT, allowNull: true })
  await qi.addColumn('kb_versions', 'published_by', user)
  for (const table of ['kb_causes', 'kb_tests', 'kb_rules']) {
    await qi.addColumn(table, 'lock_version', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 })
  }
  await qi.addColumn('kb_rules', 'examples', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] })
  await qi.createTable('kb_audit_events', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' },
    version_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'kb_versions', key: 'id' }, onDelete: 'SET NULL' },
    user_id: user,
    at: { type: DataTypes.DATE, allowNull: false },
    action: { type: DataTypes.STRING(40), allowNull: false },
    item_kind: { type: DataTypes.STRING(20), allowNull: true },
    item_key: { type: DataTypes.STRING(120), allowNull: true },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
  })
  await qi.addIndex('kb_audit_events', ['organisation_id', 'at'])
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('kb_audit_events')
  await qi.removeColumn('kb_rules', 'examples')
  for (const table of ['kb_causes', 'kb_tests', 'kb_rules']) await qi.removeColumn(table, 'lock_version')
  for (const column of ['published_by', 'review_comment', 'reviewed_at', 'reviewed_by', 'submitted_at', 'submitted_by', 'based_on_id', 'revision']) {
    await qi.removeColumn('kb_versions', column)
  }
}
