import { DataTypes, type QueryInterface } from 'sequelize'

// The refrigerant log as records: cylinders the organisation fills and empties, transactions that may
// stand without a case (a top-up logged on its own) and say why refrigerant was added, leak checks,
// repairs and verification tests, the organisation's jurisdiction and each unit's appliance type.
// Data-logger files uploaded to a case, their analysis, and the column mapping remembered per logger model.
const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
}
const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete: allowNull ? 'SET NULL' : 'CASCADE',
})

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('organisations', 'jurisdiction', { type: DataTypes.STRING(40), allowNull: false, defaultValue: 'us-federal' })
  await qi.addColumn('organisations', 'leak_rate_method', { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'annualizing' })
  await qi.addColumn('units', 'appliance_type', { type: DataTypes.STRING(40), allowNull: false, defaultValue: 'other' })
  await qi.addColumn('units', 'hermetically_sealed', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false })
  await qi.addColumn('units', 'leak_detection_system', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false })

  await qi.createTable('cylinders', {
    id,
    organisation_id: ref('organisations'),
    label: { type: DataTypes.STRING(80), allowNull: false },
    refrigerant: { type: DataTypes.STRING(12), allowNull: true },
    purpose: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'recovery' },
    note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    ...timestamps,
  })
  // One record per label, whatever its case: "rc-07" and "RC-07" are the same cylinder.
  await qi.sequelize.query('CREATE UNIQUE INDEX cylinders_organisation_label ON cylinders (organisation_id, upper(label))')

  // A transaction may be logged on its own, without a case.
  await qi.sequelize.query('ALTER TABLE refrigerant_transactions ALTER COLUMN case_id DROP NOT NULL')
  await qi.addColumn('refrigerant_transactions', 'cylinder_id', ref('cylinders', true))
  await qi.addColumn('refrigerant_transactions', 'purpose', { type: DataTypes.STRING(20), allowNull: true })
  await qi.addColumn('refrigerant_transactions', 'note', { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' })
  await qi.addIndex('refrigerant_transactions', ['cylinder_id'])
  // Cylinders named by case closings before this migration become records.
  await qi.sequelize.query(`
    INSERT INTO cylinders (organisation_id, label, refrigerant, purpose)
    SELECT DISTINCT ON (organisation_id, upper(trim(cylinder))) organisation_id, trim(cylinder), refrigerant,
           CASE WHEN direction = 'recovered' THEN 'recovery' ELSE 'supply' END
    FROM refrigerant_transactions WHERE trim(cylinder) <> ''
    ORDER BY organisation_id, upper(trim(cylinder)), at`)
  await qi.sequelize.query(`
    UPDATE refrigerant_transactions t SET cylinder_id = c.id FROM cylinders c
    WHERE c.organisation_id = t.organisation_id AND upper(c.label) = upper(trim(t.cylinder))`)

  await qi.createTable('compliance_checks', {
    id,
    organisation_id: ref('organisations'),
    unit_id: ref('units'),
    case_id: ref('cases', true),
    stage: { type: DataTypes.STRING(10), allowNull: true },
    kind: { type: DataTypes.STRING(30), allowNull: false },
    passed: { type: DataTypes.BOOLEAN, allowNull: false },
    at: { type: DataTypes.DATE, allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    by_user_id: ref('users', true),
    ...timestamps,
  })
  await qi.addIndex('compliance_checks', ['unit_id', 'at'])

  await qi.createTable('logger_mappings', {
    id,
    organisation_id: ref('organisations'),
    logger_model: { type: DataTypes.STRING(120), allowNull: false },
    mapping: { type: DataTypes.JSONB, allowNull: false },
    updated_by: ref('users', true),
    ...timestamps,
  })
  await qi.sequelize.query('CREATE UNIQUE INDEX logger_mappings_organisation_model ON logger_mappings (organisation_id, upper(logger_model))')

  await qi.createTable('logger_files', {
    id,
    organisation_id: ref('organisations'),
    case_id: ref('cases'),
    original_name: { type: DataTypes.STRING(200), allowNull: false },
    bytes: { type: DataTypes.BIGINT, allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false },
    preview: { type: DataTypes.JSONB, allowNull: false },
    logger_model: { type: DataTypes.STRING(120), allowNull: true },
    mapping: { type: DataTypes.JSONB, allowNull: true },
    job_id: { type: DataTypes.UUID, allowNull: true },
    analysis: { type: DataTypes.JSONB, allowNull: true },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    uploaded_by: ref('users', true),
    ...timestamps,
  })
  await qi.addIndex('logger_files', ['case_id'])
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('logger_files')
  await qi.dropTable('logger_mappings')
  await qi.dropTable('compliance_checks')
  await qi.removeColumn('refrigerant_transactions', 'note')
  await qi.removeColumn('refrigerant_transactions', 'purpose')
  await qi.removeColumn('refrigerant_transactions', 'cylinder_id')
  await qi.dropTable('cylinders')
  for (const c of ['leak_detection_system', 'hermetically_sealed', 'appliance_type']) await qi.removeColumn('units', c)
  for (const c of ['leak_rate_method', 'jurisdiction']) await qi.removeColumn('organisations', c)
}
