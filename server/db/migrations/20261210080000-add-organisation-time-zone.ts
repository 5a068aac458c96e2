import { DataTypes, type QueryInterface } from 'sequelize'

// Reports and e-mails give times in the organisation's own time zone (an IANA name such as
// "Europe/Stockholm"); screens use each person's.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('organisations', 'time_zone', { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('organisations', 'time_zone')
}
