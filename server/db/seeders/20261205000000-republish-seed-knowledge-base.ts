// Publishes the knowledge base in content-src/ as a new version for every organisation whose
// published version no longer passes the current schema (a database seeded before findings carried
// likelihood tables). Ranking needs a valid published version; organisations whose published version
// is valid, such as every freshly seeded one, are left alone. Their old versions stay as history.
import type { QueryInterface } from 'sequelize'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { knowledgeBaseSourceSchema } from '#server/domain/diagnosis/knowledge-base'
import { findPublishedVersion, insertKnowledgeBaseVersion, loadVersionContent } from '../repositories/knowledge'
import { Organisation } from '../models'
import { CONTENT_DIR } from './20261202030200-import-knowledge-base'

export async function up({ context: qi }: { context: QueryInterface }) {
  const source = loadKnowledgeBaseFromDirectory(CONTENT_DIR)
  await qi.sequelize.transaction(async (transaction) => {
    for (const org of await Organisation.findAll({ transaction })) {
      const published = await findPublishedVersion(org.id)
      if (!published) continue
      const content = await loadVersionContent(published)
      if (knowledgeBaseSourceSchema.safeParse({ causes: content.causes, tests: content.tests, rules: content.rules }).success) continue
      await insertKnowledgeBaseVersion(org.id, source, { label: 'Seed base 2', status: 'published', notes: 'Imported from content-src: findings with likelihood tables' }, transaction)
    }
  })
}

export async function down() {
  // Knowledge-base versions are history; they are not removed by a seed rollback.
}
