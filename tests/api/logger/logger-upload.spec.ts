// Data-logger files over HTTP: upload to a case, the first look and suggested mapping, the analysis as a
// background job, readings and symptoms taken into the case, the mapping remembered per logger model,
// odd and broken files, and who may do what. The series are generated with known shapes (invented data).
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { dmyTime, isoTime, pullDownSeries } from '../../unit/server/domain/logger/fixtures'
import { closeCase, openCase, samplePng } from '../uploads/fixtures'

let tech: ApiClient
let trainer: ApiClient
let other: ApiClient
let caseId: number
const model = `TL-${Math.random().toString(36).slice(2, 8)}`

// 6 h of minute readings: 20 °C down at 30 K/h with a 90 min plateau at -50 °C, then to -80 °C.
const cabinet = pullDownSeries({ fromC: 20, toC: -80, rateKPerHour: 30, stall: { levelC: -50, minutes: 90 } }, 360)
const GOOD = ['time,Cabinet (°C),Ambient (°C)', ...cabinet.map((c, m) => `${isoTime(m)},${c.toFixed(2)},21.0`)].join('\n') + '\n'
// The same series as many loggers write it: semicolons, decimal commas, °F, day-first times, a preamble.
const f = (c: number) => ((c * 9) / 5 + 32).toFixed(2).replace('.', ',')
const ODD = ['Logger export', 'Datum Zeit;Innen (°F);Raum (°F)', ...cabinet.map((c, m) => `${dmyTime(m)};${f(c)};${f(21)}`)].join('\r\n') + '\r\n'

const upload = (client: ApiClient, body: string | Buffer, name: string, extra = '') =>
  client.request('POST', `/api/cases/${caseId}/logger-files?name=${encodeURIComponent(name)}${extra}`, typeof body === 'string' ? body : body.toString('latin1'), { headers: { 'content-type': 'text/csv' } })

async function waitForJob(client: ApiClient, jobId: string) {
  for (let i = 0; i < 120; i++) {
    const job = (await client.get(`/api/jobs/${jobId}`)).body
    if (job.state === 'done' || job.state === 'failed') return job
    await new Promise((r) => setTimeout(r, 250))
  }
  throw new Error('the analysis did not finish in 30 s')
}

const goodMapping = { time: { column: 'time' }, columns: [{ column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'C' }, { column: 'Ambient (°C)', quantity: 'ambientTemperature', unit: 'C' }], setpointC: -80 }

beforeAll(async () => {
  ;[tech, trainer, other] = await Promise.all([signedIn(DEMO.tech), signedIn(DEMO.trainer), signedIn(DEMO.otherTech)])
  caseId = (await openCase(tech, 'Slow pull-down, logger file from the customer')).id
})

