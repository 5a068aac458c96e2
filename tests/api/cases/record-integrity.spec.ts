// A case record a customer and a regulator can trust: impossible readings refused, readings far
// outside the design envelope kept only when confirmed, corrections as their own events, repair
// steps judged from their figures, and a report that shows all of it.
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs'
import { beforeAll, describe, expect, it } from 'vitest'
import { DEMO, signedIn, type ApiClient } from '../helpers'
import { fileForm, samplePng } from '../uploads/fixtures'

let tech: ApiClient
let caseId: number

async function cascadeUnitWith(client: ApiClient, refrigerant: string) {
  const units = (await client.get('/api/units')).body as { id: number; kind: string; stages: { stage: string; refrigerant: string }[] }[]
  return units.find((u) => u.kind === 'cascade' && u.stages.some((s) => s.stage === 'low' && s.refrigerant === refrigerant))!
}

async function pdfText(bytes: ArrayBuffer): Promise<string> {
  const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, disableFontFace: true, isEvalSupported: false }).promise
  const pages: string[] = []
  for (let n = 1; n <= doc.numPages; n++) pages.push((await (await doc.getPage(n)).getTextContent()).items.map((i) => ('str' in i ? i.str : '')).join(' '))
  return pages.join('\n')
}

beforeAll(async () => {
  tech = await signedIn(DEMO.tech)
  const unit = await cascadeUnitWith(tech, 'R170')
  const opened = await tech.post('/api/cases', { unitId: unit.id, complaint: 'Cabinet at -35 °C; line-tap valve on the low stage', symptoms: ['not-cooling', 'line-tap-valve-present'] })
  caseId = opened.body.id
})

describe('plausibility of readings', () => {
  it('refuses impossible readings with 422 and field errors, leaving the case unchanged', async () => {
    const before = (await tech.get(`/api/cases/${caseId}`)).body
    const res = await tech.post(`/api/cases/${caseId}/readings`, {
      readings: [
        { quantity: 'ambientTemperature', value: 22, unit: 'C' },
        { quantity: 'cabinetTemperature', value: -300, unit: 'C' },
        { quantity: 'suctionPressure', stage: 'low', value: -200, unit: 'psig' },
      ],
    })
    expect(res.status).toBe(422)
    expect(Object.keys(res.body.data.fieldErrors).sort()).toEqual(['readings.1.value', 'readings.2.value'])
    expect(res.body.data.fieldErrors['readings.1.value'][0]).toMatch(/absolute zero/)
    const after = (await tech.get(`/api/cases/${caseId}`)).body
    expect(after.version).toBe(before.version)
    expect(after.readings).toHaveLength(before.readings.length)
    expect(after.events).toHaveLength(before.events.length)
  })

  it('refuses 99 999 psig on the R170 stage outright, even with a confirmation: no refrigeration stage holds 689 MPa (ceiling: common practice, no source)', async () => {
    const before = (await tech.get(`/api/cases/${caseId}`)).body
    const reading = { quantity: 'dischargePressure', stage: 'low', value: 99_999, unit: 'psig' }
    for (const body of [{ readings: [reading] }, { readings: [reading], confirmations: [{ index: 0, reason: 'Gauge read as shown' }] }]) {
      const res = await tech.post(`/api/cases/${caseId}/readings`, body)
      expect(res.status).toBe(422)
      expect(res.body.data.fieldErrors['readings.0.value'][0]).toMatch(/more than any refrigeration stage is built to hold/)
      expect(res.body.data.confirmationNeeded ?? []).toEqual([])
    }
    // 800 psig (5617 kPa absolute) is above ethane's critical pressure of 4872 kPa (Bücker & Wagner 2006):
    // alarming but possible, so it is only asked about.
    const asked = await tech.post(`/api/cases/${caseId}/readings`, { readings: [{ ...reading, value: 800 }] })
    expect(asked.status).toBe(422)
    expect(asked.body.data.confirmationNeeded).toHaveLength(1)
    const after = (await tech.get(`/api/cases/${caseId}`)).body
    expect(after.version).toBe(before.version)
    expect(after.readings).toHaveLength(before.readings.length)
  })

  it('asks to confirm a reading far outside the design envelope, then keeps it marked with the reason', async () => {
    const reading = { quantity: 'cabinetTemperature', value: -200, unit: 'C' }
    const asked = await tech.post(`/api/cases/${caseId}/readings`, { readings: [reading] })
    expect(asked.status).toBe(422)
    expect(asked.body.data.confirmationNeeded).toEqual([{ index: 0, message: expect.stringMatching(/far outside/) }])
    expect(asked.body.data.fieldErrors['readings.0.value']).toBeDefined()
    const kept = await tech.post(`/api/cases/${caseId}/readings`, { readings: [reading], confirmations: [{ index: 0, reason: 'Probe sits in the liquid nitrogen dewar port' }] })
    expect(kept.status).toBe(200)
    expect(kept.body.readings.at(-1)).toMatchObject({ value: -200, confirmedOutside: { reason: 'Probe sits in the liquid nitrogen dewar port' } })
    expect(kept.body.events.find((e: { type: string }) => e.type === 'reading-entered' && e.confirmedOutside)).toBeDefined()
  })
})

