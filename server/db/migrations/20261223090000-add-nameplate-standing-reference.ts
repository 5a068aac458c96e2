import { DataTypes, type QueryInterface } from 'sequelize'

// A refill's record keeps, as figures, where the new fill stands at a stated ambient (planned in
// the substitution planner or measured): it is also the stage's reference standing pressure from then on.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('nameplate_records', 'standing_pressure_kpa', { type: DataTypes.DOUBLE, allowNull: true })
  await qi.addColumn('nameplate_records', 'ambient_c', { type: DataTypes.DOUBLE, allowNull: true })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('nameplate_records', 'ambient_c')
  await qi.removeColumn('nameplate_records', 'standing_pressure_kpa')
}