describe('a good logger file', () => {
  let fileId: number
  it('is stored with a first look: header, separator and a suggested mapping', async () => {
    const res = await upload(tech, GOOD, 'freezer log.csv')
    expect(res.status).toBe(201)
    fileId = res.body.id
    expect(res.body).toMatchObject({ caseId, originalName: 'freezer log.csv', bytes: Buffer.byteLength(GOOD), analysis: null })
    expect(res.body.preview).toMatchObject({ delimiter: ',', decimal: '.', header: ['time', 'Cabinet (°C)', 'Ambient (°C)'] })
    expect(res.body.preview.suggestion.mapping.columns).toContainEqual(expect.objectContaining({ column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'C' }))
  })

  it('is analysed as a background job with progress, finding the pull-down and the plateau', async () => {
    const queued = await tech.post(`/api/logger-files/${fileId}/process`, { mapping: goodMapping, loggerModel: model })
    expect(queued.status).toBe(202)
    const job = await waitForJob(tech, queued.body.jobId)
    expect(job).toMatchObject({ kind: 'logger-analysis', state: 'done', progress: 1 })
    const file = (await tech.get(`/api/logger-files/${fileId}`)).body
    expect(file.analysis.status).toBe('ok')
    expect(file.analysis.rows.valid).toBe(360)
    // The plateau was generated at -50 °C for 90 minutes, 30 K above the setpoint.
    expect(file.analysis.stalls).toHaveLength(1)
    expect(file.analysis.stalls[0].levelC).toBeCloseTo(-50, 0)
    expect(file.analysis.stalls[0].minutes).toBeGreaterThanOrEqual(80)
    expect(file.analysis.pullDowns[0].averageRateKPerHour).toBeGreaterThan(10)
    expect(file.analysis.series.find((s: { quantity: string }) => s.quantity === 'cabinetTemperature').points.length).toBeGreaterThan(10)
    expect(file.analysis.offered.readings.length).toBeGreaterThan(0)
  })

  it('offers its readings and symptoms to the case, which takes only what the technician ticks', async () => {
    const file = (await tech.get(`/api/logger-files/${fileId}`)).body
    const cabinetIndex = file.analysis.offered.readings.findIndex((r: { quantity: string }) => r.quantity === 'cabinetTemperature')
    expect(cabinetIndex).toBeGreaterThanOrEqual(0)
    const symptoms = file.analysis.offered.symptoms.map((s: { symptom: string }) => s.symptom)
    const res = await tech.post(`/api/logger-files/${fileId}/accept`, { readings: [cabinetIndex], symptoms })
    expect(res.status).toBe(200)
    expect(res.body.readings).toContainEqual(expect.objectContaining({ quantity: 'cabinetTemperature' }))
    for (const s of symptoms) expect(res.body.symptoms).toContain(s)
    expect((await tech.get(`/api/logger-files/${fileId}`)).body.acceptedAt).toEqual(expect.any(String))
    const stray = await tech.post(`/api/logger-files/${fileId}/accept`, { readings: [999] })
    expect(stray.status).toBe(400)
    expect((await tech.post(`/api/logger-files/${fileId}/accept`, { readings: [], symptoms: [] })).status).toBe(400)
  })

  it('remembers the mapping for the logger model and fills it in for its next file', async () => {
    const saved = await tech.get(`/api/logger-mappings?model=${encodeURIComponent(model.toUpperCase())}`)
    expect(saved.status).toBe(200)
    expect(saved.body.mapping.columns).toHaveLength(2)
    const next = await upload(tech, GOOD, 'next week.csv', `&loggerModel=${encodeURIComponent(model)}`)
    expect(next.status).toBe(201)
    expect(next.body.rememberedMapping.columns[0]).toMatchObject({ column: 'Cabinet (°C)', quantity: 'cabinetTemperature' })
    expect((await tech.get('/api/logger-mappings?model=never-seen-model')).status).toBe(404)
    expect((await other.get(`/api/logger-mappings?model=${encodeURIComponent(model)}`)).status).toBe(404)
  })
})

describe('an odd file (semicolons, decimal commas, °F, day-first times, a preamble)', () => {
  it('is read with the mapping and converted to °C', async () => {
    const res = await upload(tech, ODD, 'export.csv')
    expect(res.status).toBe(201)
    expect(res.body.preview).toMatchObject({ delimiter: ';', decimal: ',', headerRow: 2 })
    const mapping = { delimiter: ';', decimal: ',', time: { column: 'Datum Zeit', format: 'day-month-year' }, columns: [{ column: 'Innen (°F)', quantity: 'cabinetTemperature', unit: 'F' }, { column: 'Raum (°F)', quantity: 'ambientTemperature', unit: 'F' }], setpointC: -80 }
    const queued = await tech.post(`/api/logger-files/${res.body.id}/process`, { mapping })
    expect(queued.status).toBe(202)
    expect((await waitForJob(tech, queued.body.jobId)).state).toBe('done')
    const analysis = (await tech.get(`/api/logger-files/${res.body.id}`)).body.analysis
    expect(analysis.status).toBe('ok')
    const series = analysis.series.find((s: { quantity: string }) => s.quantity === 'cabinetTemperature')
    // -80 °C = -112 °F; 20 °C = 68 °F (exact conversions).
    expect(series.min).toBeCloseTo(Math.min(...cabinet), 1)
    expect(series.max).toBeCloseTo(Math.max(...cabinet), 1)
    expect(analysis.stalls).toHaveLength(1)
  })
})

