import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { Organisation } from '#server/db/models'
import { findPublishedVersion, insertKnowledgeBaseVersion, loadVersionContent } from '#server/db/repositories/knowledge'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { knowledgeBaseSourceSchema } from '#server/domain/diagnosis/knowledge-base'
import { CONTENT_DIR } from '#server/db/seeders/20261202030200-import-knowledge-base'

describe('knowledge-base import into PostgreSQL', () => {
  let sequelize: Sequelize
  beforeAll(() => {
    sequelize = createSequelize(process.env.DATABASE_URL!)
  })
  afterAll(() => sequelize.close())

  it('stores content-src as a draft, reads it back identical and valid, and leaves the published version alone', async () => {
    const org = (await Organisation.findOne({ where: { slug: 'bluefen-demo' } }))!
    const published = await findPublishedVersion(org.id)
    const source = loadKnowledgeBaseFromDirectory(CONTENT_DIR)
    const draft = await sequelize.transaction((t) => insertKnowledgeBaseVersion(org.id, source, { label: 'test draft', status: 'draft' }, t))
    expect(draft.status).toBe('draft')
    expect((await findPublishedVersion(org.id))!.id).toBe(published!.id)
    const back = await loadVersionContent(draft)
    expect(back.rules).toEqual(source.rules)
    expect(back.tests).toEqual(source.tests)
    expect(() => knowledgeBaseSourceSchema.parse({ causes: back.causes, tests: back.tests, rules: back.rules })).not.toThrow()
    expect(source.rules.length).toBeGreaterThanOrEqual(35)
  })

  it('keeps one published version per organisation: publishing retires the previous one', async () => {
    const org = (await Organisation.findOne({ where: { slug: 'bluefen-demo' } }))!
    const before = (await findPublishedVersion(org.id))!
    const source = loadKnowledgeBaseFromDirectory(CONTENT_DIR)
    const next = await sequelize.transaction((t) => insertKnowledgeBaseVersion(org.id, source, { label: 'test publish', status: 'published' }, t))
    const now = (await findPublishedVersion(org.id))!
    expect(now.id).toBe(next.id)
    expect(now.id).not.toBe(before.id)
    const [rows] = await sequelize.query(`SELECT count(*)::int AS n FROM kb_versions WHERE organisation_id = ${org.id} AND status = 'published'`)
    expect((rows as { n: number }[])[0]!.n).toBe(1)
  })
})
