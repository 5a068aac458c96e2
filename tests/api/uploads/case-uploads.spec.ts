import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import sharp from 'sharp'
import { SAMPLE_HEIC, SAMPLE_PDF, closeCase, fileForm, openCase, samplePng } from './fixtures'

let tech: ApiClient
let other: ApiClient
let caseId: number
let png: Buffer

beforeAll(async () => {
  tech = await signedIn(DEMO.tech)
  other = await signedIn(DEMO.otherTech)
  caseId = (await openCase(tech)).id
  png = await samplePng()
})

describe('uploading to a case', () => {
  it('stores a PNG with a WebP thumbnail, serves both and notes it on the timeline', async () => {
    const res = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(png, 'condenser coil.png', 'image/png'))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ id: expect.any(Number), mime: 'image/png', bytes: png.length, originalName: 'condenser coil.png', purpose: 'photo' })
    expect(res.body.thumbUrl).toBe(`/api/uploads/${res.body.id}?thumb=1`)

    const file = await tech.raw(res.body.url)
    expect(file.status).toBe(200)
    expect(file.headers.get('content-type')).toBe('image/png')
    expect(file.headers.get('x-content-type-options')).toBe('nosniff')
    expect(file.headers.get('content-disposition')).toMatch(/^inline; filename="condenser coil\.png"/)
    expect(Buffer.from(await file.arrayBuffer()).equals(png)).toBe(true)

    const thumb = await tech.raw(res.body.thumbUrl)
    expect(thumb.status).toBe(200)
    expect(thumb.headers.get('content-type')).toBe('image/webp')
    const thumbBytes = Buffer.from(await thumb.arrayBuffer())
    expect(thumbBytes.subarray(8, 12).toString('latin1')).toBe('WEBP')
    expect(thumbBytes.length).toBeLessThan(png.length * 2)

    const record = (await tech.get(`/api/cases/${caseId}`)).body
    expect(record.uploads).toContainEqual(expect.objectContaining({ id: res.body.id, mime: 'image/png' }))
    expect(record.events).toContainEqual(expect.objectContaining({ type: 'photo', uploadId: res.body.id, name: 'condenser coil.png' }))
  })

  it('stores a PDF without a thumbnail and offers it as a download on request', async () => {
    const res = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(SAMPLE_PDF, 'leak-test certificate.pdf', 'application/pdf'))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ mime: 'application/pdf', purpose: 'document', thumbUrl: null })
    const file = await tech.raw(`${res.body.url}?download=1`)
    expect(file.headers.get('content-type')).toBe('application/pdf')
    expect(file.headers.get('content-disposition')).toMatch(/^attachment;/)
    expect(Buffer.from(await file.arrayBuffer()).subarray(0, 4).toString()).toBe('%PDF')
    const thumb = await tech.get(`/api/uploads/${res.body.id}?thumb=1`)
    expect(thumb.status).toBe(404)
    expect(thumb.body.message).toMatch(/no thumbnail/)
  })

  it('judges the type by the content, not the name or the declared type', async () => {
    const res = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(Buffer.from('just some text, not a photo\n'), 'photo.jpg', 'image/jpeg'))
    expect(res.status).toBe(415)
    expect(res.body.message).toMatch(/JPEG, PNG, WebP, HEIC or PDF/)
    expect(res.body.message).toMatch(/image\/jpeg, image\/png, image\/webp, image\/heic, application\/pdf/)
    const html = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(Buffer.from('<html><script>alert(1)</script></html>'), 'report.pdf', 'application/pdf'))
    expect(html.status).toBe(415)
  })

  it('refuses a file over 25 MB with 413 and says the limit', async () => {
    const big = Buffer.alloc(25 * 1024 * 1024 + 1, 0x20)
    png.copy(big)
    const res = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(big, 'huge.png', 'image/png'))
    expect(res.status).toBe(413)
    expect(res.body.message).toMatch(/25 MB/)
  })

  it('answers 400 with a clear message for an empty, missing or mislabelled file (415 for a body that is not a form)', async () => {
    const empty = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(new Uint8Array(0), 'empty.png', 'image/png'))
    expect(empty.status).toBe(400)
    expect(empty.body.message).toMatch(/empty/)
    const noFile = new FormData()
    noFile.append('purpose', 'photo')
    const missing = await tech.post(`/api/cases/${caseId}/uploads`, noFile)
    expect(missing.status).toBe(400)
    expect(missing.body.message).toMatch(/No file/)
    const json = await tech.post(`/api/cases/${caseId}/uploads`, { file: 'not a file' })
    expect(json.status).toBe(415)
    expect(json.body.message).toMatch(/multipart\/form-data/)
    const badPurpose = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(png, 'a.png', 'image/png', 'selfie'))
    expect(badPurpose.status).toBe(400)
    expect(badPurpose.body.message).toMatch(/purpose/i)
  })

  it('takes an iPhone HEIC photo, known by its bytes, and stores it as a JPEG the right way round', async () => {
    // Declared as a generic file, as many phones send it: only the bytes say it is HEIC.
    const res = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(SAMPLE_HEIC, 'IMG_0042.HEIC', 'application/octet-stream'))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ mime: 'image/jpeg', originalName: 'IMG_0042.jpg', purpose: 'photo' })
    const file = await tech.raw(res.body.url)
    expect(file.headers.get('content-type')).toBe('image/jpeg')
    const jpeg = Buffer.from(await file.arrayBuffer())
    const { data, info } = await sharp(jpeg).raw().toBuffer({ resolveWithObject: true })
    expect([info.width, info.height]).toEqual([320, 200])
    const px = (x: number, y: number) => Array.from(data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3))
    // The drawing's colours survive the conversion (within JPEG and HEVC loss): red corner #dc2626, white disc, teal #0e7490 ground.
    const near = (got: number[], want: number[]) => got.every((v, i) => Math.abs(v - want[i]!) <= 24)
    expect(near(px(10, 10), [0xdc, 0x26, 0x26]), `corner ${px(10, 10)}`).toBe(true)
    expect(near(px(160, 100), [0xf8, 0xfa, 0xfc]), `centre ${px(160, 100)}`).toBe(true)
    expect(near(px(300, 180), [0x0e, 0x74, 0x90]), `ground ${px(300, 180)}`).toBe(true)
    const thumb = await tech.raw(res.body.thumbUrl)
    expect(thumb.status).toBe(200)
  })

  it('refuses a file named .heic that is not one (415) and a HEIC cut short (422)', async () => {
    const fake = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(Buffer.from('just some text, not a photo'), 'IMG_0043.heic', 'image/heic'))
    expect(fake.status).toBe(415)
    expect(fake.body.message).toMatch(/HEIC/)
    const cut = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(SAMPLE_HEIC.subarray(0, 600), 'IMG_0044.HEIC', 'image/heic'))
    expect(cut.status).toBe(422)
    expect(cut.body.message).toMatch(/HEIC photo could not be read/)
  })

  it('answers 422 for an image that starts right but cannot be decoded', async () => {
    const broken = Buffer.concat([png.subarray(0, 40), Buffer.alloc(200, 7)])
    const res = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(broken, 'cut-short.png', 'image/png'))
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/could not be read/)
  })

  it('keeps files inside their organisation and needs a signed-in user', async () => {
    const mine = (await tech.post(`/api/cases/${caseId}/uploads`, fileForm(png, 'x.png', 'image/png'))).body
    expect((await other.get(mine.url)).status).toBe(404)
    expect((await other.get(mine.thumbUrl)).status).toBe(404)
    expect((await other.post(`/api/cases/${caseId}/uploads`, fileForm(png, 'y.png', 'image/png'))).status).toBe(404)
    const trainer = await signedIn(DEMO.trainer)
    expect((await trainer.post(`/api/cases/${caseId}/uploads`, fileForm(png, 't.png', 'image/png'))).status).toBe(403)
    const anonymous = new ApiClient()
    expect((await anonymous.get(mine.url)).status).toBe(401)
    expect((await anonymous.post(`/api/cases/${caseId}/uploads`, fileForm(png, 'z.png', 'image/png'))).status).toBe(401)
    expect((await tech.get('/api/uploads/999999')).status).toBe(404)
    expect((await tech.get('/api/uploads/abc')).status).toBe(400)
    expect((await tech.get(`/api/uploads/${mine.id}?thumb=maybe`)).status).toBe(400)
  })

  it('refuses uploads to a closed case with 409 and keeps what was there', async () => {
    const { id } = await openCase(tech, 'Fan noisy, cabinet slow to pull down')
    const before = await tech.post(`/api/cases/${id}/uploads`, fileForm(png, 'fan.png', 'image/png'))
    expect(before.status).toBe(201)
    await closeCase(tech, id)
    const after = await tech.post(`/api/cases/${id}/uploads`, fileForm(png, 'late.png', 'image/png'))
    expect(after.status).toBe(409)
    expect(after.body.message).toMatch(/closed/)
    const record = (await tech.get(`/api/cases/${id}`)).body
    expect(record.uploads.map((u: { id: number }) => u.id)).toEqual([before.body.id])
    expect((await tech.raw(before.body.url)).status).toBe(200)
  })
})