describe('corrections', () => {
  it('strikes out and corrects readings with a reason, each as its own timeline event; the diagnosis follows', async () => {
    const added = await tech.post(`/api/cases/${caseId}/readings`, {
      readings: [{ quantity: 'standingPressure', stage: 'low', value: 25, unit: 'psig' }, { quantity: 'cascadeHxTemperature', value: -3, unit: 'C' }],
    })
    const standing = added.body.readings.length - 2
    const corrected = await tech.post(`/api/cases/${caseId}/readings/${standing}/correction`, { action: 'correct', reason: 'Read the wrong scale of the gauge', value: 52 })
    expect(corrected.status).toBe(200)
    expect(corrected.body.readings[standing]).toMatchObject({ value: 52, unit: 'psig', corrected: { reason: 'Read the wrong scale of the gauge', from: { value: 25, unit: 'psig' } } })
    expect(corrected.body.events.at(-1).type === 'reading-corrected' || corrected.body.events.some((e: { type: string }) => e.type === 'reading-corrected')).toBe(true)

    const struck = await tech.post(`/api/cases/${caseId}/readings/${standing + 1}/correction`, { action: 'strike', reason: 'Probe was on the wrong pipe' })
    expect(struck.status).toBe(200)
    expect(struck.body.readings[standing + 1].struck).toMatchObject({ reason: 'Probe was on the wrong pipe' })
    expect(struck.body.events.filter((e: { type: string }) => e.type === 'reading-entered').length).toBeGreaterThanOrEqual(3)

    // Append-only: the original entry event is still there with the first figure.
    expect(struck.body.events.find((e: { type: string; index?: number }) => e.type === 'reading-entered' && e.index === standing)).toMatchObject({ value: 25 })
    expect((await tech.post(`/api/cases/${caseId}/readings/${standing + 1}/correction`, { action: 'strike', reason: 'again' })).status).toBe(409)
    expect((await tech.post(`/api/cases/${caseId}/readings/999/correction`, { action: 'strike', reason: 'no such reading' })).status).toBe(404)
    expect((await tech.post(`/api/cases/${caseId}/readings/${standing}/correction`, { action: 'correct', reason: 'x' })).status).toBe(400)
    const impossible = await tech.post(`/api/cases/${caseId}/readings/${standing}/correction`, { action: 'correct', reason: 'Typed again', value: -300 })
    expect(impossible.status).toBe(422)
    expect(impossible.body.data.fieldErrors.value).toBeDefined()
  })

  it('corrects and strikes out a test outcome', async () => {
    const recorded = await tech.post(`/api/cases/${caseId}/test-results`, { test: 'standing-pressure-check', stage: 'low', outcome: 'as-expected' })
    const index = recorded.body.testResults.length - 1
    const res = await tech.post(`/api/cases/${caseId}/outcomes/${index}/correction`, { action: 'correct', reason: 'Compared with the wrong stage', outcome: 'low' })
    expect({ status: res.status, index, message: res.status === 200 ? '' : res.body?.message }).toMatchObject({ status: 200 })
    expect(res.body.testResults[index]).toMatchObject({ outcome: 'low', corrected: { from: { outcome: 'as-expected' } } })
    expect(res.body.events.some((e: { type: string }) => e.type === 'outcome-corrected')).toBe(true)
    const leak = (ranking: { causes: { cause: string; stage?: string; probability: number }[] }) => ranking.causes.find((c) => c.cause === 'refrigerant-leak' && c.stage === 'low')!.probability
    expect(leak(res.body.ranking)).toBeGreaterThan(leak(recorded.body.ranking))
  })
})

