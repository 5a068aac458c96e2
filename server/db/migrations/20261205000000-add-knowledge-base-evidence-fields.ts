import { DataTypes, type QueryInterface } from 'sequelize'

// Causes gain the short name next-test values are written with; tests gain the reading that answers
// them and the findings that read the same measurement. All nullable: older versions lack them.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('kb_causes', 'short', { type: DataTypes.STRING(120), allowNull: true })
  await qi.addColumn('kb_tests', 'answered_by', { type: DataTypes.STRING(40), allowNull: true })
  await qi.addColumn('kb_tests', 'same_measurement_as', { type: DataTypes.JSONB, allowNull: true })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('kb_tests', 'same_measurement_as')
  await qi.removeColumn('kb_tests', 'answered_by')
  await qi.removeColumn('kb_causes', 'short')
}
