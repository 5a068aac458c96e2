// Imports the knowledge base kept in content-src/ as the published version of every organisation
// that has none yet. The content is validated first; a broken file stops the seed with its name.
import { fileURLToPath } from 'node:url'
import type { QueryInterface } from 'sequelize'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { hasAnyVersion, insertKnowledgeBaseVersion } from '../repositories/knowledge'
import { Organisation } from '../models'

export const CONTENT_DIR = fileURLToPath(new URL('../../../content-src', import.meta.url))

export async function up({ context: qi }: { context: QueryInterface }) {
  const source = loadKnowledgeBaseFromDirectory(CONTENT_DIR)
  await qi.sequelize.transaction(async (transaction) => {
    for (const org of await Organisation.findAll({ transaction })) {
      if (await hasAnyVersion(org.id, transaction)) continue
      await insertKnowledgeBaseVersion(org.id, source, { label: 'Seed base 1', status: 'published', notes: 'Imported from content-src' }, transaction)
    }
  })
}

export async function down() {
  // Knowledge-base versions are history; they are not removed by a seed rollback.
}
