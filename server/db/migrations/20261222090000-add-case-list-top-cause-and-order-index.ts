import type { QueryInterface } from 'sequelize'

// The case list shows each case's most likely cause, not its whole ranking: a stored column kept by
// PostgreSQL itself from the ranking (every write of the ranking updates it), so a page of 100 rows
// never reads 100 rankings. And an index in the list's own order (organisation, open ones first,
// newest first), so a page is read straight from it.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.sequelize.query(`ALTER TABLE cases ADD COLUMN top_cause jsonb GENERATED ALWAYS AS (ranking #> '{causes,0}') STORED`)
  await qi.sequelize.query(`CREATE INDEX cases_list_order ON cases (organisation_id, (status <> 'open'), opened_at DESC)`)
  await qi.sequelize.query('CREATE INDEX cases_technician_id ON cases (technician_id)')
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.sequelize.query('DROP INDEX IF EXISTS cases_technician_id')
  await qi.sequelize.query('DROP INDEX IF EXISTS cases_list_order')
  await qi.sequelize.query('ALTER TABLE cases DROP COLUMN IF EXISTS top_cause')
}
