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
  await qi.createTable('organisations', {
    id,
    name: { type: DataTypes.STRING(200), allowNull: false },
    slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    ...timestamps,
  })
  await qi.createTable('users', {
    id,
    organisation_id: ref('organisations'),
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false },
    password_hash: { type: DataTypes.STRING(300), allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...timestamps,
  })
  await qi.addIndex('users', ['organisation_id'])
  await qi.createTable('customers', {
    id,
    organisation_id: ref('organisations'),
    name: { type: DataTypes.STRING(200), allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...timestamps,
  })
  await qi.addIndex('customers', ['organisation_id', 'name'], { unique: true })
  await qi.createTable('sites', {
    id,
    organisation_id: ref('organisations'),
    customer_id: ref('customers'),
    name: { type: DataTypes.STRING(200), allowNull: false },
    address: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    altitude_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    ...timestamps,
  })
  await qi.addIndex('sites', ['organisation_id'])
  await qi.createTable('contacts', {
    id,
    organisation_id: ref('organisations'),
    site_id: ref('sites'),
    name: { type: DataTypes.STRING(120), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    receives_reports: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...timestamps,
  })
  await qi.createTable('units', {
    id,
    organisation_id: ref('organisations'),
    site_id: ref('sites'),
    name: { type: DataTypes.STRING(200), allowNull: false },
    kind: { type: DataTypes.STRING(20), allowNull: false },
    equipment_class: { type: DataTypes.STRING(40), allowNull: false },
    model: { type: DataTypes.STRING(120), allowNull: false },
    serial: { type: DataTypes.STRING(120), allowNull: false },
    location: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    design_cabinet_c: { type: DataTypes.DOUBLE, allowNull: true },
    design_cascade_hx_c: { type: DataTypes.DOUBLE, allowNull: true },
    ...timestamps,
  })
  await qi.addIndex('units', ['organisation_id', 'serial'], { unique: true })
  await qi.createTable('unit_stages', {
    id,
    unit_id: ref('units'),
    stage: { type: DataTypes.STRING(10), allowNull: false },
    refrigerant: { type: DataTypes.STRING(12), allowNull: false },
    charge_g: { type: DataTypes.DOUBLE, allowNull: true },
    volume_l: { type: DataTypes.DOUBLE, allowNull: true },
    reference_standing_pressure_kpa: { type: DataTypes.DOUBLE, allowNull: true },
    reference_ambient_c: { type: DataTypes.DOUBLE, allowNull: true },
    rated_current_a: { type: DataTypes.DOUBLE, allowNull: true },
    ...timestamps,
  })
  await qi.addIndex('unit_stages', ['unit_id', 'stage'], { unique: true })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['unit_stages', 'units', 'contacts', 'sites', 'customers', 'users', 'organisations']) {
    await qi.dropTable(table)
  }
}
