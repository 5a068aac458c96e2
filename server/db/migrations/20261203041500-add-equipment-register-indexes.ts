import type { QueryInterface } from 'sequelize'

// The register and customer pages join units to sites and sites to customers and contacts on every
// request; these foreign keys had no index of their own.
const INDEXES: [string, string[], string][] = [
  ['sites', ['customer_id'], 'sites_customer_id'],
  ['contacts', ['site_id'], 'contacts_site_id'],
  ['units', ['site_id'], 'units_site_id'],
]

export async function up({ context: qi }: { context: QueryInterface }) {
  for (const [table, fields, name] of INDEXES) await qi.addIndex(table, fields, { name })
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const [table, , name] of INDEXES) await qi.removeIndex(table, name)
}
