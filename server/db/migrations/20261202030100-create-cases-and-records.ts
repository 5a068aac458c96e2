import { DataTypes, type QueryInterface } from 'sequelize'

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
  await qi.createTable('cases', {
    id,
    organisation_id: ref('organisations'),
    unit_id: ref('units'),
    technician_id: ref('users', true),
    status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'open' },
    complaint: { type: DataTypes.TEXT, allowNull: false },
    symptoms: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    readings: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    test_results: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ranking: { type: DataTypes.JSONB, allowNull: true },
    closure: { type: DataTypes.JSONB, allowNull: true },
    confirmed_causes: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    lock_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    opened_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    closed_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  })
  await qi.addIndex('cases', ['organisation_id', 'status', 'opened_at'])
  await qi.addIndex('cases', ['unit_id'])
  await qi.sequelize.query(`
    ALTER TABLE cases ADD COLUMN search tsvector
      GENERATED ALWAYS AS (to_tsvector('english', coalesce(complaint, '') || ' ' || coalesce(notes, ''))) STORED`)
  await qi.sequelize.query('CREATE INDEX cases_search_idx ON cases USING GIN (search)')

  await qi.createTable('case_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    case_id: ref('cases'),
    at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    type: { type: DataTypes.STRING(40), allowNull: false },
    by_user_id: ref('users', true),
    payload: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
  })
  await qi.addIndex('case_events', ['case_id', 'id'])
  // The timeline is append-only: the database itself refuses edits and deletions of events.
  await qi.sequelize.query(`
    CREATE FUNCTION case_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'case events are append-only'; END $$;`)
  await qi.sequelize.query(`
    CREATE TRIGGER case_events_no_change BEFORE UPDATE OR DELETE ON case_events
    FOR EACH ROW EXECUTE FUNCTION case_events_append_only();`)

  await qi.createTable('refrigerant_transactions', {
    id,
    organisation_id: ref('organisations'),
    case_id: ref('cases'),
    unit_id: ref('units'),
    stage: { type: DataTypes.STRING(10), allowNull: false },
    refrigerant: { type: DataTypes.STRING(12), allowNull: false },
    grams: { type: DataTypes.DOUBLE, allowNull: false },
    direction: { type: DataTypes.STRING(10), allowNull: false },
    cylinder: { type: DataTypes.STRING(80), allowNull: false, defaultValue: '' },
    at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    by_user_id: ref('users', true),
    ...timestamps,
  })
  await qi.addIndex('refrigerant_transactions', ['unit_id', 'at'])

  await qi.createTable('uploads', {
    id,
    organisation_id: ref('organisations'),
    case_id: ref('cases', true),
    unit_id: ref('units', true),
    purpose: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'photo' },
    mime: { type: DataTypes.STRING(60), allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    original_name: { type: DataTypes.STRING(200), allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false },
    thumb_key: { type: DataTypes.STRING(200), allowNull: true },
    uploaded_by: ref('users', true),
    ...timestamps,
  })
  await qi.addIndex('uploads', ['case_id'])
  await qi.addIndex('uploads', ['unit_id'])

  await qi.createTable('outbound_emails', {
    id,
    organisation_id: ref('organisations'),
    case_id: ref('cases', true),
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    message_id: { type: DataTypes.STRING(300), allowNull: true },
    next_attempt_at: { type: DataTypes.DATE, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  })
  await qi.addIndex('outbound_emails', ['status', 'next_attempt_at'])
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['outbound_emails', 'uploads', 'refrigerant_transactions', 'case_events']) await qi.dropTable(table)
  await qi.sequelize.query('DROP FUNCTION IF EXISTS case_events_append_only CASCADE')
  await qi.dropTable('cases')
}
