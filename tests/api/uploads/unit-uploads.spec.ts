import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { fileForm, samplePng } from './fixtures'

describe('uploading to a unit', () => {
  it('stores a nameplate photo on the unit and lists it there only for the organisation', async () => {
    const tech = await signedIn(DEMO.tech)
    const unit = ((await tech.get('/api/units')).body as { id: number }[])[0]!
    const png = await samplePng()
    const res = await tech.post(`/api/units/${unit.id}/uploads`, fileForm(png, 'nameplate.png', 'image/png', 'nameplate'))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ purpose: 'nameplate', mime: 'image/png' })
    const listed = await tech.get(`/api/units/${unit.id}/uploads`)
    expect(listed.body).toContainEqual(expect.objectContaining({ id: res.body.id }))

    const other = await signedIn(DEMO.otherTech)
    expect((await other.post(`/api/units/${unit.id}/uploads`, fileForm(png, 'n.png', 'image/png'))).status).toBe(404)
    expect((await other.get(`/api/units/${unit.id}/uploads`)).status).toBe(404)
    expect((await other.get(res.body.url)).status).toBe(404)
    const trainer = await signedIn(DEMO.trainer)
    expect((await trainer.post(`/api/units/${unit.id}/uploads`, fileForm(png, 'n.png', 'image/png'))).status).toBe(403)
    expect((await trainer.raw(res.body.url)).status).toBe(200)
    expect((await new ApiClient().post(`/api/units/${unit.id}/uploads`, fileForm(png, 'n.png', 'image/png'))).status).toBe(401)
  })
})
