import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn, type ApiResponse } from '../helpers'

interface Version { id: number; status: string; createdAt: string; createdBy: string | null; publishedAt: string | null; label: string }
interface Job { state: string; progress: number; result: any; error: string | null }

async function settled(client: ApiClient, id: string, timeoutMs = 60_000): Promise<Job> {
  const until = Date.now() + timeoutMs
  let last: Job | undefined
  while (Date.now() < until) {
    last = (await client.get<Job>(`/api/jobs/${id}`)).body
    if (last.state === 'done' || last.state === 'failed') return last
    await new Promise((resolve) => setTimeout(resolve, 250))
  }
  throw new Error(`job ${id} did not finish: ${JSON.stringify(last)}`)
}

const published = async (client: ApiClient) => (await client.get<Version[]>('/api/knowledge-base/versions')).body.find((v) => v.status === 'published')!

describe('knowledge-base versions and bundles', () => {
  it('lists the organisation\'s versions to engineers and admins only', async () => {
    expect((await new ApiClient().get('/api/knowledge-base/versions')).status).toBe(401)
    for (const who of [DEMO.tech, DEMO.trainer]) expect((await (await signedIn(who)).get('/api/knowledge-base/versions')).status).toBe(403)
    for (const who of [DEMO.engineer, DEMO.admin]) {
      const res = await (await signedIn(who)).get<Version[]>('/api/knowledge-base/versions')
      expect(res.status).toBe(200)
      const current = res.body.filter((v) => v.status === 'published')
      expect(current).toHaveLength(1)
      expect(current[0]).toMatchObject({ id: expect.any(Number), createdAt: expect.any(String), publishedAt: expect.any(String) })
      expect(res.body.every((v) => ['draft', 'in-review', 'published', 'retired'].includes(v.status))).toBe(true)
    }
  })

  it('exports a version as a bundle and imports it back as a new draft', async () => {
    const engineer = await signedIn(DEMO.engineer)
    const current = await published(engineer)
    const bundle = await engineer.get(`/api/knowledge-base/versions/${current.id}/bundle`)
    expect(bundle.status).toBe(200)
    expect(bundle.body).toMatchObject({ format: 'rimecase-knowledge-base', formatVersion: 1, exportedFrom: { versionId: current.id, status: 'published' } })
    expect(bundle.body.rules.length).toBeGreaterThan(10)

    const imported = await engineer.post('/api/knowledge-base/bundles', { ...bundle.body, label: 'Round trip copy' })
    expect(imported.status).toBe(201)
    expect(imported.body).toEqual({ id: expect.any(Number), status: 'draft' })
    const listed = (await engineer.get<Version[]>('/api/knowledge-base/versions')).body.find((v) => v.id === imported.body.id)
    expect(listed).toMatchObject({ status: 'draft', label: 'Round trip copy', createdBy: expect.any(String), publishedAt: null })
    // The copy exports to the same content.
    const again = (await engineer.get(`/api/knowledge-base/versions/${imported.body.id}/bundle`)).body
    expect({ causes: again.causes, tests: again.tests, rules: again.rules }).toEqual({ causes: bundle.body.causes, tests: bundle.body.tests, rules: bundle.body.rules })
  })

  it('refuses a malformed bundle with field errors and creates nothing', async () => {
    const engineer = await signedIn(DEMO.engineer)
    const current = await published(engineer)
    const bundle = (await engineer.get(`/api/knowledge-base/versions/${current.id}/bundle`)).body
    const before = (await engineer.get<Version[]>('/api/knowledge-base/versions')).body.length
    const broken = structuredClone(bundle)
    broken.rules[0].event.params.likelihoods.healthy = 7
    broken.rules[1].conditions = { all: [{ fact: 'no.such.fact', operator: 'equal', value: true }] }
    const refused: ApiResponse<any> = await engineer.post('/api/knowledge-base/bundles', broken)
    expect(refused.status).toBe(400)
    const fields = Object.keys(refused.body.data.fieldErrors)
    expect(fields).toContain('rules.0.event.params.likelihoods.healthy')
    expect(fields.some((f) => f.startsWith('rules.1.conditions'))).toBe(true)
    for (const body of [{}, { ...bundle, format: 'another' }, 'not json at all', { ...bundle, causes: bundle.causes.slice(1) }]) {
      // Text that is not JSON is sent as JSON: text of another type is refused by its type (415).
      const res = typeof body === 'string'
        ? await engineer.request('POST', '/api/knowledge-base/bundles', body, { headers: { 'content-type': 'application/json' } })
        : await engineer.post('/api/knowledge-base/bundles', body)
      expect(res.status, JSON.stringify(res.body).slice(0, 200)).toBe(400)
      expect(res.body.data.fieldErrors).toBeTruthy()
    }
    expect((await engineer.get<Version[]>('/api/knowledge-base/versions')).body.length).toBe(before)
    expect((await (await signedIn(DEMO.tech)).post('/api/knowledge-base/bundles', bundle)).status).toBe(403)
  })

  it('answers 404 for a version that is not the organisation\'s', async () => {
    const engineer = await signedIn(DEMO.engineer)
    expect((await engineer.get('/api/knowledge-base/versions/999999/bundle')).status).toBe(404)
    expect((await engineer.post('/api/knowledge-base/versions/999999/impact')).status).toBe(404)
    expect((await engineer.get('/api/knowledge-base/versions/abc/bundle')).status).toBe(400)
  })
})

describe('impact of a version on past cases', () => {
  it('gives a re-imported copy of the published version exactly the published figures', async () => {
    const engineer = await signedIn(DEMO.engineer)
    const current = await published(engineer)
    const bundle = (await engineer.get(`/api/knowledge-base/versions/${current.id}/bundle`)).body
    const copy = (await engineer.post('/api/knowledge-base/bundles', { ...bundle, label: 'Copy for impact' })).body.id as number
    const started = await engineer.post(`/api/knowledge-base/versions/${copy}/impact`)
    expect(started.status).toBe(202)
    expect(started.body).toEqual({ jobId: expect.any(String) })
    const job = await settled(engineer, started.body.jobId)
    expect(job.state, job.error ?? '').toBe('done')
    expect(job.progress).toBe(1)
    const result = job.result
    // The demo history has closed cases with confirmed causes.
    expect(result.cases).toBeGreaterThan(10)
    expect(result.candidate).toEqual(result.published)
    expect(result.changedFirst).toEqual([])
    expect(result.candidate.top1).toBeGreaterThanOrEqual(0)
    expect(result.candidate.top3).toBeGreaterThanOrEqual(result.candidate.top1)
    expect(result.candidate.top3).toBeLessThanOrEqual(1)
    expect(result.confusion.reduce((n: number, r: { cases: number }) => n + r.cases, 0)).toBeGreaterThanOrEqual(result.cases)
    // Only engineers and admins start it.
    expect((await (await signedIn(DEMO.trainer)).post(`/api/knowledge-base/versions/${copy}/impact`)).status).toBe(403)
  })
})
