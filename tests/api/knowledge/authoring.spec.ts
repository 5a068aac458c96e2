import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { Organisation } from '#server/db/models'
import { findPublishedVersion } from '#server/db/repositories/knowledge'
import { copyVersionAsDraft, publishVersionRow } from '#server/db/repositories/knowledge-drafts'
import { ApiClient, DEMO, signedIn } from '../helpers'

interface Version { id: number; status: string; basedOnId: number | null; reviewedBy: string | null; reviewComment: string | null; publishedBy: string | null; submittedBy: string | null; revision: number }
interface Finding { finding: any; examples: unknown[]; lockVersion: number }

const versions = async (c: ApiClient) => (await c.get<Version[]>('/api/knowledge-base/versions')).body
const publishedOf = async (c: ApiClient) => (await versions(c)).find((v) => v.status === 'published')!

describe('authoring a draft: edit, review by someone else, publish, roll back', () => {
  it('goes from a copy of the published version to published and back, with every step in the audit log', { timeout: 90_000 }, async () => {
    const engineer = await signedIn(DEMO.engineer)
    const admin = await signedIn(DEMO.admin)
    const original = await publishedOf(engineer)

    const created = await engineer.post<Version>('/api/knowledge-base/versions', { label: 'Tighter superheat bands' })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ status: 'draft', basedOnId: original.id })
    const draftId = created.body.id

    const content = (await engineer.get<{ findings: Finding[] }>(`/api/knowledge-base/versions/${draftId}/content`)).body
    const item = content.findings.find((f) => f.finding.name === 'pull-down-stalled')!
    expect(item.lockVersion).toBe(0)
    const name = item.finding.name as string
    const edited = structuredClone(item.finding)
    edited.event.params.likelihoods.other = 0.31
    const saved = await engineer.put(`/api/knowledge-base/versions/${draftId}/findings/${name}`, { lockVersion: 0, finding: edited, examples: [] })
    expect(saved.status, JSON.stringify(saved.body)).toBe(200)
    expect(saved.body).toEqual({ lockVersion: 1 })

    // Someone who opened the finding before that edit is refused, not silently overwritten.
    const stale = await admin.put(`/api/knowledge-base/versions/${draftId}/findings/${name}`, { lockVersion: 0, finding: item.finding, examples: [] })
    expect(stale.status).toBe(409)

    // An invalid finding is refused with the field named; nothing changes.
    const broken = structuredClone(edited)
    broken.event.params.likelihoods.healthy = 2
    const refused = await engineer.put(`/api/knowledge-base/versions/${draftId}/findings/${name}`, { lockVersion: 1, finding: broken, examples: [] })
    expect(refused.status).toBe(400)
    expect(Object.keys(refused.body.data.fieldErrors)).toContain('finding.event.params.likelihoods.healthy')
    const unknownFact = structuredClone(edited)
    unknownFact.conditions = { all: [{ fact: 'cabinetWarmth', operator: 'greaterThan', value: 3 }] }
    const refusedFact = await engineer.put(`/api/knowledge-base/versions/${draftId}/findings/${name}`, { lockVersion: 1, finding: unknownFact, examples: [] })
    expect(refusedFact.status).toBe(400)
    expect(refusedFact.body.data.fieldErrors['finding.conditions'].join()).toMatch(/unknown fact "cabinetWarmth"/)

    // Only engineers and admins edit.
    for (const who of [DEMO.tech, DEMO.trainer]) {
      expect((await (await signedIn(who)).put(`/api/knowledge-base/versions/${draftId}/findings/${name}`, { lockVersion: 1, finding: edited, examples: [] })).status).toBe(403)
    }

    const diff = (await engineer.get(`/api/knowledge-base/versions/${draftId}/diff`)).body
    expect(diff.against).toBe(original.id)
    expect(diff.items).toEqual([{ kind: 'finding', key: name, change: 'changed', fields: [{ path: 'event.params.likelihoods.other', before: item.finding.event.params.likelihoods.other, after: 0.31 }] }])
    expect(item.finding.event.params.likelihoods.other).not.toBe(0.31)

    // Worked examples are stored with the finding and checked, with the scenario suite, on demand.
    const examples = [{ title: 'Stalled pull-down', facts: { pulldownStalled: true }, expect: 'fires' }, { title: 'Nothing measured', facts: {}, expect: 'fires' }]
    expect((await engineer.put(`/api/knowledge-base/versions/${draftId}/findings/${name}`, { lockVersion: 1, finding: edited, examples })).body).toEqual({ lockVersion: 2 })
    const check = await engineer.post(`/api/knowledge-base/versions/${draftId}/check`)
    expect(check.status).toBe(200)
    expect(check.body.examples).toMatchObject({ total: 2, failed: [{ finding: name, title: 'Nothing measured', passed: false, problems: [expect.stringMatching(/lacks pulldownStalled/)] }] })
    expect(check.body.scenarios.total).toBeGreaterThan(90)
    expect(check.body.scenarios.top1).toBeGreaterThan(80)
    expect(check.body.passed).toBe(false)

    // Review: never by the author; a return needs comments and sends the draft back.
    expect((await engineer.post(`/api/knowledge-base/versions/${draftId}/submit`)).body).toMatchObject({ status: 'in-review', submittedBy: expect.any(String) })
    expect((await engineer.put(`/api/knowledge-base/versions/${draftId}/findings/${name}`, { lockVersion: 2, finding: edited, examples: [] })).status).toBe(422)
    expect((await engineer.post(`/api/knowledge-base/versions/${draftId}/review`, { decision: 'approve' })).status).toBe(403)
    expect((await engineer.post(`/api/knowledge-base/versions/${draftId}/publish`)).status).toBe(422)
    expect((await admin.post(`/api/knowledge-base/versions/${draftId}/review`, { decision: 'return' })).status).toBe(400)
    const returned = await admin.post<Version>(`/api/knowledge-base/versions/${draftId}/review`, { decision: 'return', comment: 'Say where 0.31 comes from.' })
    expect(returned.body).toMatchObject({ status: 'draft', reviewComment: 'Say where 0.31 comes from.' })
    await engineer.post(`/api/knowledge-base/versions/${draftId}/submit`)
    const approved = await admin.post<Version>(`/api/knowledge-base/versions/${draftId}/review`, { decision: 'approve', comment: 'Fine.' })
    expect(approved.body).toMatchObject({ status: 'in-review', reviewedBy: expect.any(String) })

    const published = await engineer.post<Version>(`/api/knowledge-base/versions/${draftId}/publish`)
    expect(published.status).toBe(200)
    expect(published.body).toMatchObject({ status: 'published', publishedBy: expect.any(String) })
    const after = await versions(engineer)
    expect(after.filter((v) => v.status === 'published').map((v) => v.id)).toEqual([draftId])
    expect(after.find((v) => v.id === original.id)!.status).toBe('retired')
    // Rankings record the version that made them.
    const unit = (await engineer.get('/api/units')).body[0]
    const opened = await engineer.post('/api/cases', { unitId: unit.id, complaint: 'Version check', symptoms: ['not-cooling'] })
    expect(opened.body.ranking.knowledgeBaseVersion).toMatchObject({ id: draftId, status: 'published' })

    // Rollback: the earlier version is published again; the draft is kept, retired.
    const rolledBack = await engineer.post<Version>(`/api/knowledge-base/versions/${original.id}/publish`)
    expect(rolledBack.body).toMatchObject({ id: original.id, status: 'published' })
    const finally_ = await versions(engineer)
    expect(finally_.find((v) => v.id === draftId)!.status).toBe('retired')
    expect((await engineer.post(`/api/knowledge-base/versions/${original.id}/publish`)).status).toBe(409)

    const audit = (await admin.get(`/api/knowledge-base/audit?versionId=${draftId}`)).body
    expect(audit.items.map((a: { action: string }) => a.action).reverse()).toEqual(['draft-created', 'finding-changed', 'finding-changed', 'submitted', 'returned', 'submitted', 'approved', 'published'])
    expect(audit.items.every((a: { by: string | null; at: string }) => a.by && a.at)).toBe(true)
    const all = (await engineer.get('/api/knowledge-base/audit')).body
    expect(all.items[0]).toMatchObject({ action: 'republished', versionId: original.id })
    expect((await (await signedIn(DEMO.tech)).get('/api/knowledge-base/audit')).status).toBe(403)
  })
})

