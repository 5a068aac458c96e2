import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { otherOrganisation, workedClosedCase } from './helpers'

async function finished(client: ApiClient, jobId: string) {
  for (let i = 0; i < 120; i++) {
    const job = (await client.get(`/api/jobs/${jobId}`)).body
    if (job.state === 'done' || job.state === 'failed') return job
    await new Promise((r) => setTimeout(r, 250))
  }
  throw new Error('the accuracy job did not finish in 30 s')
}

describe('knowledge-base accuracy', () => {
  it('ranks every confirmed case with the published base in a background job: top-1 and top-3 by cause, class and month, with the misses', async () => {
    await workedClosedCase(await signedIn(DEMO.tech))
    const engineer = await signedIn(DEMO.engineer)
    const started = await engineer.post('/api/training/accuracy')
    expect(started.status).toBe(202)
    const job = await finished(engineer, started.body.jobId)
    expect(job).toMatchObject({ kind: 'kb-accuracy', state: 'done', progress: 1 })
    const result = job.result
    expect(result.overall.cases).toBeGreaterThan(5)
    expect(result.overall.top1).toBeLessThanOrEqual(result.overall.top3)
    expect(result.overall.top3).toBeLessThanOrEqual(result.overall.cases)
    const sum = (cells: { cases: number }[]) => cells.reduce((s, c) => s + c.cases, 0)
    expect(sum(result.byMonth)).toBe(result.overall.cases)
    expect(sum(result.byEquipmentClass)).toBe(result.overall.cases)
    expect(result.byCause.find((c: { key: string }) => c.key === 'refrigerant-leak').cases).toBeGreaterThan(0)
    expect(result.wrong.length).toBe(Math.min(50, result.overall.cases - result.overall.top1))
    // Every listed miss is a case of the organisation the engineer can open.
    for (const w of result.wrong.slice(0, 3)) expect((await engineer.get(`/api/cases/${w.caseId}`)).body.status).toBe('closed')
  })

  it('is for trainers, engineers and admins, each seeing only their organisation’s job', async () => {
    expect((await new ApiClient().post('/api/training/accuracy')).status).toBe(401)
    expect((await (await signedIn(DEMO.tech)).post('/api/training/accuracy')).status).toBe(403)
    for (const email of [DEMO.trainer, DEMO.admin]) expect((await (await signedIn(email)).post('/api/training/accuracy')).status, email).toBe(202)
    const ours = (await (await signedIn(DEMO.trainer)).post('/api/training/accuracy')).body.jobId
    expect((await (await otherOrganisation('trainer')).get(`/api/jobs/${ours}`)).status).toBe(404)
  })
})
