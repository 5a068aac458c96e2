import { DataTypes, type QueryInterface } from 'sequelize'

// The nameplate history of a unit's stages: each refill with another refrigerant (or another charge)
// is a record of what the stage held before and after, when, by whom, on which basis, and in which case.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('nameplate_records', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' },
    unit_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'units', key: 'id' }, onDelete: 'CASCADE' },
    stage: { type: DataTypes.STRING(10), allowNull: false },
    refrigerant: { type: DataTypes.STRING(12), allowNull: false },
    charge_g: { type: DataTypes.DOUBLE, allowNull: true },
    previous_refrigerant: { type: DataTypes.STRING(12), allowNull: false },
    previous_charge_g: { type: DataTypes.DOUBLE, allowNull: true },
    basis: { type: DataTypes.STRING(20), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    case_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'cases', key: 'id' }, onDelete: 'SET NULL' },
    by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    at: { type: DataTypes.DATE, allowNull: false },
  })
  await qi.addIndex('nameplate_records', ['organisation_id', 'unit_id', 'at'])
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('nameplate_records')
}
