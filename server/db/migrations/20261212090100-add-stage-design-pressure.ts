import { DataTypes, type QueryInterface } from 'sequelize'

// A stage's design pressure from its nameplate (kPa absolute): what standing, test and running
// pressures are compared against.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('unit_stages', 'design_pressure_kpa', { type: DataTypes.DOUBLE, allowNull: true })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('unit_stages', 'design_pressure_kpa')
}
