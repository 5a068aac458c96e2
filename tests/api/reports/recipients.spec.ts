// Who a service report may go to: the site's contacts and the organisation's people, whoever
// sends it; any other address only when an engineer or an admin sends it. A refused address is
// named in the answer, and nothing is queued for the others of the same request.
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { openCase } from '../uploads/fixtures'

let tech: ApiClient
let engineer: ApiClient
let admin: ApiClient
let caseId: number
let contact: string

const emailsOf = async (client: ApiClient) => ((await client.get(`/api/cases/${caseId}`)).body.emails as { toAddress: string }[]).length

beforeAll(async () => {
  tech = await signedIn(DEMO.tech)
  engineer = await signedIn(DEMO.engineer)
  admin = await signedIn(DEMO.admin)
  caseId = (await openCase(tech, 'Recipient checks: cabinet at -60 °C')).id
  const report = await tech.get(`/api/cases/${caseId}/report`)
  const recipients = report.body.recipients as { email: string; kind: string }[]
  contact = recipients.find((r) => r.kind === 'contact')!.email
})

describe('report recipients', () => {
  it('the preview lists the site contacts and the organisation people, not other organisations', async () => {
    const { recipients } = (await tech.get(`/api/cases/${caseId}/report`)).body as { recipients: { email: string; kind: string; preselected: boolean }[] }
    expect(recipients.some((r) => r.kind === 'contact')).toBe(true)
    const people = recipients.filter((r) => r.kind === 'colleague').map((r) => r.email)
    expect(people).toEqual(expect.arrayContaining([DEMO.engineer, DEMO.admin]))
    expect(people).not.toContain(DEMO.otherTech)
    expect(recipients.filter((r) => r.kind === 'colleague').every((r) => !r.preselected)).toBe(true)
  })

  it('a technician may send to the site contacts and colleagues, in any letter case', async () => {
    const res = await tech.post(`/api/cases/${caseId}/report/send`, { recipients: [contact.toUpperCase(), DEMO.engineer] })
    expect(res.status).toBe(202)
    expect(res.body.queued).toBe(2)
    expect((await tech.post(`/api/cases/${caseId}/report/send`, { to: contact })).status).toBe(202)
  })

  it('a technician may not send to any other address: 403 naming it, nothing queued', async () => {
    const before = await emailsOf(tech)
    const one = await tech.post(`/api/cases/${caseId}/report/send`, { to: 'outsider@example.test' })
    expect(one.status).toBe(403)
    expect(one.body.message).toContain('outsider@example.test')
    const mixed = await tech.post(`/api/cases/${caseId}/report/send`, { recipients: [contact, 'someone@elsewhere.example', 'Another@Elsewhere.example'] })
    expect(mixed.status).toBe(403)
    expect(mixed.body.message).toContain('someone@elsewhere.example')
    expect(mixed.body.message).toContain('another@elsewhere.example')
    expect(mixed.body.message).not.toContain(contact)
    expect(mixed.body.data.fieldErrors.recipients[0]).toContain('someone@elsewhere.example')
    // A person of another organisation is not a colleague.
    expect((await tech.post(`/api/cases/${caseId}/report/send`, { to: DEMO.otherTech })).status).toBe(403)
    expect(await emailsOf(tech)).toBe(before)
  })

  it('an engineer or an admin may add any address', async () => {
    const byEngineer = await engineer.post(`/api/cases/${caseId}/report/send`, { recipients: [contact, 'outsider@example.test'] })
    expect(byEngineer.status).toBe(202)
    expect(byEngineer.body.queued).toBe(2)
    const byAdmin = await admin.post(`/api/cases/${caseId}/report/send`, { to: 'auditor@example.test' })
    expect(byAdmin.status).toBe(202)
    expect(byAdmin.body.emails).toContainEqual(expect.objectContaining({ toAddress: 'auditor@example.test' }))
  })
})
