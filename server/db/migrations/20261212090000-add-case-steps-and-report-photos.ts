import { DataTypes, type QueryInterface } from 'sequelize'

// Repair and verification steps of a case (pressure hold, evacuation, hot work, recharge) with the
// figures and verdict judged when each was recorded; and the photos picked for its report.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('cases', 'steps', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] })
  await qi.addColumn('cases', 'report_photo_ids', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('cases', 'report_photo_ids')
  await qi.removeColumn('cases', 'steps')
}