describe('broken files', () => {
  it('refuses a mapping the file cannot be read with, naming the row and column', async () => {
    const broken = ['time,Cabinet (°C)', ...cabinet.slice(0, 50).map((c, m) => (m % 2 ? `yesterday-ish,${c}` : `${isoTime(m)},minus ${c}`))].join('\n')
    const res = await upload(tech, broken, 'broken.csv')
    expect(res.status).toBe(201)
    const refused = await tech.post(`/api/logger-files/${res.body.id}/process`, { mapping: { time: { column: 'time', format: 'iso' }, columns: [{ column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'C' }] } })
    expect(refused.status).toBe(400)
    expect(refused.body.message).toMatch(/Row \d+, column "(time|Cabinet \(°C\))"/)
    expect(refused.body.data.fieldErrors.file.join(' ')).toMatch(/Row 2, column "Cabinet \(°C\)"/)
    expect((await tech.get(`/api/logger-files/${res.body.id}`)).body.jobId).toBeNull()
  })

  it('refuses a mapping naming a column the file does not have', async () => {
    const res = await upload(tech, GOOD, 'good.csv')
    const refused = await tech.post(`/api/logger-files/${res.body.id}/process`, { mapping: { time: { column: 'time' }, columns: [{ column: 'Kabinett', quantity: 'cabinetTemperature', unit: 'C' }] } })
    expect(refused.status).toBe(400)
    expect(refused.body.message).toMatch(/Kabinett/)
    const badUnit = await tech.post(`/api/logger-files/${res.body.id}/process`, { mapping: { time: { column: 'time' }, columns: [{ column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'psig' }] } })
    expect(badUnit.status).toBe(400)
    expect(Object.keys(badUnit.body.data.fieldErrors).join()).toMatch(/unit/)
  })

  it('refuses an empty file, a picture, a form (415) and a file that holds no rows of data', async () => {
    expect((await upload(tech, '', 'empty.csv')).status).toBe(400)
    const png = await upload(tech, await samplePng(), 'photo.csv')
    expect(png.status).toBe(400)
    expect(png.body.data.fieldErrors.file).toBeDefined()
    const form = new FormData()
    form.append('file', new Blob([GOOD]), 'log.csv')
    const asForm = await tech.post(`/api/cases/${caseId}/logger-files?name=log.csv`, form)
    expect(asForm.status).toBe(415)
    expect(asForm.body.message).toMatch(/text\/csv/)
    const prose = await upload(tech, 'Dear customer,\nplease find the log attached.\nRegards\n', 'letter.csv')
    expect(prose.status).toBe(400)
    expect(prose.body.message).toMatch(/letter\.csv/)
    expect((await tech.request('POST', `/api/cases/${caseId}/logger-files`, GOOD, { headers: { 'content-type': 'text/csv' } })).status).toBe(400)
  })
})

describe('who may do what', () => {
  it('answers 401 without a session', async () => {
    const anon = new ApiClient()
    expect((await upload(anon, GOOD, 'x.csv')).status).toBe(401)
    expect((await anon.get('/api/logger-files/1')).status).toBe(401)
  })

  it('lets a trainer look but not upload or analyse', async () => {
    expect((await upload(trainer, GOOD, 'x.csv')).status).toBe(403)
    const files = await trainer.get(`/api/cases/${caseId}/logger-files`)
    expect(files.status).toBe(200)
    expect(files.body.length).toBeGreaterThan(0)
    expect((await trainer.post(`/api/logger-files/${files.body[0].id}/process`, { mapping: goodMapping })).status).toBe(403)
  })

  it('shows another organisation nothing (404)', async () => {
    expect((await upload(other, GOOD, 'x.csv')).status).toBe(404)
    const files = (await tech.get(`/api/cases/${caseId}/logger-files`)).body
    expect((await other.get(`/api/logger-files/${files[0].id}`)).status).toBe(404)
    expect((await other.post(`/api/logger-files/${files[0].id}/process`, { mapping: goodMapping })).status).toBe(404)
    expect((await other.post(`/api/logger-files/${files[0].id}/accept`, { readings: [0] })).status).toBe(404)
    expect((await other.get(`/api/cases/${caseId}/logger-files`)).status).toBe(404)
  })

  it('takes no file for a closed case (409)', async () => {
    const closed = await openCase(tech, 'Closed before the logger file came')
    await closeCase(tech, closed.id)
    const res = await tech.request('POST', `/api/cases/${closed.id}/logger-files?name=late.csv`, GOOD, { headers: { 'content-type': 'text/csv' } })
    expect(res.status).toBe(409)
  })
})
