import { describe, expect, it } from 'vitest'
import { replayPoints } from '#server/domain/training/replay'
import type { CaseEventDto, CaseReading, CaseTestResult } from '#shared/types/cases'

let nextId = 1
const ev = (type: string, payload: Record<string, unknown> = {}, at = '2026-11-01T08:00:00.000Z'): CaseEventDto =>
  ({ id: nextId++, at, type, by: 'T', byUserId: 7, ...payload }) as CaseEventDto
const snapshot = (versionId: number, top: unknown[] = []) => ev('ranking-snapshot', { knowledgeBaseVersion: { id: versionId, label: `v${versionId}`, status: 'published' }, top })

describe('replay points', () => {
  it('takes one point per event that changed what was known, in order, with the version ranked after it', () => {
    nextId = 1
    const readings: CaseReading[] = [
      { quantity: 'cabinetTemperature', value: -40, unit: 'C', at: 't1', by: 7 },
      { quantity: 'suctionPressure', stage: 'low', value: 90, unit: 'kPa', at: 't1', by: 7 },
      { quantity: 'standingPressure', stage: 'low', value: 1200, unit: 'kPa', phase: 'repair', at: 't3', by: 7 },
    ]
    const results: CaseTestResult[] = [{ test: 'standing-pressure-check', stage: 'low', outcome: 'low', at: 't2', by: 7 }]
    const events = [
      ev('case-opened', { complaint: 'warm', unitId: 1 }),
      ev('symptoms-set', { symptoms: ['not-cooling', 'not-cooling'] }),
      snapshot(3, [{ cause: 'restriction', stage: 'low', probability: 0.3 }]),
      ev('test-proposed', { test: 'standing-pressure-check', stage: 'low' }),
      ev('reading-entered', { quantity: 'cabinetTemperature', value: -40, unit: 'C' }),
      ev('reading-entered', { quantity: 'suctionPressure', stage: 'low', value: 90, unit: 'kPa' }),
      ev('note', { text: 'Door seal fine' }),
      snapshot(3),
      ev('outcome-recorded', { test: 'standing-pressure-check', stage: 'low', outcome: 'low' }),
      snapshot(4, [{ cause: 'refrigerant-leak', stage: 'low', probability: 0.8 }]),
      ev('reading-entered', { quantity: 'standingPressure', stage: 'low', value: 1200, unit: 'kPa' }),
      ev('case-closed', { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }] }),
      ev('report-queued', { to: 'x' }),
    ]
    // Stored out of order on purpose: the timeline order is the events' ids.
    const points = replayPoints({ events: [...events].reverse(), readings, testResults: results })

    expect(points.map((p) => p.event.type)).toEqual(['case-opened', 'symptoms-set', 'reading-entered', 'reading-entered', 'outcome-recorded', 'reading-entered', 'case-closed'])
    expect(points.map((p) => p.event)).toEqual(events.filter((e) => ['case-opened', 'symptoms-set', 'reading-entered', 'outcome-recorded', 'case-closed'].includes(e.type)))
    expect(points.map((p) => p.versionId)).toEqual([3, 3, 3, 3, 4, 4, 4])
    expect(points[0]!.symptoms).toEqual([])
    expect(points[1]!.symptoms).toEqual(['not-cooling'])
    expect(points[1]!.recorded).toEqual([{ cause: 'restriction', stage: 'low', probability: 0.3 }])
    expect(points[3]!.readings).toEqual(readings.slice(0, 2))
    expect(points[4]!.testResults).toEqual(results)
    expect(points[4]!.recorded).toEqual([{ cause: 'refrigerant-leak', stage: 'low', probability: 0.8 }])
    // The stored reading keeps its phase, which the event payload does not carry.
    expect(points[5]!.readings[2]).toEqual(readings[2])
    expect(points[6]!.recorded).toBeNull()
  })

  it('falls back on the event payload when the stored list disagrees, and records no version when the case never ranked', () => {
    nextId = 100
    const events = [
      ev('case-opened', { complaint: 'warm', unitId: 1 }),
      ev('reading-entered', { quantity: 'ambientTemperature', value: 24, unit: 'C' }, '2026-11-01T09:00:00.000Z'),
    ]
    const points = replayPoints({ events, readings: [], testResults: [] })
    expect(points.map((p) => p.versionId)).toEqual([null, null])
    expect(points[1]!.readings).toEqual([{ quantity: 'ambientTemperature', value: 24, unit: 'C', at: '2026-11-01T09:00:00.000Z', by: 7 }])
  })
})
