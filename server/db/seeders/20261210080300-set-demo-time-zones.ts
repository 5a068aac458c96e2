// Gives the demo organisations the time zones of their invented home towns, so reports and e-mails
// show local times rather than UTC.
import type { QueryInterface } from 'sequelize'
import { Organisation } from '../models'

const DEMO_TIME_ZONES: Record<string, string> = { 'rimecase-demo': 'Europe/Stockholm', 'bluefen-demo': 'Europe/London' }

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.sequelize.transaction(async (transaction) => {
    for (const [slug, timeZone] of Object.entries(DEMO_TIME_ZONES)) await Organisation.update({ timeZone }, { where: { slug, timeZone: 'UTC' }, transaction })
  })
}

export async function down() {
  // Nothing to undo: the time zone is a setting, kept when the demo is removed.
}
