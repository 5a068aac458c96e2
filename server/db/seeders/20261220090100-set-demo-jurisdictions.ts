// Gives the demo organisations the jurisdictions of their invented home towns, so the refrigerant
// log and the list of duties due show the leak-check rules that apply there.
import type { QueryInterface } from 'sequelize'

const DEMO_JURISDICTIONS: Record<string, string> = { 'rimecase-demo': 'eu', 'bluefen-demo': 'gb' }

export async function up({ context: qi }: { context: QueryInterface }) {
  for (const [slug, jurisdiction] of Object.entries(DEMO_JURISDICTIONS)) {
    await qi.sequelize.query("UPDATE organisations SET jurisdiction = $1 WHERE slug = $2 AND jurisdiction = 'us-federal'", { bind: [jurisdiction, slug] })
  }
}

export async function down() {
  // Nothing to undo: the jurisdiction is a setting, kept when the demo is removed.
}
