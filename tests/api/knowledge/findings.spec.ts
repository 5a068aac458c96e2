import { describe, expect, it } from 'vitest'
import { DEMO, signedIn, type ApiClient } from '../helpers'

interface Finding { finding: { name: string }; examples: unknown[]; lockVersion: number }

/** What the draft editor's "New finding" sends: one condition, the same likelihood for every cause. */
const newFinding = (name: string) => ({
  name,
  subject: 'New finding',
  conditions: { all: [{ fact: 'pulldownStalled', operator: 'equal', value: true }] },
  event: { type: 'finding', params: { group: name, likelihoods: { healthy: 0.5, default: 0.5, other: 0.5 }, because: 'Say in words what was found.' } },
})
const findingsOf = async (c: ApiClient, id: number) => (await c.get<{ findings: Finding[] }>(`/api/knowledge-base/versions/${id}/content`)).body.findings

describe('adding and deleting findings and examples in a draft', () => {
  it('adds a finding checked by the finding schema, refuses a bad or taken name, and deletes it under its lock version', { timeout: 60_000 }, async () => {
    const engineer = await signedIn(DEMO.engineer)
    const draft = (await engineer.post<{ id: number }>('/api/knowledge-base/versions', { label: 'New and deleted findings' })).body
    const before = (await findingsOf(engineer, draft.id)).length

    const added = await engineer.post(`/api/knowledge-base/versions/${draft.id}/findings`, { finding: newFinding('door-left-ajar'), examples: [] })
    expect(added.status, JSON.stringify(added.body)).toBe(201)
    expect(added.body).toEqual({ lockVersion: 0 })
    expect((await findingsOf(engineer, draft.id)).map((f) => f.finding.name)).toContain('door-left-ajar')

    // A name that is not lower-case words, and a name already used, are refused at the field; nothing is added.
    const badName = await engineer.post(`/api/knowledge-base/versions/${draft.id}/findings`, { finding: newFinding('Door Ajar'), examples: [] })
    expect(badName.status).toBe(400)
    expect(badName.body.data.fieldErrors['finding.name'].join()).toMatch(/lower-case words joined by hyphens/)
    const taken = await engineer.post(`/api/knowledge-base/versions/${draft.id}/findings`, { finding: newFinding('door-left-ajar'), examples: [] })
    expect([400, 409, 422]).toContain(taken.status)
    expect((await findingsOf(engineer, draft.id)).length).toBe(before + 1)

    // An example without a title is refused with the example's field named.
    const badExample = await engineer.put(`/api/knowledge-base/versions/${draft.id}/findings/door-left-ajar`, {
      lockVersion: 0, finding: newFinding('door-left-ajar'), examples: [{ title: '', facts: { pulldownStalled: true }, expect: 'fires' }],
    })
    expect(badExample.status).toBe(400)
    expect(Object.keys(badExample.body.data.fieldErrors)).toContain('examples.0.title')
    // The editor's live check answers the same.
    const checked = await engineer.post('/api/knowledge-base/findings/validate', { finding: newFinding('door-left-ajar'), examples: [{ title: 'x', facts: {}, expect: 'sometimes' }] })
    expect(checked.status).toBe(400)
    expect(Object.keys(checked.body.data.fieldErrors)).toContain('examples.0.expect')

    // Two examples added, then one deleted: the finding keeps the other.
    const two = [
      { title: 'Stalled pull-down', facts: { pulldownStalled: true }, expect: 'fires' },
      { title: 'Pull-down on its way', facts: { pulldownStalled: false }, expect: 'does-not-fire' },
    ]
    expect((await engineer.put(`/api/knowledge-base/versions/${draft.id}/findings/door-left-ajar`, { lockVersion: 0, finding: newFinding('door-left-ajar'), examples: two })).body).toEqual({ lockVersion: 1 })
    expect((await engineer.put(`/api/knowledge-base/versions/${draft.id}/findings/door-left-ajar`, { lockVersion: 1, finding: newFinding('door-left-ajar'), examples: two.slice(1) })).body).toEqual({ lockVersion: 2 })
    const kept = (await findingsOf(engineer, draft.id)).find((f) => f.finding.name === 'door-left-ajar')!
    expect(kept.examples).toEqual([two[1]])

    // A technician may not delete; a stale lock version is a conflict; then the delete goes through.
    const tech = await signedIn(DEMO.tech)
    expect((await tech.request('DELETE', `/api/knowledge-base/versions/${draft.id}/findings/door-left-ajar?lockVersion=2`)).status).toBe(403)
    expect((await engineer.request('DELETE', `/api/knowledge-base/versions/${draft.id}/findings/door-left-ajar?lockVersion=1`)).status).toBe(409)
    expect((await engineer.request('DELETE', `/api/knowledge-base/versions/${draft.id}/findings/door-left-ajar?lockVersion=2`)).status).toBe(204)
    expect((await findingsOf(engineer, draft.id)).map((f) => f.finding.name)).not.toContain('door-left-ajar')
    expect((await engineer.request('DELETE', `/api/knowledge-base/versions/${draft.id}/findings/door-left-ajar?lockVersion=2`)).status).toBe(404)

    const audit = (await engineer.get<{ items: { action: string; itemKey: string | null }[] }>(`/api/knowledge-base/audit?versionId=${draft.id}`)).body.items
    expect(audit.filter((a) => a.itemKey === 'door-left-ajar').map((a) => a.action)).toEqual(['finding-removed', 'finding-changed', 'finding-changed', 'finding-added'])
  })
})
