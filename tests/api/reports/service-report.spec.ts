import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { openCase } from '../uploads/fixtures'

let tech: ApiClient
let other: ApiClient
let caseId: number

beforeAll(async () => {
  tech = await signedIn(DEMO.tech)
  other = await signedIn(DEMO.otherTech)
  caseId = (await openCase(tech, 'Cabinet at -52 °C, should hold -80 °C')).id
  await tech.post(`/api/cases/${caseId}/readings`, { readings: [{ quantity: 'cabinetTemperature', value: -52, unit: 'C' }] })
})

describe('service report of a case', () => {
  it('returns the report model with its sections', async () => {
    const res = await tech.get(`/api/cases/${caseId}/report`)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ reference: `Case ${caseId}`, title: expect.stringContaining('Service report'), closedAt: null })
    const titles = res.body.sections.map((s: { title: string }) => s.title)
    expect(titles).toEqual(expect.arrayContaining(['Unit', 'Complaint', 'Readings as found', 'Repair and verification', 'Findings', 'Refrigerant transactions']))
    const readings = res.body.sections.find((s: { title: string }) => s.title === 'Readings as found')
    expect(readings.rows).toContainEqual(expect.objectContaining({ value: '−52 °C' }))
    expect(res.body.safetyNotes.length).toBeGreaterThan(0)
  })

  it('renders the same report as a PDF', async () => {
    const res = await tech.raw(`/api/cases/${caseId}/report.pdf`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toBe('application/pdf')
    expect(res.headers.get('content-disposition')).toMatch(new RegExp(`^inline; filename="rimecase-case-${caseId}-report\\.pdf"`))
    expect(Buffer.from(await res.arrayBuffer()).subarray(0, 4).toString()).toBe('%PDF')
  })

  it('is 404 for another organisation and 401 when signed out', async () => {
    expect((await other.get(`/api/cases/${caseId}/report`)).status).toBe(404)
    expect((await other.raw(`/api/cases/${caseId}/report.pdf`)).status).toBe(404)
    expect((await new ApiClient().get(`/api/cases/${caseId}/report`)).status).toBe(401)
    expect((await new ApiClient().raw(`/api/cases/${caseId}/report.pdf`)).status).toBe(401)
    expect((await tech.get('/api/cases/0/report')).status).toBe(400)
  })

  it('sends the report to a given address, and checks who may', async () => {
    // A technician sends to the site's contacts and colleagues only; an engineer to any address.
    expect((await tech.post(`/api/cases/${caseId}/report/send`, { to: 'lab.manager@example.test' })).status).toBe(403)
    const res = await (await signedIn(DEMO.engineer)).post(`/api/cases/${caseId}/report/send`, { to: 'lab.manager@example.test' })
    expect(res.status).toBe(202)
    expect(res.body.queued).toBe(1)
    expect(res.body.emails).toContainEqual(expect.objectContaining({ toAddress: 'lab.manager@example.test' }))
    const bad = await tech.post(`/api/cases/${caseId}/report/send`, { to: 'not an address' })
    expect(bad.status).toBe(400)
    expect(bad.body.data.fieldErrors.to).toBeDefined()
    expect((await tech.post(`/api/cases/${caseId}/report/send`, { cc: 'x@example.test' })).status).toBe(400)
    expect((await (await signedIn(DEMO.trainer)).post(`/api/cases/${caseId}/report/send`, {})).status).toBe(403)
    expect((await other.post(`/api/cases/${caseId}/report/send`, {})).status).toBe(404)
    expect((await new ApiClient().post(`/api/cases/${caseId}/report/send`, {})).status).toBe(401)
  })
})