describe('repair and verification steps', () => {
  it('refuses brazing on the flammable low stage until the checklist is complete', async () => {
    const res = await tech.post(`/api/cases/${caseId}/steps`, {
      step: { kind: 'hot-work', stage: 'low', task: 'Brazed an access fitting in place of the line-tap valve', checklist: { recovered: true, purgedWithNitrogen: true, nitrogenFlowWhileBrazing: true, extinguisher: true } },
    })
    expect(res.status).toBe(422)
    expect(Object.keys(res.body.data.fieldErrors).sort()).toEqual(['checklist.atmosphereChecked', 'checklist.permit'])
    const done = await tech.post(`/api/cases/${caseId}/steps`, {
      step: {
        kind: 'hot-work', stage: 'low', task: 'Brazed an access fitting in place of the line-tap valve',
        checklist: { recovered: true, purgedWithNitrogen: true, atmosphereChecked: true, permit: true, nitrogenFlowWhileBrazing: true, extinguisher: true },
      },
    })
    expect(done.status).toBe(200)
    expect(done.body.steps[0]).toMatchObject({ kind: 'hot-work', stage: 'low', result: { verdict: 'done' } })
    expect(done.body.steps[0].result.cautions.join(' ')).toMatch(/flammable/)
    expect(done.body.steps[0].result.cautions.join(' ')).not.toMatch(/hydrogen fluoride/)
  })

  it('judges a nitrogen hold with the temperature correction, an evacuation and a recharge by standing pressure', async () => {
    const hold = await tech.post(`/api/cases/${caseId}/steps`, {
      step: { kind: 'pressure-hold', stage: 'low', gas: 'nitrogen', pressureUnit: 'psig', testPressure: 300, startPressure: 300, endPressure: 296, temperatureUnit: 'C', startTemperature: 20, endTemperature: 15, holdMinutes: 60 },
    })
    expect(hold.status).toBe(200)
    expect(hold.body.steps.at(-1).result.verdict).toBe('pass')
    const vacuum = await tech.post(`/api/cases/${caseId}/steps`, { step: { kind: 'evacuation', stage: 'low', vacuumUnit: 'micron', target: 500, reached: 350, decayMinutes: 15, afterDecay: 600 } })
    expect(vacuum.body.steps.at(-1).result.verdict).toBe('pass')
    const recharge = await tech.post(`/api/cases/${caseId}/steps`, { step: { kind: 'recharge', stage: 'low', method: 'standing-pressure', pressure: 40, pressureUnit: 'psig', ambientC: 22 } })
    expect(recharge.status).toBe(200)
    expect(recharge.body.steps.at(-1).result.figures.map((f: { label: string }) => f.label)).toEqual(expect.arrayContaining(['Charge to (target at this room temperature)', 'Grams in the stage']))

    // Readings taken once the repair started belong to it and no longer move the diagnosis.
    const after = await tech.post(`/api/cases/${caseId}/readings`, { readings: [{ quantity: 'standingPressure', stage: 'low', value: 235, unit: 'psig' }] })
    expect(after.body.readings.at(-1).phase).toBe('repair')
    const top = (ranking: { causes: { cause: string; stage?: string; probability: number }[] }) => ranking.causes.slice(0, 3).map((c) => [c.cause, c.stage, c.probability.toFixed(3)])
    expect(top(after.body.ranking)).toEqual(top(recharge.body.ranking))

    expect((await tech.post(`/api/cases/${caseId}/steps`, { step: { kind: 'pressure-hold', stage: 'low', gas: 'oxygen' } })).status).toBe(400)
    expect((await tech.post(`/api/cases/${caseId}/steps`, { step: { kind: 'recharge', stage: 'single', method: 'scale', grams: 10 } })).status).toBe(400)
    const struck = await tech.post(`/api/cases/${caseId}/steps/1/strike`, { reason: 'Entered on the wrong case' })
    expect(struck.body.steps[1].struck).toMatchObject({ reason: 'Entered on the wrong case' })
  })
})

describe('the report', () => {
  it('groups readings by phase, shows corrections and steps, picks photos and recipients, and sends to the picked addresses', async () => {
    const upload = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(await samplePng(), 'fitting.png', 'image/png', 'photo'))
    expect(upload.status).toBe(201)
    const picked = await tech.put(`/api/cases/${caseId}/report/photos`, { uploadIds: [upload.body.id] })
    expect(picked.status).toBe(200)
    expect(picked.body.reportPhotoIds).toEqual([upload.body.id])
    expect((await tech.put(`/api/cases/${caseId}/report/photos`, { uploadIds: [999999] })).status).toBe(400)

    const report = (await tech.get(`/api/cases/${caseId}/report`)).body
    const titles = report.sections.map((s: { title: string }) => s.title)
    expect(titles).toEqual(expect.arrayContaining(['Readings as found', 'Readings after repair', 'Repair and verification']))
    const found = report.sections.find((s: { title: string }) => s.title === 'Readings as found')
    expect(found.rows.find((r: { value: string }) => r.value === '52 psig').note).toMatch(/corrected from 25 psig/)
    expect(report.photos).toEqual([expect.objectContaining({ id: upload.body.id })])
    expect(report.recipients.length).toBeGreaterThan(0)

    const pdf = await tech.raw(`/api/cases/${caseId}/report.pdf`)
    const text = await pdfText(await pdf.arrayBuffer())
    expect(text).toContain('Readings as found')
    expect(text).toContain('Customer acknowledgement')

    // Addresses outside the site's contacts and the organisation: an engineer may send to them.
    const sent = await (await signedIn(DEMO.engineer)).post(`/api/cases/${caseId}/report/send`, { recipients: ['lab.lead@example.test', 'facilities@example.test'] })
    expect(sent.status).toBe(202)
    expect(sent.body.queued).toBe(2)
    expect((await tech.post(`/api/cases/${caseId}/report/send`, { recipients: ['not an address'] })).status).toBe(400)
  })

  it('closes without sending when asked, so the report can be previewed first', async () => {
    const closed = await tech.post(`/api/cases/${caseId}/close`, {
      confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low', basis: 'repair' }], workDone: 'Replaced the line-tap valve with a brazed access fitting.', sendReport: false,
    })
    expect(closed.status).toBe(200)
    expect(closed.body.events.some((e: { type: string; at: string }) => e.type === 'report-queued' && e.at >= closed.body.closedAt)).toBe(false)
    expect(closed.body.closure.confirmedCauses[0].basis).toBe('repair')
  })
})
