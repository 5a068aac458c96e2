import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { otherOrganisation, workedClosedCase } from './helpers'

const KNOWN = ['case-opened', 'symptoms-set', 'reading-entered', 'outcome-recorded', 'case-closed']

describe('case replay', () => {
  it('has one step per stored event that changed what was known, in order, each ranked with the version the case recorded', async () => {
    const tech = await signedIn(DEMO.tech)
    const id = await workedClosedCase(tech)
    const record = (await tech.get(`/api/cases/${id}`)).body
    const trainer = await signedIn(DEMO.trainer)
    const replay = await trainer.get(`/api/cases/${id}/replay`)
    expect(replay.status).toBe(200)

    const stored = record.events.filter((e: { type: string }) => KNOWN.includes(e.type))
    expect(replay.body.steps.map((s: { event: unknown }) => s.event)).toEqual(stored)
    expect(replay.body.steps.map((s: { at: string }) => s.at)).toEqual(stored.map((e: { at: string }) => e.at))
    expect(replay.body.steps.map((s: { event: { type: string } }) => s.event.type)).toEqual([
      'case-opened', 'symptoms-set', 'reading-entered', 'reading-entered', 'reading-entered', 'reading-entered', 'outcome-recorded', 'reading-entered', 'case-closed',
    ])
    const recordedVersion = record.events.find((e: { type: string }) => e.type === 'ranking-snapshot').knowledgeBaseVersion
    for (const step of replay.body.steps) {
      expect(step.ranking.knowledgeBaseVersion.id).toBe(recordedVersion.id)
      expect(step.versionNote).toBeNull()
      const total = step.ranking.causes.reduce((sum: number, c: { probability: number }) => sum + c.probability, 0)
      expect(total).toBeCloseTo(1, 6)
    }
    // After the standing-pressure outcome the leak on the low stage leads, as the case recorded it.
    const afterOutcome = replay.body.steps[6]
    expect(afterOutcome.ranking.causes[0]).toMatchObject({ cause: 'refrigerant-leak', stage: 'low' })
    expect(afterOutcome.recorded[0]).toMatchObject({ cause: 'refrigerant-leak', stage: 'low' })
    expect(afterOutcome.ranking.causes[0].probability).toBeCloseTo(record.ranking.causes[0].probability, 1)
    // The repair-phase reading is a step of its own but does not move the ranking.
    expect(replay.body.steps[7].ranking.causes.slice(0, 3)).toEqual(afterOutcome.ranking.causes.slice(0, 3))
    expect(replay.body.confirmedCauses).toEqual([{ cause: 'refrigerant-leak', stage: 'low' }])
  })

  it('is for trainers, engineers and admins of the case’s organisation only', async () => {
    const id = await workedClosedCase(await signedIn(DEMO.tech))
    expect((await new ApiClient().get(`/api/cases/${id}/replay`)).status).toBe(401)
    expect((await (await signedIn(DEMO.tech)).get(`/api/cases/${id}/replay`)).status).toBe(403)
    expect((await (await signedIn(DEMO.otherTech)).get(`/api/cases/${id}/replay`)).status).toBe(403)
    for (const email of [DEMO.trainer, DEMO.engineer, DEMO.admin]) expect((await (await signedIn(email)).get(`/api/cases/${id}/replay`)).status, email).toBe(200)
    expect((await (await otherOrganisation('trainer')).get(`/api/cases/${id}/replay`)).status).toBe(404)
    expect((await (await signedIn(DEMO.trainer)).get('/api/cases/99999999/replay')).status).toBe(404)
    expect((await (await signedIn(DEMO.trainer)).get('/api/cases/abc/replay')).status).toBe(400)
  })
})
