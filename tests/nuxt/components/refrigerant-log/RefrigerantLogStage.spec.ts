import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import RefrigerantLogStage from '~/components/refrigerant-log/RefrigerantLogStage.vue'
import ComplianceDutyList from '~/components/compliance/ComplianceDutyList.vue'
import type { DutyDto, StageLogDto } from '#shared/types/refrigerant-log'

// An invented low stage: 90 g nameplate charge, 30 g recovered and put back, then a 20 g top-up.
const entry = (index: number, direction: 'added' | 'recovered', grams: number, chargeAfterG: number, purpose: 'top-up' | 'recharge' | null) => ({
  index, at: `2026-11-0${index + 1}T09:00:00.000Z`, day: `2026-11-0${index + 1}`, direction, grams, refrigerant: 'R170', cylinder: direction === 'recovered' ? 'REC-3' : 'SUP-1',
  technician: 'Demo technician', caseId: index === 2 ? 41 : null, purpose, chargeAfterG, countedAsLossG: purpose === 'top-up' ? grams : 0, warnings: [],
})
const log: StageLogDto = {
  stage: 'low', refrigerant: 'R170', fullChargeG: 90, currentChargeG: 80, totalAddedG: 50, totalRecoveredG: 30, presumedLostG: 20,
  entries: [entry(0, 'recovered', 30, 60, null), entry(1, 'added', 30, 90, 'recharge'), entry(2, 'added', 20, 80, 'top-up')],
  additions: [{
    day: '2026-11-03', entryIndexes: [2], caseId: 41, addedG: 20, countedAsLossG: 20, daysSinceLastAddition: 1, daysUsed: 1,
    annualizingPercent: 8111.1, rollingAveragePercent: 22.2, exemptBecause: null, note: '',
    assessment: {
      jurisdiction: 'us-epa', applies: true, rule: { id: 'invented', title: 'Invented rule', citation: 'Invented citation' }, thresholdPercent: 20,
      exceedsThreshold: true, repairWithinDays: 30, text: ['Over the limit'], sources: [],
    },
  }],
  recoveredByCylinder: [{ cylinder: 'REC-3', refrigerant: 'R170', grams: 30 }], warnings: ['A recovery cylinder holds refrigerant from this stage.'],
}

describe('RefrigerantLogStage', () => {
  it('shows the charge now, each line newest first with the charge after it, and a leak rate over the limit in words', async () => {
    const wrapper = await mountSuspended(RefrigerantLogStage, { props: { log, method: 'rolling-average' } })
    expect(wrapper.get('h2').text()).toBe('Low stage · R170')
    expect(wrapper.text()).toContain('80 g')
    const history = wrapper.findAll('table').at(-1)!.findAll('tbody tr').map((r) => r.findAll('td').map((c) => c.text()))
    expect(history.map((r) => r[1])).toEqual(['Added · Top-up', 'Added · Recharge', 'Recovered'])
    expect(history[0]![5]).toBe('Case 41')
    expect(history.map((r) => r[6])).toEqual(['80 g', '90 g', '60 g'])
    const rates = wrapper.findAll('table')[0]!
    expect(rates.text()).toContain('22.2 %')
    expect(rates.get('td .font-bold').text()).toBe('Over the 20 % limit: repair within 30 days')
    expect(wrapper.text()).toContain('A recovery cylinder holds refrigerant from this stage.')
  })
})

describe('ComplianceDutyList', () => {
  const duty = (over: Partial<DutyDto>): DutyDto => ({
    unitId: 7, unitName: 'Freezer Q-17', stage: 'low', kind: 'repair', dueBy: '2026-12-20', daysLeft: 18, overdue: false,
    text: 'Repair the leak of the low stage.', citation: 'Invented rule text for the test', ...over,
  })

  it('says in words when each duty is due, overdue ones included, and links to the unit\'s log', async () => {
    const duties = [duty({ daysLeft: -3, overdue: true, dueBy: '2026-11-29' }), duty({ kind: 'verification-test', daysLeft: 0, dueBy: '2026-12-02' }), duty({ kind: 'leak-check', stage: null })]
    const wrapper = await mountSuspended(ComplianceDutyList, { props: { duties, showUnit: true, empty: 'Nothing due.' } })
    const items = wrapper.findAll('li').map((li) => li.text())
    expect(items[0]).toContain('Overdue by 3 days (2026-11-29)')
    expect(items[1]).toContain('Due today (2026-12-02)')
    expect(items[2]).toContain('Due in 18 days (2026-12-20)')
    expect(items[2]).toContain('Periodic leak check')
    expect(items[2]).not.toContain('Low stage')
    expect(wrapper.get('a').attributes('href')).toBe('/units/7/refrigerant-log')
  })

  it('says so when nothing is due', async () => {
    const wrapper = await mountSuspended(ComplianceDutyList, { props: { duties: [], empty: 'Nothing falls due in the next 30 days.' } })
    expect(wrapper.text()).toBe('Nothing falls due in the next 30 days.')
  })
})