describe('publishing in one transaction', () => {
  let sequelize: Sequelize
  beforeAll(() => {
    sequelize = createSequelize(process.env.DATABASE_URL!)
  })
  afterAll(() => sequelize.close())

  it('leaves the old version published when the transaction fails midway', async () => {
    const org = (await Organisation.findOne({ where: { slug: 'bluefen-demo' } }))!
    const before = (await findPublishedVersion(org.id))!
    const draftId = await sequelize.transaction((t) => copyVersionAsDraft(org.id, before.id, { label: 'atomic check', createdBy: null }, t))
    await expect(
      sequelize.transaction(async (t) => {
        await publishVersionRow(org.id, draftId, null, new Date(), t)
        // Inside the transaction the switch has happened...
        const [rows] = await sequelize.query(`SELECT id FROM kb_versions WHERE organisation_id = ${org.id} AND status = 'published'`, { transaction: t })
        expect((rows as { id: number }[]).map((r) => r.id)).toEqual([draftId])
        throw new Error('the disk filled up')
      }),
    ).rejects.toThrow('the disk filled up')
    // ...and after the failure nothing of it remains.
    expect((await findPublishedVersion(org.id))!.id).toBe(before.id)
    const [rows] = await sequelize.query(`SELECT status, published_at FROM kb_versions WHERE id = ${draftId}`)
    expect(rows).toEqual([{ status: 'draft', published_at: null }])
    const [stamps] = await sequelize.query(`SELECT published_kb_version_id AS id FROM organisation_cache_stamps WHERE organisation_id = ${org.id}`)
    expect((stamps as { id: number }[])[0]!.id).toBe(before.id)
  })
})
