import { DataTypes, type QueryInterface } from 'sequelize'

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete: allowNull ? 'SET NULL' : 'CASCADE',
})
const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW }

// Exercises made from closed cases. `material` holds only what an allow-list copied from the case
// (no customer, site, contact or serial), so nothing personal is ever stored with an exercise.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('exercises', {
    id,
    organisation_id: ref('organisations'),
    case_id: ref('cases'),
    title: { type: DataTypes.STRING(200), allowNull: false },
    created_by: ref('users', true),
    start: { type: DataTypes.JSONB, allowNull: false },
    material: { type: DataTypes.JSONB, allowNull: false },
    created_at: now,
    updated_at: now,
  })
  await qi.addIndex('exercises', ['organisation_id', 'created_at'])
  await qi.createTable('exercise_assignments', {
    exercise_id: { ...ref('exercises'), primaryKey: true },
    user_id: { ...ref('users'), primaryKey: true },
    assigned_at: now,
  })
  await qi.addIndex('exercise_assignments', ['user_id'])
  await qi.createTable('exercise_attempts', {
    id,
    organisation_id: ref('organisations'),
    exercise_id: ref('exercises'),
    user_id: ref('users'),
    requests: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    answer: { type: DataTypes.JSONB, allowNull: true },
    score: { type: DataTypes.JSONB, allowNull: true },
    started_at: now,
    finished_at: { type: DataTypes.DATE, allowNull: true },
  })
  await qi.addIndex('exercise_attempts', ['exercise_id', 'user_id'])
  await qi.addIndex('exercise_attempts', ['organisation_id', 'started_at'])
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('exercise_attempts')
  await qi.dropTable('exercise_assignments')
  await qi.dropTable('exercises')
}
