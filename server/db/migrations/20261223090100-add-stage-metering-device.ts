import { DataTypes, type QueryInterface } from 'sequelize'

// How a stage is fed: a capillary tube or an expansion valve, when the nameplate or the technician
// says. The diagnosis then leaves out the faults and tests of the other device.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('unit_stages', 'metering_device', { type: DataTypes.STRING(20), allowNull: true })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('unit_stages', 'metering_device')
}
