import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { describe, expect, it, vi } from 'vitest'
import CaseTimeline from '~/components/case/CaseTimeline.vue'
import type { CaseEventDto } from '#shared/types/cases'

registerEndpoint('/api/diagnosis/titles', () => ({ causes: { 'expansion-tank-isolated': 'Expansion tank valve left shut' }, tests: {}, outcomes: {} }))

const at = '2026-12-02T13:05:00.000Z'
const event = (id: number, type: CaseEventDto['type'], payload: Record<string, unknown>): CaseEventDto => ({ id, at, type, by: 'Ola Tech', byUserId: 1, ...payload })

describe('CaseTimeline', () => {
  it('tells every event in words: readings, proposals, outcomes and closing', async () => {
    const wrapper = await mountSuspended(CaseTimeline, {
      props: {
        events: [
          event(1, 'case-opened', { complaint: 'Cabinet at -40 °C', unitId: 3 }),
          event(2, 'symptoms-set', { symptoms: ['not-cooling', 'line-tap-valve-present'] }),
          event(3, 'reading-entered', { quantity: 'suctionPressure', stage: 'low', value: 15, unit: 'psig' }),
          event(4, 'test-proposed', { test: 'standing-pressure-check', stage: 'low', minutes: 20, expectedGain: 0.6 }),
          event(5, 'outcome-recorded', { test: 'standing-pressure-check', stage: 'low', outcome: 'low' }),
          event(6, 'case-closed', { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'expansion-tank-isolated', stage: 'low' }] }),
        ],
      },
    })
    // Titles of words without a vocabulary entry come from the knowledge base once fetched.
    await vi.waitFor(() => expect(wrapper.text()).toContain('Expansion tank valve left shut'))
    const text = wrapper.text()
    expect(text).toContain('Symptoms set Not cooling, Line-tap valve fitted')
    expect(text).toContain('Low stage: suction pressure: 15 psig')
    expect(text).toContain('Test proposed Standing pressure check on the Low stage (20 min)')
    expect(text).toContain('Standing pressure check on the Low stage: Below the expected pressure')
    expect(text).toContain('Confirmed: Refrigerant leak (undercharge), Low stage; Expansion tank valve left shut, Low stage')
    for (const word of ['not-cooling', 'suctionPressure', 'standing-pressure-check', 'refrigerant-leak', 'expansion-tank-isolated', 'case-closed']) expect(text).not.toContain(word)
  })

  it('shows ranking snapshots only on request, newest first', async () => {
    const wrapper = await mountSuspended(CaseTimeline, {
      props: { events: [event(1, 'case-opened', { complaint: 'Warm' }), event(2, 'ranking-snapshot', { top: [{ cause: 'refrigerant-leak', stage: 'low', probability: 0.71 }] })] },
    })
    expect(wrapper.text()).not.toContain('71 %')
    await wrapper.get('input[type="checkbox"]').setValue(true)
    const entries = wrapper.findAll('[data-testid="timeline-entry"]')
    expect(entries[0]!.text()).toContain('Refrigerant leak · Low stage 71 %')
    expect(entries[1]!.text()).toContain('Case opened')
  })
})
