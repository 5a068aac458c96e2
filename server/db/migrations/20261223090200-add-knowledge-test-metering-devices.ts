import { DataTypes, type QueryInterface } from 'sequelize'

// A test may need a metering device (a valve to check, a capillary to warm): it is not proposed on a
// stage the unit record says is fed by the other one. Nullable: most tests apply to any stage.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('kb_tests', 'metering_devices', { type: DataTypes.JSONB, allowNull: true })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('kb_tests', 'metering_devices')
}
