import { DataTypes, type QueryInterface } from 'sequelize'

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
}
const version = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'kb_versions', key: 'id' }, onDelete: 'CASCADE' }

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('kb_versions', {
    id,
    organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' },
    label: { type: DataTypes.STRING(120), allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    published_at: { type: DataTypes.DATE, allowNull: true },
    created_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    ...timestamps,
  })
  // One published version per organisation at a time.
  await qi.addIndex('kb_versions', ['organisation_id'], { unique: true, where: { status: 'published' }, name: 'kb_versions_one_published' })
  await qi.createTable('kb_causes', {
    id,
    version_id: version,
    slug: { type: DataTypes.STRING(60), allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false },
    stages: { type: DataTypes.JSONB, allowNull: false },
    priors: { type: DataTypes.JSONB, allowNull: false },
    ...timestamps,
  })
  await qi.addIndex('kb_causes', ['version_id', 'slug'], { unique: true })
  await qi.createTable('kb_tests', {
    id,
    version_id: version,
    slug: { type: DataTypes.STRING(60), allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    procedure: { type: DataTypes.TEXT, allowNull: false },
    minutes: { type: DataTypes.DOUBLE, allowNull: false },
    opens_system: { type: DataTypes.BOOLEAN, allowNull: false },
    hot_work: { type: DataTypes.BOOLEAN, allowNull: false },
    stages: { type: DataTypes.JSONB, allowNull: false },
    safety_notes: { type: DataTypes.JSONB, allowNull: false },
    outcomes: { type: DataTypes.JSONB, allowNull: false },
    ...timestamps,
  })
  await qi.addIndex('kb_tests', ['version_id', 'slug'], { unique: true })
  await qi.createTable('kb_rules', {
    id,
    version_id: version,
    name: { type: DataTypes.STRING(120), allowNull: false },
    subject: { type: DataTypes.STRING(80), allowNull: false },
    definition: { type: DataTypes.JSONB, allowNull: false },
    ...timestamps,
  })
  await qi.addIndex('kb_rules', ['version_id', 'name'], { unique: true })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['kb_rules', 'kb_tests', 'kb_causes', 'kb_versions']) await qi.dropTable(table)
}
