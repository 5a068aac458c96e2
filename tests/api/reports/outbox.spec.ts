import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { closeCase, openCase } from '../uploads/fixtures'

interface Summary {
  id: string
  subject: string
  to: string
  attachments: { index: number; filename: string; contentType: string; size: number; url: string }[]
}

// Delivery runs in the background after closing; wait for it, but not for ever.
async function waitForMessage(admin: ApiClient, subjectPart: string, timeoutMs = 15_000): Promise<Summary> {
  const until = Date.now() + timeoutMs
  let seen: string[] = []
  while (Date.now() < until) {
    const list = await admin.get<{ items: Summary[] }>(`/api/outbox?q=${encodeURIComponent(subjectPart)}`)
    const found = list.body.items.find((m) => m.subject.includes(subjectPart))
    if (found) return found
    seen = list.body.items.map((m) => m.subject)
    await new Promise((resolve) => setTimeout(resolve, 250))
  }
  throw new Error(`no message with "${subjectPart}" in the outbox after ${timeoutMs} ms; it holds: ${JSON.stringify(seen)}`)
}

describe('report e-mail and the outbox', () => {
  it('closing a case e-mails the report PDF to the site contacts, seen in the admin outbox', async () => {
    const tech = await signedIn(DEMO.tech)
    const { id } = await openCase(tech, 'Compressor short-cycling, cabinet drifting warm')
    await closeCase(tech, id)

    const admin = await signedIn(DEMO.admin)
    const message = await waitForMessage(admin, `(case ${id})`).catch(async (error: Error) => {
      throw new Error(`${error.message}; the case's e-mails: ${JSON.stringify((await tech.get(`/api/cases/${id}`)).body.emails)}`)
    })
    expect(message.attachments).toEqual([
      expect.objectContaining({ filename: `rimecase-case-${id}-report.pdf`, contentType: 'application/pdf', size: expect.any(Number) }),
    ])

    const full = await admin.get(`/api/outbox/${encodeURIComponent(message.id)}`)
    expect(full.status).toBe(200)
    expect(full.body.text).toContain(`Case ${id}`)
    const pdf = await admin.raw(message.attachments[0]!.url)
    expect(pdf.status).toBe(200)
    expect(pdf.headers.get('content-type')).toBe('application/pdf')
    expect(pdf.headers.get('content-disposition')).toMatch(/^attachment;/)
    expect(Buffer.from(await pdf.arrayBuffer()).subarray(0, 4).toString()).toBe('%PDF')

    const record = (await tech.get(`/api/cases/${id}`)).body
    expect(record.emails.length).toBeGreaterThan(0)
    expect(record.emails.every((e: { status: string }) => e.status === 'sent')).toBe(true)
    const retry = await tech.post(`/api/emails/${record.emails[0].id}/retry`)
    expect(retry.status).toBe(409)
  })

  it('pages and searches on the server: subject, addresses and attachment names, newest first', async () => {
    const tech = await signedIn(DEMO.tech)
    const first = await openCase(tech, 'Outbox paging check one')
    await closeCase(tech, first.id)
    const second = await openCase(tech, 'Outbox paging check two')
    await closeCase(tech, second.id)
    const admin = await signedIn(DEMO.admin)
    await waitForMessage(admin, `(case ${first.id})`)
    await waitForMessage(admin, `(case ${second.id})`)

    const all = (await admin.get('/api/outbox?pageSize=100')).body as { items: Summary[]; total: number; page: number; pageSize: number }
    expect(all).toMatchObject({ page: 1, pageSize: 100 })
    expect(all.total).toBeGreaterThanOrEqual(2)
    const onePerPage = (await admin.get('/api/outbox?pageSize=1&page=2')).body as { items: Summary[]; total: number }
    expect(onePerPage.total).toBe(all.total)
    expect(onePerPage.items.map((m) => m.id)).toEqual([all.items[1]!.id])

    const byAttachment = (await admin.get(`/api/outbox?q=${encodeURIComponent(`rimecase-case-${first.id}-report.pdf`)}`)).body as { items: Summary[]; total: number }
    expect(byAttachment.total).toBeGreaterThan(0)
    expect(byAttachment.items.every((m) => m.subject.includes(`(case ${first.id})`))).toBe(true)
    // Every word must appear: this case's number and a word no message holds find nothing.
    expect((await admin.get(`/api/outbox?q=${encodeURIComponent(`case ${first.id} zzqx-none`)}`)).body.total).toBe(0)
    expect((await admin.get('/api/outbox?page=0')).status).toBe(400)
    expect((await admin.get('/api/outbox?pageSize=1000')).status).toBe(400)
  })

  it('is for admins only and opens nothing outside the outbox folder', async () => {
    expect((await (await signedIn(DEMO.tech)).get('/api/outbox')).status).toBe(403)
    expect((await (await signedIn(DEMO.engineer)).get('/api/outbox')).status).toBe(403)
    expect((await new ApiClient().get('/api/outbox')).status).toBe(401)
    const admin = await signedIn(DEMO.admin)
    expect((await admin.get('/api/outbox/..%2F..%2Fetc%2Fpasswd')).status).toBe(400)
    expect((await admin.get('/api/outbox/passwd')).status).toBe(400)
    expect((await admin.get('/api/outbox/not-there.eml')).status).toBe(404)
    expect((await admin.get('/api/outbox/not-there.eml/attachments/0')).status).toBe(404)
    expect((await admin.get('/api/outbox/not-there.eml/attachments/-1')).status).toBe(400)
  })

  it('retries an e-mail only of the organisation', async () => {
    const other = await signedIn(DEMO.otherTech)
    expect((await other.post('/api/emails/1/retry')).status).toBe(404)
    expect((await (await signedIn(DEMO.tech)).post('/api/emails/999999/retry')).status).toBe(404)
    expect((await (await signedIn(DEMO.trainer)).post('/api/emails/1/retry')).status).toBe(403)
  })
})
