import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { openCase } from '../uploads/fixtures'

interface Job { id: string; kind: string; state: string; progress: number; result: unknown; error: string | null }

async function settled(client: ApiClient, id: string, timeoutMs = 20_000): Promise<Job> {
  const until = Date.now() + timeoutMs
  let last: Job | undefined
  while (Date.now() < until) {
    const res = await client.get<Job>(`/api/jobs/${id}`)
    expect(res.status).toBe(200)
    last = res.body
    if (last.state === 'done' || last.state === 'failed') return last
    await new Promise((resolve) => setTimeout(resolve, 200))
  }
  throw new Error(`job ${id} did not finish within ${timeoutMs} ms: ${JSON.stringify(last)}`)
}

describe('GET /api/jobs/{id}', () => {
  it('follows a report e-mail from queued to done, with its progress and result', async () => {
    // An engineer may send to any address (a technician only to the site's contacts and colleagues).
    const tech = await signedIn(DEMO.engineer)
    const { id } = await openCase(tech, 'Job check: report to the lab manager')
    const sent = await tech.post(`/api/cases/${id}/report/send`, { to: 'lab.manager@example.test' })
    expect(sent.status).toBe(202)
    expect(sent.body.jobIds).toHaveLength(1)
    const jobId = sent.body.jobIds[0] as string
    const first = await tech.get<Job>(`/api/jobs/${jobId}`)
    expect(first.body).toMatchObject({ id: jobId, kind: 'report-email', state: expect.stringMatching(/^(queued|running|done)$/) })
    expect(first.body.progress).toBeGreaterThanOrEqual(0)
    expect(first.body.progress).toBeLessThanOrEqual(1)

    const job = await settled(tech, jobId)
    expect(job).toMatchObject({ state: 'done', progress: 1, error: null, result: { messageId: expect.stringMatching(/^<.+>$/) } })
    const email = (await tech.get(`/api/cases/${id}`)).body.emails.find((e: { jobId: string }) => e.jobId === jobId)
    expect(email).toMatchObject({ toAddress: 'lab.manager@example.test', status: 'sent', attempts: 1 })
  })

  it('answers 404 to another organisation and for an id that names no job, 401 signed out', async () => {
    const tech = await signedIn(DEMO.engineer)
    const { id } = await openCase(tech, 'Job check: who may read it')
    const jobId = (await tech.post(`/api/cases/${id}/report/send`, { to: 'desk@example.test' })).body.jobIds[0] as string
    expect((await (await signedIn(DEMO.otherTech)).get(`/api/jobs/${jobId}`)).status).toBe(404)
    expect((await tech.get('/api/jobs/not-a-job')).status).toBe(404)
    expect((await tech.get('/api/jobs/00000000-0000-4000-8000-000000000000')).status).toBe(404)
    expect((await new ApiClient().get(`/api/jobs/${jobId}`)).status).toBe(401)
    // Any role of the organisation may follow its jobs.
    expect((await (await signedIn(DEMO.trainer)).get(`/api/jobs/${jobId}`)).status).toBe(200)
  })

  it('a refused delivery is recorded and retried; retrying by hand replaces the waiting retry with a new job', async () => {
    const tech = await signedIn(DEMO.engineer)
    const { id } = await openCase(tech, 'Job check: an address that cannot exist')
    // The local SMTP fake refuses every address under the reserved .invalid domain (RFC 2606).
    const sent = await tech.post(`/api/cases/${id}/report/send`, { to: 'nobody@nowhere.invalid' })
    const firstJob = sent.body.jobIds[0] as string
    const until = Date.now() + 20_000
    let email: { id: number; status: string; attempts: number; lastError: string | null; jobId: string } | undefined
    while (Date.now() < until) {
      email = (await tech.get(`/api/cases/${id}`)).body.emails.find((e: { jobId: string }) => e.jobId === firstJob)
      if (email?.status === 'failed') break
      await new Promise((resolve) => setTimeout(resolve, 200))
    }
    expect(email).toMatchObject({ status: 'failed', attempts: 1, lastError: expect.stringMatching(/No such mailbox/) })
    // Retries remain, so the job waits for its next try rather than failing for good.
    expect((await tech.get<Job>(`/api/jobs/${firstJob}`)).body).toMatchObject({ state: 'queued', error: expect.stringMatching(/No such mailbox/) })
    const timeline = (await tech.get(`/api/cases/${id}`)).body.events
    expect(timeline.find((e: { type: string }) => e.type === 'report-failed')).toMatchObject({ to: 'nobody@nowhere.invalid', willRetry: true })

    const retried = await tech.post(`/api/emails/${email!.id}/retry`)
    expect(retried.status).toBe(200)
    expect(retried.body).toMatchObject({ status: 'pending', jobId: expect.any(String) })
    expect(retried.body.jobId).not.toBe(firstJob)
    expect((await tech.get<Job>(`/api/jobs/${firstJob}`)).body).toMatchObject({ state: 'failed', error: 'Replaced by a retry started by hand' })
  })
})
